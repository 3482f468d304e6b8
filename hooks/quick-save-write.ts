/**
 * "Save as a job"'s write, apart from the quick sizing code that works out its bodies
 * (use-quick-save.ts), so hooks/offline.ts can register it without pulling the engine into the
 * root layout's bundle.
 */
import type { QueryClient } from '@tanstack/react-query';
import type { CreatePlacementBody, CreateProjectBody } from '@/shared/schemas';
import { api } from './api';
import { projectKeys } from './use-projects';
import { ownerTag } from './write-owner';

export type QuickSaveVars = { project: CreateProjectBody; placement: CreatePlacementBody };

export const quickSaveKey = ['quick', 'save'] as const;

/** The save's function and cache update; also the client's default for the key (see hooks/offline.ts). */
export function quickSaveOptions(qc: QueryClient) {
  return {
    mutationKey: quickSaveKey,
    mutationFn: async ({ project: body, placement }: QuickSaveVars) => {
      const { project } = await api.projects.create(body);
      await api.projects.addPlacement(project.id, placement);
      return project.id;
    },
    onMutate: () => ownerTag(qc),
    onSuccess: () => void qc.invalidateQueries({ queryKey: projectKeys.all }),
  };
}
