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

/** A 409 replaces the cached project with the server's current one, so the screen shows what is true. */
export function useUpdateProjectMutation(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PatchProjectBody) => api.projects.update(id, body),
    onSuccess: ({ project }) => {
      qc.setQueryData(projectKeys.detail(id), project);
      void qc.invalidateQueries({ queryKey: [...projectKeys.all, 'list'] });
    },
    onError: (err) => {
      if (err instanceof ApiError && err.status === 409 && err.current) qc.setQueryData(projectKeys.detail(id), err.current as ProjectDto);
    },
  });
}

export function useDeleteProjectMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.projects.remove(id),
    onSuccess: (_v, id) => {
      qc.removeQueries({ queryKey: projectKeys.detail(id) });
      void qc.invalidateQueries({ queryKey: [...projectKeys.all, 'list'] });
    },
  });
}

function replacePlacement(project: ProjectDto | undefined, placement: PlacementDto): ProjectDto | undefined {
  if (!project) return project;
  const exists = project.placements.some((p) => p.id === placement.id);
  return {
    ...project,
    placements: exists ? project.placements.map((p) => (p.id === placement.id ? placement : p)) : [...project.placements, placement],
  };
}

/**
 * Every write to a project's placements shares one mutation scope, so TanStack Query runs them one
 * after another in the order they were made; each update reads the version when it runs, which is
 * the version the write before it produced.
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
    onSuccess: ({ placement }) => {
      qc.setQueryData<ProjectDto>(projectKeys.detail(projectId), (old) => replacePlacement(old, placement));
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
    onSuccess: ({ placement }) => qc.setQueryData<ProjectDto>(projectKeys.detail(projectId), (old) => replacePlacement(old, placement)),
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
    onSuccess: (_v, placementId) => {
      qc.setQueryData<ProjectDto>(projectKeys.detail(projectId), (old) =>
        old ? { ...old, placements: old.placements.filter((p) => p.id !== placementId) } : old,
      );
      void qc.invalidateQueries({ queryKey: [...projectKeys.all, 'list'] });
    },
  });
}
