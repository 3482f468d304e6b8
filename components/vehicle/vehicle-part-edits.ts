/**
 * Every change the installer makes to a vehicle's own parts on the vehicle screen, pure: body
 * boxes, own ground fields, test cylinders and the drive side. Each returns a new vehicle; the
 * screen checks it with the vehicle schema (`vehicleProblems`) before saving it into the scene.
 */
import type { Pair } from '@/shared/geometry/polygon';
import { vehicle as vehicleSchema, type BodyBox, type PointTarget, type UserGroundField, type Vehicle } from '@/shared/schemas/vehicle';
import { VEHICLE_LIMITS } from '@/shared/schemas/limits';
import { mirrorAzimuthAcross, mirrorVehicleAcross, remapServedFieldIds, vehicleFields, type RuleSetId } from '@/shared/vehicle';
import type { VehiclePlacement } from '@/hooks/use-vehicle-evaluation';

const ARCMIN = Math.PI / 10800;
const mm = (m: number) => Math.round(m * 1000) / 1000;

/** The first free id `${prefix}-n` among the vehicle's boxes, fields and cylinders (the schema wants them unique). */
export function freeId(v: Vehicle, prefix: string): string {
  const used = new Set([...v.bodyBoxes, ...v.groundFields, ...v.targets].map((x) => x.id));
  for (let n = 1; ; n++) if (!used.has(`${prefix}-${n}`)) return `${prefix}-${n}`;
}

/** Sentences by path ("bodyBoxes.1.heightM") for a vehicle the schema refuses; empty when it is fine. */
export function vehicleProblems(v: Vehicle): Map<string, string> {
  const r = vehicleSchema.safeParse(v);
  const out = new Map<string, string>();
  if (r.success) return out;
  for (const issue of r.error.issues) {
    const key = issue.path.join('.');
    if (!out.has(key)) out.set(key, issue.message);
  }
  return out;
}

export function updateBodyBox(v: Vehicle, id: string, patch: Partial<BodyBox>): Vehicle {
  return { ...v, bodyBoxes: v.bodyBoxes.map((b) => (b.id === id ? { ...b, ...patch } : b)) };
}

/** A new box behind the last one (or at the front), a metre long, the cab's width and 2 m tall. */
export function addBodyBox(v: Vehicle): Vehicle {
  if (v.bodyBoxes.length >= VEHICLE_LIMITS.bodyBoxes) return v;
  const rear = Math.max(0, ...v.bodyBoxes.map((b) => b.rearBehindM));
  const front = rear + 1 <= v.lengthM ? rear : Math.max(0, v.lengthM - 1);
  const box: BodyBox = {
    id: freeId(v, 'box'),
    name: `Part ${v.bodyBoxes.length + 1}`,
    frontBehindM: mm(front),
    rearBehindM: mm(Math.min(v.lengthM, front + 1)),
    widthM: mm(v.cabWidthM),
    offsetM: 0,
    heightM: 2,
    windowLineM: null,
  };
  return { ...v, bodyBoxes: [...v.bodyBoxes, box] };
}

export const removeBodyBox = (v: Vehicle, id: string): Vehicle => ({ ...v, bodyBoxes: v.bodyBoxes.filter((b) => b.id !== id) });

export function updateGroundField(v: Vehicle, id: string, patch: Partial<UserGroundField>): Vehicle {
  return { ...v, groundFields: v.groundFields.map((f) => (f.id === id ? { ...f, ...patch } : f)) };
}

/** A new own field: a 2 m square on the ground just ahead of the front bumper, in the middle. */
export function addGroundField(v: Vehicle): Vehicle {
  if (v.groundFields.length >= VEHICLE_LIMITS.groundFields) return v;
  const f: UserGroundField = {
    id: freeId(v, 'field'),
    name: `Own field ${v.groundFields.length + 1}`,
    polygonM: [
      [0.2, -1],
      [2.2, -1],
      [2.2, 1],
      [0.2, 1],
    ],
    requiredShare: 0.9,
    eyes: 'both',
  };
  return { ...v, groundFields: [...v.groundFields, f] };
}

export const removeGroundField = (v: Vehicle, id: string): Vehicle => ({
  ...v,
  groundFields: v.groundFields.filter((f) => f.id !== id),
});

/** A field's corner moved to a plan point (metres, rounded to the millimetre). */
export function moveFieldCorner(v: Vehicle, id: string, index: number, toM: Pair): Vehicle {
  return updateGroundField(v, id, {
    polygonM: (v.groundFields.find((f) => f.id === id)?.polygonM ?? []).map((p, i) =>
      i === index ? ([mm(toM[0]), mm(toM[1])] as [number, number]) : p,
    ),
  });
}

/** A field with a corner added halfway along the edge after corner `index`. */
export function addFieldCorner(v: Vehicle, id: string, index: number): Vehicle {
  const f = v.groundFields.find((g) => g.id === id);
  if (!f || f.polygonM.length >= VEHICLE_LIMITS.cornersPerField) return v;
  const a = f.polygonM[index];
  const b = f.polygonM[(index + 1) % f.polygonM.length];
  const mid: [number, number] = [mm((a[0] + b[0]) / 2), mm((a[1] + b[1]) / 2)];
  return updateGroundField(v, id, { polygonM: [...f.polygonM.slice(0, index + 1), mid, ...f.polygonM.slice(index + 1)] });
}

/** A field without corner `index` (never fewer than three). */
export function removeFieldCorner(v: Vehicle, id: string, index: number): Vehicle {
  const f = v.groundFields.find((g) => g.id === id);
  if (!f || f.polygonM.length <= 3) return v;
  return updateGroundField(v, id, { polygonM: f.polygonM.filter((_, i) => i !== index) });
}

export function updateTarget(v: Vehicle, id: string, patch: Partial<PointTarget>): Vehicle {
  return { ...v, targets: v.targets.map((t) => (t.id === id ? { ...t, ...patch } : t)) };
}

/**
 * A new test cylinder 1 m ahead of the front bumper on the centreline: 0.3 m across and 0.3 m
 * tall, its image to lie 3′ inside the mirror's edge (the school-bus figures, docs/vehicle-sources.md).
 */
export function addTarget(v: Vehicle): Vehicle {
  if (v.targets.length >= VEHICLE_LIMITS.targets) return v;
  const t: PointTarget = {
    id: freeId(v, 'cyl'),
    name: `Cylinder ${v.targets.length + 1}`,
    positionM: [1, 0],
    diameterM: 0.3,
    heightM: 0.3,
    insideEdgeRad: 3 * ARCMIN,
    minShortRad: null,
    minLongRad: null,
    eyes: 'one',
  };
  return { ...v, targets: [...v.targets, t] };
}

export const removeTarget = (v: Vehicle, id: string): Vehicle => ({ ...v, targets: v.targets.filter((t) => t.id !== id) });

export const moveTarget = (v: Vehicle, id: string, toM: Pair): Vehicle => updateTarget(v, id, { positionM: [mm(toM[0]), mm(toM[1])] });

/**
 * The drive side switched: the vehicle mirrored across its centreline and, for each mirror, the
 * patch that mirrors it too (position, aim) and renames the fields it serves to their mirror images.
 */
export function switchDriveSide(
  v: Vehicle,
  ruleSet: RuleSetId,
  placements: readonly VehiclePlacement[],
): { vehicle: Vehicle; patches: { id: number; patch: Pick<VehiclePlacement, 'positionM' | 'azimuthRad' | 'servesFieldIds'> }[] } {
  const before = vehicleFields(v, ruleSet);
  return {
    vehicle: mirrorVehicleAcross(v),
    patches: placements.map((p) => ({
      id: p.id,
      patch: {
        positionM: [p.positionM[0], p.positionM[1] === 0 ? 0 : -p.positionM[1]],
        azimuthRad: mirrorAzimuthAcross(p.azimuthRad),
        servesFieldIds: remapServedFieldIds(p.servesFieldIds, before),
      },
    })),
  };
}
