/** "Save as a job": a new site project with the quick scene, then the chosen mirror on it. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { quickPlacementBody, quickProjectName, quickScene, type QuickOption, type QuickQuestion } from '@/shared/quick';
import { api } from './api';
import { projectKeys } from './use-projects';

export function useQuickSaveMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ question, option }: { question: QuickQuestion; option: QuickOption }) => {
      const { project } = await api.projects.create({
        name: quickProjectName(question, new Date()),
        kind: 'site',
        notes: 'Started from quick sizing.',
        scene: quickScene(question),
      });
      await api.projects.addPlacement(
        project.id,
        quickPlacementBody(question, {
          catalogueItemId: option.item.id,
          heightM: option.heightM,
          azimuthRad: option.azimuthRad,
          tiltDownRad: option.tiltDownRad,
        }),
      );
      return project.id;
    },
    onSuccess: () => void qc.invalidateQueries({ queryKey: projectKeys.all }),
  });
}
