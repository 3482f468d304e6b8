/**
 * A project's screen (site plan or vehicle job) as the route shows it, with the project, the
 * catalogue and the signed-in person already in the query cache. Apart from render.tsx so the
 * tests that do not need the plan do not load it.
 */
import { ProjectWorkspace } from '@/components/plan/project-workspace';
import { catalogueKeys, useCatalogueQuery } from '@/hooks/use-catalogue';
import { projectKeys, useProjectQuery } from '@/hooks/use-projects';
import { sessionKeys } from '@/hooks/use-session';
import type { CatalogueItemDto, ProjectDto, UserDto } from '@/shared/schemas';
import { testUser } from './fixtures';
import { makeTestQueryClient, renderWithQuery } from './render';

function ProjectScreen({ id }: { id: number }) {
  return <ProjectWorkspace projectId={id} project={useProjectQuery(id)} catalogue={useCatalogueQuery()} />;
}

export function renderProjectScreen(project: ProjectDto, catalogue: CatalogueItemDto[], user: UserDto = testUser()) {
  const client = makeTestQueryClient();
  client.setQueryData(sessionKeys.me(), user);
  client.setQueryData(projectKeys.detail(project.id), project);
  client.setQueryData(catalogueKeys.list(), catalogue);
  return renderWithQuery(<ProjectScreen id={project.id} />, client);
}
