/**
 * A vehicle job through the vehicle scoring (shared/vehicle/score.ts): the project's placements
 * become the vehicle's mirrors, their `servesFieldIds` the fields each counts toward. Nothing
 * here reflects a ray; every number comes from scoreVehicle and the engine behind it.
 */
import { boxAt, defaultRuleSet, vehicleFields, vehicleGeometry, type RuleSetId, type VehicleField } from '../vehicle';
import type { Scene } from '../schemas';

/** The rules a vehicle job is scored by: the scene's choice, else the vehicle kind's default. */
export function ruleSetOf(scene: Scene): RuleSetId | null {
  if (!scene.vehicle) return null;
  return scene.ruleSet ?? defaultRuleSet(scene.vehicle.kind);
}

/** The ground fields of a vehicle job under its rules, the installer's own last; [] for a site. */
export function vehicleJobFields(scene: Scene): VehicleField[] {
  const rs = ruleSetOf(scene);
  return scene.vehicle && rs ? vehicleFields(scene.vehicle, rs) : [];
}

/**
 * Why a mirror cannot be placed so on this vehicle (inside a body part, or serving a field the
 * vehicle does not have), as a field and a sentence; null when it can.
 */
export function vehicleMirrorProblem(
  scene: Scene,
  p: { label: string; positionM: [number, number]; heightM: number; servesFieldIds: readonly string[] | null },
): { field: 'positionM' | 'servesFieldIds'; message: string } | null {
  if (!scene.vehicle) return null;
  const g = vehicleGeometry(scene.vehicle);
  const box = boxAt(g, [p.positionM[0], p.positionM[1], p.heightM]);
  if (box) return { field: 'positionM', message: `Mirror ${p.label} sits inside “${box.name}”; place it on the outside of the body.` };
  if (p.servesFieldIds) {
    const ids = new Set(vehicleJobFields(scene).map((f) => f.id));
    const unknown = p.servesFieldIds.find((id) => !ids.has(id));
    if (unknown !== undefined)
      return { field: 'servesFieldIds', message: `This vehicle has no field “${unknown}” under its rules; choose among its fields.` };
  }
  return null;
}
