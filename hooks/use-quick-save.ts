/**
 * "Save as a job": a new site project with the quick scene, then the chosen mirror on it.
 *
 * The variables are the two request bodies, worked out when the person taps (the name carries
 * that time), so a save made with no signal waits on the device (hooks/offline.ts) and is sent
 * as it was when the connection returns, even after a reload.
 */
import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { quickPlacementBody, quickProjectName, quickScene, type QuickOption, type QuickQuestion } from '@/shared/quick';
import type { CreatePlacementBody, CreateProjectBody } from '@/shared/schemas';
import { api } from './api';
import { projectKeys } from './use-projects';

export type QuickSaveVars = { project: CreateProjectBody; placement: CreatePlacementBody };

export const quickSaveKey = ['quick', 'save'] as const;

/** The two bodies "Save as a job" sends for this answer, named at `when`. */
export function quickSaveVars(question: QuickQuestion, option: QuickOption, when: Date): QuickSaveVars {
  return {
    project: { name: quickProjectName(question, when), kind: 'site', notes: 'Started from quick sizing.', scene: quickScene(question) },
    placement: quickPlacementBody(question, {
      catalogueItemId: option.item.id,
      heightM: option.heightM,
      azimuthRad: option.azimuthRad,
      tiltDownRad: option.tiltDownRad,
    }),
  };
}

/** The save's function and cache update; also the client's default for the key (see hooks/offline.ts). */
export function quickSaveOptions(qc: QueryClient) {
  return {
    mutationKey: quickSaveKey,
    mutationFn: async ({ project: body, placement }: QuickSaveVars) => {
      const { project } = await api.projects.create(body);
      await api.projects.addPlacement(project.id, placement);
      return project.id;
    },
    onSuccess: () => void qc.invalidateQueries({ queryKey: projectKeys.all }),
  };
}

export function useQuickSaveMutation() {
  const qc = useQueryClient();
  return useMutation(quickSaveOptions(qc));
}
