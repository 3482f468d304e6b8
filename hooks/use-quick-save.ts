/**
 * "Save as a job": a new site project with the quick scene, then the chosen mirror on it.
 *
 * The variables are the two request bodies, worked out when the person taps (the name carries
 * that time), so a save made with no signal waits on the device (hooks/offline.ts) and is sent
 * as it was when the connection returns, even after a reload.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { quickPlacementBody, quickProjectName, quickScene, type QuickOption, type QuickQuestion } from '@/shared/quick';
import { quickSaveOptions, type QuickSaveVars } from './quick-save-write';

export { quickSaveKey, type QuickSaveVars } from './quick-save-write';

/** The two bodies "Save as a job" sends for this answer, named at `when`. */
export function quickSaveVars(question: QuickQuestion, option: QuickOption, when: Date): QuickSaveVars {
  return {
    project: { name: quickProjectName(question, when), kind: 'site', notes: 'Started from quick sizing.', scene: quickScene(question) },
    placement: quickPlacementBody({
      catalogueItemId: option.item.id,
      positionM: option.positionM,
      heightM: option.heightM,
      azimuthRad: option.azimuthRad,
      tiltDownRad: option.tiltDownRad,
    }),
  };
}

export function useQuickSaveMutation() {
  const qc = useQueryClient();
  return useMutation(quickSaveOptions(qc));
}
