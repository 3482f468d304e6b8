import { ProjectsEmpty } from '@/components/projects/projects-empty';
import { Screen } from '@/components/ui';
import { useSession } from '@/hooks/use-session';

export default function ProjectsScreen() {
  const { user } = useSession();
  return (
    <Screen title="Projects" lead="Sites and vehicles you are fitting with mirrors.">
      <ProjectsEmpty role={user?.role ?? 'installer'} />
    </Screen>
  );
}
