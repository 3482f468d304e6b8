import { Redirect, router } from 'expo-router';
import { ProjectForm } from '@/components/projects/project-form';
import { Screen } from '@/components/ui';
import { useCreateProjectMutation } from '@/hooks/use-projects';
import { useSession } from '@/hooks/use-session';

/** Only installers create projects (the server refuses others); anyone else is sent to the list. */
export default function NewProjectScreen() {
  const { user } = useSession();
  const create = useCreateProjectMutation();
  if (!user) return null;
  if (user.role !== 'installer') return <Redirect href="/projects" />;
  return (
    <Screen title="New project" lead="Name the job; you draw the plan and place mirrors next." width="narrow">
      <ProjectForm
        myUnits={user.units}
        onSubmit={async (body) => {
          const { project } = await create.mutateAsync(body);
          router.replace(`/projects/${project.id}`);
        }}
      />
    </Screen>
  );
}
