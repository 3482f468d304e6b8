/**
 * A vehicle job through the vehicle scoring (shared/vehicle/score.ts): the project's placements
 * become the vehicle's mirrors, their `servesFieldIds` the fields each counts toward. Nothing
 * here reflects a ray; every number comes from scoreVehicle and the engine behind it.
 */
import { robustUnion } from '../geometry/robust-boolean';
import { multiPolygonArea } from '../geometry/polygon';
import { OpticsInputError, poseFromAim } from '../optics';
import type { CatalogueItemDto, PlacementDto, Scene } from '../schemas';
import {
  boxAt,
  defaultRuleSet,
  scoreVehicle,
  vehicleFields,
  vehicleGeometry,
  type FieldCode,
  type FieldScore,
  type MountingNote,
  type RuleSetId,
  type TargetView,
  type VehicleField,
  type VehicleMirror,
  type Verdict,
} from '../vehicle';
import { criteriaOf } from './criteria';
import { mirrorOfPlacement, numbersFor, type EvaluatedPlacement } from './evaluate';
import { floorSeenFigures } from './figures';
import { TARGET_HEIGHT_M } from './targets';

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

/**
 * Exact point tests the detect / recognise estimate may spend on one job (fields × grid points ×
 * mirrors × 2 eyes): the demo truck (6 × 100 × 6 × 2 = 7,200) keeps the full 100 points a field;
 * a job at the limits (56 fields, 30 mirrors) drops to 16, which keeps its sheet within a few
 * seconds (measured: 100 points a field there took about 12 s under load).
 */
export const CRITERIA_POINT_TESTS = 24_000;

/** Grid points per field for the detect / recognise estimate: 100, fewer for big jobs, never under 16. */
export function criteriaSamplesPerField(fields: number, mirrors: number): number {
  const per = Math.floor(CRITERIA_POINT_TESTS / Math.max(1, fields * mirrors * 2));
  return Math.max(16, Math.min(100, per));
}

/** A vehicle job's own results, beside each mirror's numbers in `ProjectEvaluation.placements`. */
export interface VehicleJobEvaluation {
  ruleSet: RuleSetId;
  /** Each field's share seen, gaps and verdict, in the order of `vehicleJobFields`. */
  fields: FieldScore[];
  targets: TargetView[];
  /** Mounting checks as sentences (low, sticking out, too curved for its class, facing away). */
  mounting: MountingNote[];
  /** Why the fields could not be scored, as a sentence; else null. */
  problem: string | null;
}

export type VehiclePlacementInput = Pick<
  PlacementDto,
  'id' | 'label' | 'catalogueItemId' | 'customMirror' | 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad'
> &
  Partial<Pick<PlacementDto, 'mirrorClass' | 'servesFieldIds'>>;

/** The id a placement goes by in the vehicle scoring (and in `FieldScore.mirrorIds`, `TargetView.mirrorId`). */
export const vehicleMirrorId = (placementId: number): string => String(placementId);

/**
 * Evaluates a vehicle job: each placement's numbers seen from the midpoint of the driver's eyes,
 * and the fields, test cylinders and mounting checks through scoreVehicle. A placement without a
 * mirror, with an impossible pose or inside the body gets a sentence and is left out of the
 * scoring; the rest are scored. `fieldCriteria`: also estimate where in each field an adult is
 * detected and recognised (a sampled estimate; the sheet asks for it, a drag does not).
 */
export function evaluateVehicleJob(input: {
  scene: Scene;
  placements: readonly VehiclePlacementInput[];
  catalogue: readonly CatalogueItemDto[];
  fieldCriteria?: boolean;
}): { placements: EvaluatedPlacement[]; vehicle: VehicleJobEvaluation } {
  const v = input.scene.vehicle;
  const ruleSet = ruleSetOf(input.scene);
  if (!v || !ruleSet) throw new OpticsInputError('scene.vehicle', 'This project has no vehicle to score.');
  const g = vehicleGeometry(v);
  const criteria = criteriaOf(input.scene);
  const eyeM = g.eyeMidM;
  const fields = vehicleFields(v, ruleSet);

  const fitted: VehicleMirror[] = [];
  const placements = input.placements.map((p): EvaluatedPlacement => {
    const out: EvaluatedPlacement = {
      placementId: p.id,
      mirror: mirrorOfPlacement(p, input.catalogue),
      pose: null,
      eyeM,
      viewer: null,
      numbers: null,
      coverage: null,
      problem: null,
    };
    if (!out.mirror)
      return { ...out, problem: { field: 'catalogueItemId', message: 'Pick a mirror from the catalogue or describe a custom one.' } };
    try {
      const pose = poseFromAim({
        vertexM: [p.positionM[0], p.positionM[1], p.heightM],
        azimuthRad: p.azimuthRad,
        tiltDownRad: p.tiltDownRad,
      });
      out.pose = pose;
      const problem = vehicleMirrorProblem(input.scene, { ...p, servesFieldIds: null });
      if (problem) return { ...out, problem };
      const d = Math.hypot(eyeM[0] - pose.vertexM[0], eyeM[1] - pose.vertexM[1], eyeM[2] - pose.vertexM[2]);
      out.numbers = numbersFor(out.mirror, pose, eyeM, d, criteria);
      fitted.push({ id: vehicleMirrorId(p.id), label: p.label, mirror: out.mirror, pose, mirrorClass: p.mirrorClass ?? null });
    } catch (e) {
      out.numbers = null;
      out.problem =
        e instanceof OpticsInputError
          ? { field: e.field, message: e.message }
          : { field: '_', message: 'These values cannot be computed; check the mirror and its position.' };
    }
    return out;
  });

  // A mirror counts toward every field unless it names the fields it serves; names of fields the
  // vehicle no longer has (the rules or the vehicle changed) are ignored.
  const serves = new Map(input.placements.map((p) => [vehicleMirrorId(p.id), p.servesFieldIds ?? null] as const));
  const mirrorsForField = Object.fromEntries(
    fields.map((f) => [f.id, fitted.filter((m) => serves.get(m.id)?.includes(f.id) ?? true).map((m) => m.id)] as const),
  );

  let vehicle: VehicleJobEvaluation;
  try {
    const score = scoreVehicle({
      vehicle: v,
      mirrors: fitted,
      fields,
      mirrorsForField,
      detectAngleRad: criteria.detectRad,
      recogniseAngleRad: criteria.recogniseRad,
      ...(input.fieldCriteria
        ? { fieldTargetHeightM: TARGET_HEIGHT_M.adult, criteriaSamples: criteriaSamplesPerField(fields.length, fitted.length) }
        : {}),
    });
    vehicle = { ruleSet, fields: score.fields, targets: score.targets, mounting: score.mounting, problem: null };
    for (const ev of placements) {
      const regions = score.footprints.filter((fp) => fp.mirrorId === vehicleMirrorId(ev.placementId) && fp.region.length > 0);
      if (!ev.numbers || !ev.pose || regions.length === 0) continue;
      const region = regions.length === 1 ? regions[0].region : robustUnion(regions[0].region, ...regions.slice(1).map((r) => r.region));
      ev.coverage = { region, areaM2: multiPolygonArea(region) };
      ev.numbers.floorSeen = floorSeenFigures(region, [ev.pose.vertexM[0], ev.pose.vertexM[1]]);
    }
  } catch (e) {
    vehicle = {
      ruleSet,
      fields: [],
      targets: [],
      mounting: [],
      problem:
        e instanceof OpticsInputError ? e.message : 'The fields could not be scored for these mirror positions; move a mirror a little.',
    };
  }
  return { placements, vehicle };
}

/**
 * A field's share as printed and shown: a percentage rounded DOWN to 0.1 % ("84.9 %"), so a share
 * is never overstated and a field shown at the pass mark has reached it (the verdict is read from
 * the exact share: a shown "85.0 %" is at least 85 %).
 */
export function formatFieldShare(share: number): string {
  if (!Number.isFinite(share)) return '—';
  // The billionth keeps a share computed as 0.84999999999 (a full 85 % in floating point) at 85.0.
  return `${(Math.floor(Math.min(1, Math.max(0, share)) * 1000 + 1e-6) / 10).toFixed(1)} %`;
}

/** The words for a verdict on screens and sheets. */
export function verdictText(v: Verdict): 'pass' | 'short' | 'no verdict' {
  return v === 'no-verdict' ? 'no verdict' : v;
}

/** The regulation's class of a library field ("IV", "V extended"); "—" for other rules' fields, "own" for the installer's. */
export function vehicleFieldClass(code: FieldCode): string {
  switch (code) {
    case 'un-ii':
      return 'II';
    case 'un-iii':
      return 'III';
    case 'un-iv':
      return 'IV';
    case 'un-v':
      return 'V';
    case 'un-v-extended':
      return 'V extended';
    case 'un-vi':
      return 'VI';
    case 'user':
      return 'own';
    default:
      return '—';
  }
}
