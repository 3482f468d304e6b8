/**
 * Left- and right-hand drive are mirror images across the vehicle's centreline (y → −y). The
 * vehicle model measures the driver and the body boxes toward the driver's side, so switching
 * `driverSide` mirrors them; the installer's own fields and targets are in plan and are
 * mirrored here. Negating a coordinate is exact in floating point.
 */
import type { Pose } from '../optics';
import type { Vehicle } from '../schemas/vehicle';

export function mirrorVehicleAcross(v: Vehicle): Vehicle {
  return {
    ...v,
    driverSide: v.driverSide === 'left' ? 'right' : 'left',
    bodyBoxes: v.bodyBoxes.map((b) => ({ ...b })),
    groundFields: v.groundFields.map((f) => ({ ...f, polygonM: f.polygonM.map(([x, y]) => [x, -y] as [number, number]) })),
    targets: v.targets.map((t) => ({ ...t, positionM: [t.positionM[0], -t.positionM[1]] as [number, number] })),
  };
}

/** A mirror's pose mirrored across the centreline. */
export function mirrorPoseAcross(p: Pose): Pose {
  return { vertexM: [p.vertexM[0], -p.vertexM[1], p.vertexM[2]], axis: [p.axis[0], -p.axis[1], p.axis[2]] };
}

/** A field as the remap needs it: its id and, for a library field, its code and side. */
type FieldIdentity = { id: string; code: string; side: 'left' | 'right' | null };

/**
 * A mirror's served field ids after the drive side switches. Library fields are named by the
 * plan's side (`un-v-left`: left = +y), so a mirrored vehicle's class V field is `un-v-right`:
 * each sided library field id in `fieldsBefore` (the vehicle's fields before the switch) becomes
 * its code on the other side. Unsided fields (class VI, the ISO ring) and the installer's own
 * fields (mirrored in place, same id) keep their ids; ids no field had are dropped, as scoring
 * would ignore them. Null (every field) stays null.
 */
export function remapServedFieldIds(ids: readonly string[] | null | undefined, fieldsBefore: readonly FieldIdentity[]): string[] | null {
  if (ids === null || ids === undefined) return null;
  const byId = new Map(fieldsBefore.map((f) => [f.id, f]));
  const out: string[] = [];
  for (const id of ids) {
    const f = byId.get(id);
    if (!f) continue;
    const next = f.side === null || f.code === 'user' ? f.id : `${f.code}-${f.side === 'left' ? 'right' : 'left'}`;
    if (!out.includes(next)) out.push(next);
  }
  return out;
}

/** A plan azimuth mirrored across the centreline (y → −y turns the angle θ into −θ). */
export const mirrorAzimuthAcross = (azimuthRad: number): number => (azimuthRad === 0 ? 0 : -azimuthRad);
