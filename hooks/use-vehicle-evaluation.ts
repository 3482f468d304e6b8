/**
 * A vehicle job's live evaluation for its screens: the plan's one evaluator (usePlanEvaluation,
 * which sends a scene with a vehicle through shared/project-optics evaluateVehicleJob) plus what
 * the drawing needs besides the scores: the vehicle's geometry and its fields under the job's
 * rules, so the fields are drawn even when the mirrors cannot be scored. Nothing here computes optics.
 */
import { useMemo } from 'react';
import { ruleSetOf, vehicleJobFields, type EvaluatedPlacement, type ProjectEvaluation } from '@/shared/project-optics';
import type { PlacementDto, Scene, Vehicle, CatalogueItemDto } from '@/shared/schemas';
import { vehicleGeometry, type RuleSetId, type VehicleField, type VehicleGeometry, type VehicleScore } from '@/shared/vehicle';
import { usePlanEvaluation } from './use-plan-evaluation';

export type VehiclePlacement = Pick<
  PlacementDto,
  'id' | 'label' | 'catalogueItemId' | 'customMirror' | 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad'
> &
  Partial<Pick<PlacementDto, 'mirrorClass' | 'servesFieldIds'>>;

export interface VehicleEvaluation {
  vehicle: Vehicle;
  ruleSet: RuleSetId;
  geometry: VehicleGeometry;
  fields: VehicleField[];
  /** The fields' shares, the test cylinders and the mounting sentences; null when they could not be scored. */
  score: Pick<VehicleScore, 'fields' | 'targets' | 'mounting'> | null;
  /** Why the fields could not be scored, as a sentence. */
  problem: string | null;
  /** Each mirror's numbers from the driver's eyes (or its sentence), by placement id. */
  mirrors: Map<number, EvaluatedPlacement>;
}

/** The screens' view of a vehicle job's evaluation; null for a scene without a vehicle. */
export function vehicleViewOf(scene: Scene, evaluation: ProjectEvaluation | null): VehicleEvaluation | null {
  const vehicle = scene.vehicle;
  const ruleSet = ruleSetOf(scene);
  if (!vehicle || !ruleSet) return null;
  const v = evaluation?.vehicle;
  return {
    vehicle,
    ruleSet,
    geometry: vehicleGeometry(vehicle),
    fields: vehicleJobFields(scene),
    score: v && !v.problem ? { fields: v.fields, targets: v.targets, mounting: v.mounting } : null,
    problem: v?.problem ?? null,
    mirrors: new Map((evaluation?.placements ?? []).map((p) => [p.placementId, p])),
  };
}

export function useVehicleEvaluation(
  scene: Scene,
  placements: readonly (VehiclePlacement & Pick<PlacementDto, 'viewerId'>)[],
  catalogue: readonly CatalogueItemDto[],
): VehicleEvaluation | null {
  const evaluation = usePlanEvaluation(scene, placements, catalogue);
  return useMemo(() => vehicleViewOf(scene, evaluation), [scene, evaluation]);
}
