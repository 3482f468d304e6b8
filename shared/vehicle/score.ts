/**
 * Scores a vehicle's mirrors against its ground fields and test cylinders, entirely through the
 * optics engine's public index (coverage, zoneCoverage, visibleInMirror, apparentAngle,
 * fanRays): nothing here reflects a ray itself.
 *
 * For each mirror and each eye point a field asks for, the engine traces the mirror's ground
 * footprint with the body boxes as walls on both legs (eye → mirror and mirror → ground). A
 * field's share is the area of the field inside the union of those footprints over the mirrors
 * chosen for it and the eyes it counts, over the field's area; its verdict is pass when that
 * share reaches the rule's pass mark.
 */
import { robustDifference, robustIntersection, robustUnion } from '../geometry/robust-boolean';
import { bbox, multiPolygonArea, polygonArea, type MultiPolygon } from '../geometry/polygon';
import type { Vec3 } from '../geometry/vec3';
import { coverage, OpticsInputError, zoneCoverage, type Mirror, type Pose } from '../optics';
import type { Vehicle } from '../schemas/vehicle';
import { defaultRuleSet, vehicleFields, type FieldOptions, type RuleSetId, type VehicleField } from './fields';
import { boxAt, vehicleGeometry, type VehicleGeometry } from './geometry';
import { fieldCriteria, type FieldCriteria } from './criteria';
import { mountingNotes, type MirrorClass, type MountingNote } from './mounting';
import { targetView, type TargetView } from './targets';

export type VehicleMirror = {
  id: string;
  label?: string;
  mirror: Mirror;
  pose: Pose;
  /** The class the installer fits it as, for the mounting checks (optional). */
  mirrorClass?: MirrorClass | null;
};

export type ScoreInput = {
  vehicle: Vehicle;
  mirrors: readonly VehicleMirror[];
  /** Default: the vehicle kind's rule set's fields and the installer's own. */
  fields?: readonly VehicleField[];
  ruleSet?: RuleSetId;
  fieldOptions?: FieldOptions;
  /** Mirror ids chosen per field id; a field not listed uses every mirror. */
  mirrorsForField?: Readonly<Record<string, readonly string[]>>;
  /** How finely footprints are traced (default {@link VEHICLE_ACCURACY}). */
  accuracy?: Partial<TraceAccuracy>;
  /** Person-sized criteria for the test cylinders, radians (the project's detect / recognise angles). */
  detectAngleRad?: number;
  recogniseAngleRad?: number;
  /**
   * With both angles given: each field also reports where a person of this height (metres) would
   * be detected and recognised (a sampled estimate, see criteria.ts).
   */
  fieldTargetHeightM?: number;
  /** Grid points per field for that estimate (default 100). */
  criteriaSamples?: number;
};

export type TraceAccuracy = { rimSamples: number; wallToleranceM: number; simplifyM: number };

/**
 * Tracing accuracy for vehicle fields, coarser than the engine's defaults for a site plan
 * because ground fields are metres across: 128 rays around each mirror, body shadows within
 * 50 mm of their traced curve, outlines simplified within 5 mm. On the demo truck every field's
 * share moved by under 0.02 percentage points between 5 mm and 50 mm shadow tolerance, while
 * the time of a shadow cast by a door right beside a mirror fell from about 30 ms to about 1 ms
 * (measured on this machine under load). The tests hold shares to the exact point test.
 */
export const VEHICLE_ACCURACY: TraceAccuracy = { rimSamples: 128, wallToleranceM: 0.05, simplifyM: 0.005 };

export type Verdict = 'pass' | 'short' | 'no-verdict';

export type FieldScore = {
  field: VehicleField;
  /** Share of the field seen by the chosen mirrors from the counted eyes, 0…1. */
  share: number;
  /** The same per eye point (one entry per eye counted: left then right, or the midpoint). */
  shareByEye: number[];
  seenM2: number;
  areaM2: number;
  /** The field's parts no chosen mirror shows (for hatching). */
  gapsM: MultiPolygon;
  verdict: Verdict;
  mirrorIds: string[];
  /** Detect / recognise shares when the criteria were asked for. */
  criteria: FieldCriteria | null;
};

export type VehicleScore = {
  fields: FieldScore[];
  targets: TargetView[];
  mounting: MountingNote[];
  /** Every footprint traced for the fields (one per mirror and eye point used), for drawing. */
  footprints: { mirrorId: string; eyeM: Vec3; region: MultiPolygon }[];
};

/** Pass when the share reaches the pass mark; no verdict when the rule gives none. */
export function verdictFor(share: number, requiredShare: number | null): Verdict {
  if (requiredShare === null) return 'no-verdict';
  return share >= requiredShare ? 'pass' : 'short';
}

/** The eye points a field or target counts: both ocular points, or their midpoint. */
export function eyesFor(g: VehicleGeometry, eyes: 'both' | 'one'): Vec3[] {
  return eyes === 'both' ? [g.ocularM[0], g.ocularM[1]] : [g.eyeMidM];
}

/** Refuses a mirror whose face sits inside a body box (it would hang inside the body). */
function checkMirrorsOutsideBody(g: VehicleGeometry, mirrors: readonly VehicleMirror[]): void {
  mirrors.forEach((m, i) => {
    const box = boxAt(g, m.pose.vertexM);
    if (box) {
      throw new OpticsInputError(
        `mirrors[${i}].pose.vertexM`,
        `Mirror ${m.label ?? m.id} sits inside “${box.name}”; place it on the outside of the body.`,
      );
    }
  });
}

function farthestM(from: Vec3, field: VehicleField): number {
  let r = 0;
  for (const ring of field.polygonM) for (const [x, y] of ring) r = Math.max(r, Math.hypot(x - from[0], y - from[1]));
  return r;
}

function boxesMeet(a: [number, number, number, number], b: [number, number, number, number]): boolean {
  return a[0] <= b[2] && b[0] <= a[2] && a[1] <= b[3] && b[1] <= a[3];
}

export function scoreVehicle(input: ScoreInput): VehicleScore {
  const v = input.vehicle;
  const g = vehicleGeometry(v);
  checkMirrorsOutsideBody(g, input.mirrors);
  const fields = input.fields ?? vehicleFields(v, input.ruleSet ?? defaultRuleSet(v.kind), input.fieldOptions);
  const accuracy: TraceAccuracy = { ...VEHICLE_ACCURACY, ...input.accuracy };
  const byId = new Map(input.mirrors.map((m) => [m.id, m] as const));
  const chosen = (fieldId: string): VehicleMirror[] => {
    const ids = input.mirrorsForField?.[fieldId];
    if (!ids) return [...input.mirrors];
    return ids.map((id) => {
      const m = byId.get(id);
      if (!m) throw new OpticsInputError(`mirrorsForField.${fieldId}`, `No mirror “${id}” is fitted to this vehicle.`);
      return m;
    });
  };

  // Each mirror traced once per eye, out to the farthest corner of any field that uses it.
  const rangeFor = new Map<string, number>();
  for (const f of fields) {
    for (const m of chosen(f.id)) rangeFor.set(m.id, Math.max(rangeFor.get(m.id) ?? 0, farthestM(m.pose.vertexM, f) + 1));
  }
  const cache = new Map<string, { mirrorId: string; eyeM: Vec3; region: MultiPolygon }>();
  const footprint = (m: VehicleMirror, eyeM: Vec3): MultiPolygon => {
    const key = `${m.id}@${eyeM.join(',')}`;
    let hit = cache.get(key);
    if (!hit) {
      hit = { mirrorId: m.id, eyeM, region: mirrorFootprint(m, eyeM, rangeFor.get(m.id) ?? 1, g, accuracy) };
      cache.set(key, hit);
    }
    return hit.region;
  };

  const scores = fields.map((field): FieldScore => {
    const mirrors = chosen(field.id);
    const eyes = eyesFor(g, field.eyes);
    const areaM2 = polygonArea(field.polygonM);
    // Each footprint is first cut to the field (skipped when their boxes do not meet), so the
    // union and the share work on small pieces.
    const fieldBox = bbox([field.polygonM]);
    const eyeUnions = eyes.map((e) => {
      const pieces = mirrors
        .map((m) => footprint(m, e))
        .filter((r) => r.length > 0 && boxesMeet(bbox(r), fieldBox))
        .map((r) => robustIntersection(field.polygonM, r))
        .filter((r) => r.length > 0);
      return pieces.length <= 1 ? (pieces[0] ?? []) : robustUnion(pieces[0], ...pieces.slice(1));
    });
    // Each eye's union already lies inside the field: its area over the field's is that eye's share.
    const shareByEye = eyeUnions.map((u) => Math.min(1, multiPolygonArea(u) / areaM2));
    const { fraction, coveredM2 } = zoneCoverage({ zone: field.polygonM, regions: eyeUnions });
    const seen = eyeUnions.filter((u) => u.length > 0);
    const gapsM = seen.length === 0 ? [field.polygonM] : robustDifference(field.polygonM, ...seen).filter((p) => polygonArea(p) > 1e-6);
    return {
      field,
      share: fraction,
      shareByEye,
      seenM2: coveredM2,
      areaM2,
      gapsM,
      verdict: verdictFor(fraction, field.requiredShare),
      mirrorIds: mirrors.map((m) => m.id),
      criteria:
        input.fieldTargetHeightM !== undefined && input.detectAngleRad !== undefined && input.recogniseAngleRad !== undefined
          ? fieldCriteria({
              field,
              mirrors,
              eyes,
              walls: g.walls,
              targetHeightM: input.fieldTargetHeightM,
              detectAngleRad: input.detectAngleRad,
              recogniseAngleRad: input.recogniseAngleRad,
              samples: input.criteriaSamples,
            })
          : null,
    };
  });

  const targets = v.targets.map((t) =>
    targetView({
      target: t,
      eyes: eyesFor(g, t.eyes),
      mirrors: input.mirrors,
      walls: g.walls,
      detectAngleRad: input.detectAngleRad,
      recogniseAngleRad: input.recogniseAngleRad,
    }),
  );
  return { fields: scores, targets, mounting: mountingNotes(v, g, input.mirrors), footprints: [...cache.values()] };
}

/**
 * One mirror's ground footprint from one eye, with the body as walls. An eye behind the
 * mirror's face sees nothing in it: an empty footprint (the mounting notes say so).
 */
export function mirrorFootprint(
  m: VehicleMirror,
  eyeM: Vec3,
  maxRangeM: number,
  g: VehicleGeometry,
  accuracy: TraceAccuracy = VEHICLE_ACCURACY,
): MultiPolygon {
  try {
    // The range circle only bounds the trace: it lies 1 m beyond every field's farthest corner,
    // so its chords may cut up to 50 mm inside it without touching a field.
    const arcStepRad = Math.min(Math.PI / 32, 2 * Math.acos(1 - 0.05 / maxRangeM));
    return coverage({ mirror: m.mirror, pose: m.pose, eyeM, maxRangeM, walls: g.walls, arcStepRad, ...accuracy }).region;
  } catch (e) {
    if (e instanceof OpticsInputError && e.field === 'eyeM') return [];
    throw e;
  }
}
