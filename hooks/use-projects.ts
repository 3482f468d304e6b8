/** Projects and their placements. Edits carry the version; a 409 brings back the current record. */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { CreatePlacementBody, CreateProjectBody, PatchProjectBody, PlacementDto, ProjectDto } from '@/shared/schemas';
import { ApiError } from '@/shared/api-client';
import { api } from './api';
import { ownerTag } from './write-owner';

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

/** The keys the project writes are registered under (hooks/offline.ts gives each its defaults). */
export const projectMutationKeys = {
  updateProject: ['projects', 'update'] as const,
  addPlacement: ['placements', 'add'] as const,
  updatePlacement: ['placements', 'update'] as const,
  removePlacement: ['placements', 'remove'] as const,
};

export type UpdateProjectVars = { projectId: number; body: Omit<PatchProjectBody, 'version'> };
export type AddPlacementVars = { projectId: number; body: CreatePlacementBody };
export type UpdatePlacementVars = { projectId: number; placementId: number; edits: PlacementEdits };
export type RemovePlacementVars = { projectId: number; placementId: number };

/**
 * The project writes' functions and cache updates, without the scope. The hooks below use them,
 * and `registerOfflineWrites` (hooks/offline.ts) makes them the client's mutation defaults so a
 * write queued while offline runs after a reload too: its variables carry everything it needs.
 * Each `onMutate` answers who made the write (hooks/write-owner.ts): it is sent only for them.
 */
export function projectWriteOptions(qc: QueryClient) {
  const detail = (id: number) => projectKeys.detail(id);
  const refreshList = () => void qc.invalidateQueries({ queryKey: [...projectKeys.all, 'list'] });
  return {
    /**
     * A 409 replaces the cached project with the server's current one, so the screen shows what is
     * true. It runs in the project's write scope, after the mirror writes queued before it, and
     * reads the project's version when it runs (a mirror write before it raised it). The change is
     * shown in the cache at once (kept on the device while it waits for a connection).
     */
    updateProject: {
      mutationKey: projectMutationKeys.updateProject,
      mutationFn: ({ projectId, body }: UpdateProjectVars) => {
        const version = qc.getQueryData<ProjectDto>(detail(projectId))?.version;
        if (version === undefined) throw new Error('This project is not loaded; open it again.');
        return api.projects.update(projectId, { ...body, version });
      },
      onMutate: ({ projectId, body }: UpdateProjectVars) => {
        qc.setQueryData<ProjectDto>(detail(projectId), (old) => (old ? ({ ...old, ...body } as ProjectDto) : old));
        return ownerTag(qc);
      },
      onSuccess: ({ project }: { project: ProjectDto }) => {
        qc.setQueryData(detail(project.id), project);
        refreshList();
      },
      onError: (err: Error, { projectId }: UpdateProjectVars) => {
        if (err instanceof ApiError && err.status === 409 && err.current) qc.setQueryData(detail(projectId), err.current as ProjectDto);
        else void qc.invalidateQueries({ queryKey: detail(projectId) });
      },
    },
    addPlacement: {
      mutationKey: projectMutationKeys.addPlacement,
      mutationFn: ({ projectId, body }: AddPlacementVars) => api.projects.addPlacement(projectId, body),
      onMutate: () => ownerTag(qc),
      onSuccess: ({ placement, projectVersion }: { placement: PlacementDto; projectVersion: number }, { projectId }: AddPlacementVars) => {
        qc.setQueryData<ProjectDto>(detail(projectId), (old) => replacePlacement(old, placement, projectVersion));
        refreshList();
      },
    },
    /** Reads the mirror's version when it runs; the edits show in the cache at once (see updateProject). */
    updatePlacement: {
      mutationKey: projectMutationKeys.updatePlacement,
      mutationFn: ({ projectId, placementId, edits }: UpdatePlacementVars) => {
        const version = qc.getQueryData<ProjectDto>(detail(projectId))?.placements.find((p) => p.id === placementId)?.version;
        if (version === undefined) throw new Error('This mirror is no longer in the project; it may have been removed.');
        return api.projects.updatePlacement(projectId, placementId, { ...edits, version });
      },
      onMutate: ({ projectId, placementId, edits }: UpdatePlacementVars) => {
        qc.setQueryData<ProjectDto>(detail(projectId), (old) =>
          old ? { ...old, placements: old.placements.map((p) => (p.id === placementId ? { ...p, ...edits } : p)) } : old,
        );
        return ownerTag(qc);
      },
      onSuccess: ({ placement, projectVersion }: { placement: PlacementDto; projectVersion: number }, { projectId }: UpdatePlacementVars) =>
        qc.setQueryData<ProjectDto>(detail(projectId), (old) => replacePlacement(old, placement, projectVersion)),
      onError: (err: Error, vars: UpdatePlacementVars) => {
        if (err instanceof ApiError && err.status === 409 && err.current) {
          qc.setQueryData<ProjectDto>(detail(vars.projectId), (old) => replacePlacement(old, err.current as PlacementDto));
          recordConflict(qc, vars, err);
        } else void qc.invalidateQueries({ queryKey: detail(vars.projectId) });
      },
    },
    removePlacement: {
      mutationKey: projectMutationKeys.removePlacement,
      mutationFn: ({ projectId, placementId }: RemovePlacementVars) => api.projects.removePlacement(projectId, placementId),
      onMutate: () => ownerTag(qc),
      onSuccess: ({ projectVersion }: { projectVersion: number }, { projectId, placementId }: RemovePlacementVars) => {
        qc.setQueryData<ProjectDto>(detail(projectId), (old) =>
          old ? { ...old, version: projectVersion, placements: old.placements.filter((p) => p.id !== placementId) } : old,
        );
        refreshList();
      },
    },
  };
}

export function useUpdateProjectMutation(id: number) {
  const qc = useQueryClient();
  return useMutation({ ...projectWriteOptions(qc).updateProject, scope: placementScope(id) });
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

/**
 * A mirror's refused change (409), kept in the cache (and so on the device) until the person
 * chooses: the editor may not be open when a change queued offline is sent, or the page may
 * have been reloaded since. `usePlacementWrites` takes these up when the job opens.
 */
export interface StoredConflict {
  placementId: number;
  message: string;
  mine: PlacementEdits;
  theirs: PlacementDto;
}

export const conflictKeys = {
  project: (projectId: number) => ['offline', 'conflicts', projectId] as const,
};

function recordConflict(qc: QueryClient, { projectId, placementId, edits }: UpdatePlacementVars, err: ApiError) {
  qc.setQueryData<StoredConflict[]>(conflictKeys.project(projectId), (old = []) => {
    const earlier = old.find((c) => c.placementId === placementId);
    const mine = { ...earlier?.mine, ...edits };
    return [
      ...old.filter((c) => c.placementId !== placementId),
      { placementId, message: err.message, mine, theirs: err.current as PlacementDto },
    ];
  });
}

/** Forgets a mirror's stored conflict once the person has chosen. */
export function forgetConflict(qc: QueryClient, projectId: number, placementId: number) {
  const key = conflictKeys.project(projectId);
  const old = qc.getQueryData<StoredConflict[]>(key);
  if (old?.some((c) => c.placementId === placementId))
    qc.setQueryData<StoredConflict[]>(
      key,
      old.filter((c) => c.placementId !== placementId),
    );
}

export function useAddPlacementMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({ ...projectWriteOptions(qc).addPlacement, scope: placementScope(projectId) });
}

export function useUpdatePlacementMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({ ...projectWriteOptions(qc).updatePlacement, scope: placementScope(projectId) });
}

export function useRemovePlacementMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({ ...projectWriteOptions(qc).removePlacement, scope: placementScope(projectId) });
}
