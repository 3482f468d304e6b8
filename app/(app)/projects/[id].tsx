import { useLocalSearchParams } from 'expo-router';
import { ProjectWorkspace } from '@/components/plan/project-workspace';
import { useCatalogueQuery } from '@/hooks/use-catalogue';
import { useProjectQuery } from '@/hooks/use-projects';

/** One project: its live plan and details. */
export default function ProjectScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const projectId = Number(id);
  const project = useProjectQuery(Number.isInteger(projectId) && projectId > 0 ? projectId : undefined);
  const catalogue = useCatalogueQuery();
  return <ProjectWorkspace projectId={projectId} project={project} catalogue={catalogue} />;
}
