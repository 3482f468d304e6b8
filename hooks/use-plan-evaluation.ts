/**
 * The plan's live evaluation: one ProjectEvaluator (shared/project-optics) kept across renders,
 * so while a person drags one mirror only that mirror is recomputed.
 */
import { useEffect, useMemo, useState } from 'react';
import { ProjectEvaluator, type PlacementInput, type ProjectEvaluation } from '@/shared/project-optics';
import type { CatalogueItemDto, Scene } from '@/shared/schemas';

export type PlanPlacement = PlacementInput;
export type PlanEvaluation = ProjectEvaluation;

/** Evaluates the plan, reusing every unchanged placement's result between renders. */
export function usePlanEvaluation(
  scene: Scene | undefined,
  placements: readonly PlanPlacement[] | undefined,
  catalogue: readonly CatalogueItemDto[] | undefined,
  selectedPlacementId?: number | null,
): PlanEvaluation | null {
  // One evaluator for the component's life: it caches between renders (created once, never replaced).
  const [evaluator] = useState(() => new ProjectEvaluator());
  const evaluation = useMemo(() => {
    if (!scene || !placements || !catalogue) return null;
    return evaluator.evaluate({ scene, placements, catalogue });
  }, [evaluator, scene, placements, catalogue]);
  const index = selectedPlacementId == null || !placements ? -1 : placements.findIndex((p) => p.id === selectedPlacementId);
  // After the selection paints, get the selected mirror's drag ready.
  useEffect(() => {
    if (index < 0) return;
    const t = setTimeout(() => evaluator.prepareDrag(index), 0);
    return () => clearTimeout(t);
  }, [evaluator, index, evaluation]);
  return evaluation;
}
