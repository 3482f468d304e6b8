/**
 * The vehicle part of the new-project form, pure: the values the installer edits (a kind's
 * preset adjusted with a tape measure), the vehicle they make, and the form's checks, which are
 * the vehicle schema's own (shared/schemas/vehicle.ts) so the form refuses what the route
 * refuses, in the same words.
 */
import * as yup from 'yup';
import { defaultRuleSet, type RuleSetId } from '@/shared/vehicle';
import {
  vehicle as vehicleSchema,
  vehiclePreset,
  type BodyBox,
  type DriverSide,
  type VehicleInput,
  type VehicleKind,
} from '@/shared/schemas/vehicle';

export type EyeMethod = 'seat' | 'direct';
export type EyeRule = 'un-r46' | 'iso-5006';

/** Lengths in metres; null while a field is empty or unreadable. */
export interface VehicleSetupValues {
  vehicleKind: VehicleKind;
  driverSide: DriverSide;
  ruleSet: RuleSetId;
  lengthM: number | null;
  widthM: number | null;
  cabWidthM: number | null;
  cabFrontBehindM: number | null;
  eyeMethod: EyeMethod;
  eyeRule: EyeRule;
  /** The seat point's (method 'seat') or the eye's (method 'direct') position and height. */
  eyeBehindFrontM: number | null;
  eyeFromCentreM: number | null;
  eyeHeightM: number | null;
  /** The preset's body, kept fitted to the typed dimensions (see {@link followDimensions}). */
  bodyBoxes: BodyBox[];
}

/** The form fields this module checks, in screen order. */
export const VEHICLE_FIELDS = [
  'vehicleKind',
  'driverSide',
  'ruleSet',
  'lengthM',
  'widthM',
  'cabWidthM',
  'cabFrontBehindM',
  'eyeBehindFrontM',
  'eyeFromCentreM',
  'eyeHeightM',
] as const;
export type VehicleFieldName = (typeof VEHICLE_FIELDS)[number];

/** A kind's starting point (shared presets), with the rule set offered first for that kind. */
export function presetValues(kind: VehicleKind, driverSide: DriverSide): VehicleSetupValues {
  const v = vehiclePreset(kind, driverSide);
  const eye = v.eye;
  return {
    vehicleKind: kind,
    driverSide,
    ruleSet: defaultRuleSet(kind),
    lengthM: v.lengthM,
    widthM: v.widthM,
    cabWidthM: v.cabWidthM,
    cabFrontBehindM: v.cabFrontBehindM,
    eyeMethod: eye.method,
    eyeRule: eye.method === 'seat' ? eye.rule : 'un-r46',
    eyeBehindFrontM: eye.method === 'seat' ? eye.seatBehindFrontM : eye.eyeBehindFrontM,
    eyeFromCentreM: eye.method === 'seat' ? eye.seatFromCentreM : eye.eyeFromCentreM,
    eyeHeightM: eye.method === 'seat' ? eye.seatHeightM : eye.eyeHeightM,
    bodyBoxes: v.bodyBoxes.map((b) => ({ ...b })),
  };
}

type Dims = Pick<VehicleSetupValues, 'lengthM' | 'widthM' | 'cabWidthM' | 'cabFrontBehindM'>;
const near = (a: number, b: number) => Math.abs(a - b) < 1e-9;

/**
 * Keeps the body boxes on the typed dimensions when one changes: a box that reached the old
 * length, started at the old cab front or was as wide as the old cab or vehicle follows the new
 * figure, and no box reaches past the vehicle's length or sides. Boxes are never created or
 * removed, so a preset's body stays recognisable.
 */
export function followDimensions(boxes: readonly BodyBox[], prev: Dims, next: Dims): BodyBox[] {
  return boxes.map((b) => {
    let { frontBehindM, rearBehindM, widthM } = b;
    if (prev.lengthM !== null && next.lengthM !== null && near(rearBehindM, prev.lengthM)) rearBehindM = next.lengthM;
    if (prev.cabFrontBehindM !== null && next.cabFrontBehindM !== null && near(frontBehindM, prev.cabFrontBehindM))
      frontBehindM = next.cabFrontBehindM;
    if (prev.cabWidthM !== null && next.cabWidthM !== null && near(widthM, prev.cabWidthM)) widthM = next.cabWidthM;
    else if (prev.widthM !== null && next.widthM !== null && near(widthM, prev.widthM)) widthM = next.widthM;
    if (next.lengthM !== null && next.lengthM > 0) {
      rearBehindM = Math.min(rearBehindM, next.lengthM);
      frontBehindM = Math.min(frontBehindM, Math.max(0, rearBehindM - 0.05));
    }
    if (next.widthM !== null && next.widthM > 0) widthM = Math.min(widthM, next.widthM - 2 * Math.abs(b.offsetM));
    return { ...b, frontBehindM, rearBehindM, widthM };
  });
}

/** An empty number is sent as NaN, which the schema refuses with its "Enter the …" sentence. */
const n = (x: number | null) => x ?? Number.NaN;

export function vehicleOfValues(v: VehicleSetupValues): VehicleInput {
  const eye: VehicleInput['eye'] =
    v.eyeMethod === 'seat'
      ? {
          method: 'seat',
          rule: v.eyeRule,
          seatBehindFrontM: n(v.eyeBehindFrontM),
          seatFromCentreM: n(v.eyeFromCentreM),
          seatHeightM: n(v.eyeHeightM),
        }
      : { method: 'direct', eyeBehindFrontM: n(v.eyeBehindFrontM), eyeFromCentreM: n(v.eyeFromCentreM), eyeHeightM: n(v.eyeHeightM) };
  return {
    kind: v.vehicleKind,
    driverSide: v.driverSide,
    lengthM: n(v.lengthM),
    widthM: n(v.widthM),
    cabWidthM: n(v.cabWidthM),
    cabFrontBehindM: n(v.cabFrontBehindM),
    eye,
    bodyBoxes: v.bodyBoxes,
    groundFields: [],
    targets: [],
  };
}

/** Which form field shows a schema sentence about `path` (the body's sentences go beside the field that moves them). */
export function formFieldOf(path: readonly PropertyKey[]): VehicleFieldName {
  const [head, second, , last] = path;
  if (head === 'kind') return 'vehicleKind';
  if (head === 'eye') {
    if (second === 'seatBehindFrontM' || second === 'eyeBehindFrontM') return 'eyeBehindFrontM';
    if (second === 'seatFromCentreM' || second === 'eyeFromCentreM') return 'eyeFromCentreM';
    return 'eyeHeightM';
  }
  if (head === 'bodyBoxes') {
    if (last === 'windowLineM') return 'eyeHeightM';
    if (last === 'widthM') return 'widthM';
    return 'lengthM';
  }
  if (head === 'driverSide' || head === 'lengthM' || head === 'widthM' || head === 'cabWidthM' || head === 'cabFrontBehindM') return head;
  return 'lengthM';
}

/** The schema's first sentence per form field, or an empty object when the vehicle is accepted. */
export function vehicleProblems(v: VehicleSetupValues): Partial<Record<VehicleFieldName, string>> {
  const r = vehicleSchema.safeParse(vehicleOfValues(v));
  if (r.success) return {};
  const out: Partial<Record<VehicleFieldName, string>> = {};
  for (const issue of r.error.issues) {
    const f = formFieldOf(issue.path);
    out[f] ??= issue.message;
  }
  return out;
}

/**
 * The form's yup fields for the vehicle: each asks the vehicle schema and shows its sentence for
 * that field, only while the project is a vehicle job (`kind` beside them in the form's values).
 */
export function vehicleSchemaFields(): Record<VehicleFieldName, yup.MixedSchema> {
  const check = (name: VehicleFieldName) =>
    yup
      .mixed()
      .nullable()
      .test('vehicle', function check() {
        const parent = this.parent as VehicleSetupValues & { kind?: string };
        if (parent.kind !== 'vehicle') return true;
        const problem = vehicleProblems(parent)[name];
        return problem ? this.createError({ message: problem }) : true;
      });
  return Object.fromEntries(VEHICLE_FIELDS.map((f) => [f, check(f)])) as Record<VehicleFieldName, yup.MixedSchema>;
}
