/**
 * A vehicle job's live evaluation on the phone: the fields' shares, gaps and verdicts, the test
 * cylinders and mounting sentences (shared/vehicle scoreVehicle, through the engine), and each
 * mirror's numbers as seen from the driver's eyes (the site's evaluatePlacement with the driver
 * as its viewer and the body as walls). Nothing here computes optics.
 */
import { useMemo } from 'react';
import {
  criteriaOf,
  evaluatePlacement,
  mirrorOfPlacement,
  ruleSetOf,
  vehicleJobFields,
  type EvaluatedPlacement,
} from '@/shared/project-optics';
import { poseFromAim, OpticsInputError } from '@/shared/optics';
import type { CatalogueItemDto, PlacementDto, Scene } from '@/shared/schemas';
import type { Vehicle } from '@/shared/schemas/vehicle';
import {
  scoreVehicle,
  vehicleGeometry,
  type RuleSetId,
  type VehicleField,
  type VehicleGeometry,
  type VehicleMirror,
  type VehicleScore,
} from '@/shared/vehicle';

export type VehiclePlacement = Pick<
  PlacementDto,
  | 'id'
  | 'label'
  | 'catalogueItemId'
  | 'customMirror'
  | 'positionM'
  | 'heightM'
  | 'azimuthRad'
  | 'tiltDownRad'
  | 'mirrorClass'
  | 'servesFieldIds'
>;

export interface VehicleEvaluation {
  vehicle: Vehicle;
  ruleSet: RuleSetId;
  geometry: VehicleGeometry;
  fields: VehicleField[];
  /** Null when the mirrors could not be scored (`problem` says why). */
  score: VehicleScore | null;
  problem: string | null;
  /** Each mirror's numbers from the driver's eye midpoint, by placement id. */
  mirrors: Map<number, EvaluatedPlacement>;
}

const DRIVER_ID = 'driver';

/** Null for a scene without a vehicle (a site). */
export function evaluateVehicleJob(
  scene: Scene,
  placements: readonly VehiclePlacement[],
  catalogue: readonly CatalogueItemDto[],
): VehicleEvaluation | null {
  const vehicle = scene.vehicle;
  const ruleSet = ruleSetOf(scene);
  if (!vehicle || !ruleSet) return null;
  const geometry = vehicleGeometry(vehicle);
  const fields = vehicleJobFields(scene);
  const criteria = criteriaOf(scene);
  const eye = geometry.eyeMidM;
  const driverScene: Scene = {
    walls: [],
    zones: [],
    viewers: [{ id: DRIVER_ID, name: 'Driver', positionM: [eye[0], eye[1]], eyeHeightM: eye[2] }],
  };
  const mirrors = new Map<number, EvaluatedPlacement>();
  const fitted: VehicleMirror[] = [];
  for (const p of placements) {
    const ev = evaluatePlacement({
      placement: { ...p, viewerId: DRIVER_ID },
      scene: driverScene,
      catalogue,
      walls: geometry.walls,
      criteria,
    });
    mirrors.set(p.id, ev);
    const mirror = mirrorOfPlacement(p, catalogue);
    if (!mirror) continue;
    const pose = poseFromAim({
      vertexM: [p.positionM[0], p.positionM[1], p.heightM],
      azimuthRad: p.azimuthRad,
      tiltDownRad: p.tiltDownRad,
    });
    fitted.push({ id: String(p.id), label: p.label, mirror, pose, mirrorClass: p.mirrorClass ?? null });
  }
  const mirrorsForField: Record<string, string[]> = {};
  for (const f of fields) {
    const serving = placements.filter((p) => p.servesFieldIds == null || p.servesFieldIds.includes(f.id)).map((p) => String(p.id));
    if (serving.length !== placements.length) mirrorsForField[f.id] = serving.filter((id) => fitted.some((m) => m.id === id));
  }
  try {
    const score = scoreVehicle({ vehicle, mirrors: fitted, fields, mirrorsForField });
    return { vehicle, ruleSet, geometry, fields, score, problem: null, mirrors };
  } catch (e) {
    const problem = e instanceof OpticsInputError ? e.message : 'The mirrors could not be scored; check their positions and aims.';
    return { vehicle, ruleSet, geometry, fields, score: null, problem, mirrors };
  }
}

/** Recomputed when the scene, the placements (with a live drag) or the catalogue change. */
export function useVehicleEvaluation(
  scene: Scene,
  placements: readonly VehiclePlacement[],
  catalogue: readonly CatalogueItemDto[],
): VehicleEvaluation | null {
  return useMemo(() => evaluateVehicleJob(scene, placements, catalogue), [scene, placements, catalogue]);
}
