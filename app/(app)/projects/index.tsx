import { router } from 'expo-router';
import { ProjectsList } from '@/components/projects/projects-list';
import { Button, Screen } from '@/components/ui';
import { useSession } from '@/hooks/use-session';

export default function ProjectsScreen() {
  const { user } = useSession();
  if (!user) return null;
  const installer = user.role === 'installer';
  return (
    <Screen
      title="Projects"
      lead={installer ? 'Sites and vehicles you are fitting with mirrors.' : "Your organisation's sites and vehicles, to read and review."}
      footer={
        installer ? <Button label="New project" testID="projects-new" onPress={() => router.push('/projects/new')} block /> : undefined
      }
    >
      <ProjectsList role={user.role} />
    </Screen>
  );
}
