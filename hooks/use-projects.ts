/** Projects and their placements. Edits carry the version; a 409 brings back the current record. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreatePlacementBody, CreateProjectBody, PatchProjectBody, PlacementDto, ProjectDto } from '@/shared/schemas';
import { ApiError } from '@/shared/api-client';
import { api } from './api';

/** Only the owner edits a project, so the list can be a little stale; the open project refetches on focus. */
export const PROJECTS_STALE_MS = 30_000;
export const PROJECT_STALE_MS = 10_000;

export type ProjectListParams = { q?: string; sort?: 'updated' | 'name' | 'customer' };

export const projectKeys = {
  all: ['projects'] as const,
  list: (params: ProjectListParams = {}) => [...projectKeys.all, 'list', params] as const,
  detail: (id: number) => [...projectKeys.all, 'detail', id] as const,
};

export function useProjectsQuery(params: ProjectListParams = {}) {
  return useQuery({
    queryKey: projectKeys.list(params),
    queryFn: async () => (await api.projects.list(params)).projects,
    staleTime: PROJECTS_STALE_MS,
  });
}

export function useProjectQuery(id: number | undefined) {
  return useQuery({
    queryKey: projectKeys.detail(id ?? -1),
    queryFn: async () => (await api.projects.get(id!)).project,
    enabled: id !== undefined && Number.isInteger(id) && id > 0,
    staleTime: PROJECT_STALE_MS,
  });
}

export function useCreateProjectMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateProjectBody) => api.projects.create(body),
    onSuccess: ({ project }) => {
      qc.setQueryData(projectKeys.detail(project.id), project);
      void qc.invalidateQueries({ queryKey: [...projectKeys.all, 'list'] });
    },
  });
}

/**
 * A 409 replaces the cached project with the server's current one, so the screen shows what is true.
 * It runs in the project's write scope, after the mirror writes queued before it, and reads the
 * project's version when it runs (a mirror write before it raised it).
 */
export function useUpdateProjectMutation(id: number) {
  const qc = useQueryClient();
  return useMutation({
    scope: placementScope(id),
    mutationFn: (body: Omit<PatchProjectBody, 'version'>) => {
      const version = qc.getQueryData<ProjectDto>(projectKeys.detail(id))?.version;
      if (version === undefined) throw new Error('This project is not loaded; open it again.');
      return api.projects.update(id, { ...body, version });
    },
    onSuccess: ({ project }) => {
      qc.setQueryData(projectKeys.detail(id), project);
      void qc.invalidateQueries({ queryKey: [...projectKeys.all, 'list'] });
    },
    onError: (err) => {
      if (err instanceof ApiError && err.status === 409 && err.current) qc.setQueryData(projectKeys.detail(id), err.current as ProjectDto);
    },
  });
}

/** The cached project with a placement saved and the project's version the server answered with. */
function replacePlacement(project: ProjectDto | undefined, placement: PlacementDto, projectVersion?: number): ProjectDto | undefined {
  if (!project) return project;
  const exists = project.placements.some((p) => p.id === placement.id);
  return {
    ...project,
    version: projectVersion ?? project.version,
    placements: exists ? project.placements.map((p) => (p.id === placement.id ? placement : p)) : [...project.placements, placement],
  };
}

/**
 * Every write to a project (its plan and its placements) shares one mutation scope, so TanStack
 * Query runs them one after another in the order they were made; each reads the version when it
 * runs, which is the version the write before it produced (a mirror write raises the project's).
 */
export const placementScope = (projectId: number) => ({ id: `project-${projectId}-placements` });

/** The fields of a placement a person edits; a save sends only those that changed. */
export type EditableFields = Pick<
  PlacementDto,
  | 'label'
  | 'catalogueItemId'
  | 'customMirror'
  | 'positionM'
  | 'heightM'
  | 'azimuthRad'
  | 'tiltDownRad'
  | 'viewerId'
  | 'notes'
  | 'mirrorClass'
  | 'servesFieldIds'
>;
export type PlacementEdits = Partial<EditableFields>;

export function useAddPlacementMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    scope: placementScope(projectId),
    mutationFn: (body: CreatePlacementBody) => api.projects.addPlacement(projectId, body),
    onSuccess: ({ placement, projectVersion }) => {
      qc.setQueryData<ProjectDto>(projectKeys.detail(projectId), (old) => replacePlacement(old, placement, projectVersion));
      void qc.invalidateQueries({ queryKey: [...projectKeys.all, 'list'] });
    },
  });
}

export function useUpdatePlacementMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    scope: placementScope(projectId),
    mutationFn: ({ placementId, edits }: { placementId: number; edits: PlacementEdits }) => {
      const version = qc.getQueryData<ProjectDto>(projectKeys.detail(projectId))?.placements.find((p) => p.id === placementId)?.version;
      if (version === undefined) throw new Error('This mirror is no longer in the project; it may have been removed.');
      return api.projects.updatePlacement(projectId, placementId, { ...edits, version });
    },
    onSuccess: ({ placement, projectVersion }) =>
      qc.setQueryData<ProjectDto>(projectKeys.detail(projectId), (old) => replacePlacement(old, placement, projectVersion)),
    onError: (err) => {
      if (err instanceof ApiError && err.status === 409 && err.current) {
        qc.setQueryData<ProjectDto>(projectKeys.detail(projectId), (old) => replacePlacement(old, err.current as PlacementDto));
      }
    },
  });
}

export function useRemovePlacementMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    scope: placementScope(projectId),
    mutationFn: (placementId: number) => api.projects.removePlacement(projectId, placementId),
    onSuccess: ({ projectVersion }, placementId) => {
      qc.setQueryData<ProjectDto>(projectKeys.detail(projectId), (old) =>
        old ? { ...old, version: projectVersion, placements: old.placements.filter((p) => p.id !== placementId) } : old,
      );
      void qc.invalidateQueries({ queryKey: [...projectKeys.all, 'list'] });
    },
  });
}
