/**
 * The plan's live evaluation: one ProjectEvaluator (shared/project-optics) kept across renders,
 * so while a person drags one mirror only that mirror is recomputed.
 */
import { useEffect, useMemo, useRef } from 'react';
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
  const evaluator = useRef<ProjectEvaluator | null>(null);
  if (!evaluator.current) evaluator.current = new ProjectEvaluator();
  const evaluation = useMemo(() => {
    if (!scene || !placements || !catalogue) return null;
    return evaluator.current!.evaluate({ scene, placements, catalogue });
  }, [scene, placements, catalogue]);
  const index = selectedPlacementId == null || !placements ? -1 : placements.findIndex((p) => p.id === selectedPlacementId);
  // After the selection paints, get the selected mirror's drag ready.
  useEffect(() => {
    if (index < 0) return;
    const t = setTimeout(() => evaluator.current?.prepareDrag(index), 0);
    return () => clearTimeout(t);
  }, [index, evaluation]);
  return evaluation;
}
