/**
 * The project screen: says why when the project cannot be shown, else the Workspace (workspace.tsx:
 * the live plan and its details; phone: the plan fills the screen, tools at the bottom, details in
 * the bottom drawer; wide: plan left, details panel right).
 */
import type { UseQueryResult } from '@tanstack/react-query';
import { Button, CenteredMessage, TextLink } from '@/components/ui';
import { ApiError } from '@/shared/api-client';
import { describeError } from '@/shared/errors';
import type { CatalogueItemDto, ProjectDto } from '@/shared/schemas';
import { VehicleWorkspace } from '@/components/vehicle/vehicle-workspace';
import { Workspace } from './workspace';

export interface ProjectWorkspaceProps {
  projectId: number;
  project: UseQueryResult<ProjectDto>;
  catalogue: UseQueryResult<CatalogueItemDto[]>;
}

export function ProjectWorkspace({ projectId, project, catalogue }: ProjectWorkspaceProps) {
  if (!Number.isInteger(projectId) || projectId <= 0) {
    return (
      <CenteredMessage
        title="No such project"
        body="The address does not name a project."
        titleTestID="project-title"
        action={<TextLink href="/projects" label="Back to projects" testID="project-back" />}
      />
    );
  }
  const failed = project.error ?? catalogue.error;
  if (failed) {
    const notFound = failed instanceof ApiError && (failed.status === 404 || failed.status === 403);
    return (
      <CenteredMessage
        title={notFound ? 'This project is not available' : 'The project could not be loaded'}
        body={describeError(failed)}
        testID="project-error"
        action={
          notFound ? (
            <TextLink href="/projects" label="Back to projects" testID="project-back" />
          ) : (
            <Button label="Try again" testID="project-retry" onPress={() => void Promise.all([project.refetch(), catalogue.refetch()])} />
          )
        }
      />
    );
  }
  const waiting = (q: UseQueryResult<unknown>) => !q.data && q.fetchStatus === 'paused';
  if (waiting(project) || waiting(catalogue)) {
    return (
      <CenteredMessage
        title="Not kept on this device"
        body="This job was not opened here recently, so there is no copy to show offline. It opens as soon as there is a connection; your recent jobs open here with no signal."
        testID="project-offline"
        action={<TextLink href="/projects" label="Back to projects" testID="project-back" />}
      />
    );
  }
  if (!project.data || !catalogue.data) return <CenteredMessage loading title="Opening the plan…" testID="project-loading" />;
  if (project.data.kind === 'vehicle') return <VehicleWorkspace key={project.data.id} project={project.data} catalogue={catalogue.data} />;
  return <Workspace key={project.data.id} project={project.data} catalogue={catalogue.data} />;
}
