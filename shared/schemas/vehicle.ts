/**
 * The vehicle model of a vehicle job (zod; SI: metres, radians): `scene.vehicle` of a project of
 * kind 'vehicle' (shared/schemas/projects.ts), with `scene.ruleSet` naming the rules it is scored by.
 *
 * Frames. An installer measures with a tape from the front of the vehicle and from its
 * centreline, so distances "behind the front" and "from the centre" are typed as positive
 * numbers. The plan frame that fields, targets and mirrors use is: origin on the ground under
 * the middle of the vehicle's front face (the front bumper), x forward (so the vehicle lies at
 * x ≤ 0), y to the left, z up. Lateral offsets of the driver and of body boxes are measured
 * toward the driver's side, so switching left- and right-hand drive mirrors the vehicle exactly.
 */
import { z } from 'zod';
import { isSimpleRing } from '../geometry/polygon';
import { eyeMidpointM } from '../vehicle/eye';
import { VEHICLE_LIMITS } from './limits';

/** One arc minute in radians (kept here so the schema needs nothing from the engine). */
const ARCMIN = Math.PI / 10800;

export const vehicleKinds = ['car-van', 'bus-coach', 'rigid-truck', 'tractor-unit', 'school-bus', 'site-machine'] as const;
export type VehicleKind = (typeof vehicleKinds)[number];
/** Where the driver sits: 'left' is left-hand drive (driver on the left, as in mainland Europe). */
export const driverSides = ['left', 'right'] as const;
export type DriverSide = (typeof driverSides)[number];
/** Which rule's offset turns the seat point into the eye point (see shared/vehicle/geometry.ts). */
export const eyeOffsetRules = ['un-r46', 'iso-5006'] as const;
/** The rule sets a vehicle job can be scored by (shared/vehicle/fields.ts `RULE_SETS`). */
export const vehicleRuleSets = ['eu-retrofit', 'un-r46', 'fmvss-111', 'iso-5006'] as const;
export type VehicleRuleSet = (typeof vehicleRuleSets)[number];
export const vehicleRuleSet = z.enum(vehicleRuleSets, {
  message: 'Choose the rules to score against: EU retrofit, UN R46, US FMVSS 111 or ISO 5006.',
});
/** The mirror classes of UN R46 an installer can fit a vehicle mirror as (for the mounting checks). */
export const mirrorClasses = ['II', 'III', 'IV', 'V', 'VI'] as const;
export type MirrorClass = (typeof mirrorClasses)[number];
export const mirrorClass = z.enum(mirrorClasses, { message: 'Choose the mirror’s class: II, III, IV, V or VI.' });

const metres = (what: string, min: number, max: number) =>
  z
    .number({ message: `Enter the ${what} in metres.` })
    .finite(`Enter the ${what} as a number.`)
    .min(min, `The ${what} must be at least ${min} m.`)
    .max(max, `The ${what} must be at most ${max} m.`);
const positiveMetres = (what: string, max: number) =>
  z
    .number({ message: `Enter the ${what} in metres.` })
    .finite(`Enter the ${what} as a number.`)
    .positive(`The ${what} must be more than zero.`)
    .max(max, `The ${what} must be at most ${max} m.`);
const id = z
  .string({ message: 'Give the item an id.' })
  .min(1, 'Give the item an id.')
  .max(40, 'Keep ids to 40 characters.')
  .regex(/^[A-Za-z0-9_-]+$/, 'Ids use letters, digits, dash or underscore.');
const name = (what: string) =>
  z
    .string({ message: `Give the ${what} a name.` })
    .trim()
    .min(1, `Give the ${what} a name.`)
    .max(80, `Keep the ${what}'s name to 80 characters.`);
const planCoord = metres('position', -200, 200);
const planPoint = z.tuple([planCoord, planCoord], { message: 'A point needs x (forward) and y (left) in metres.' });
const arcAngle = (what: string) =>
  z
    .number({ message: `Enter the ${what} in radians.` })
    .finite(`Enter the ${what} as a number.`)
    .min(0, `The ${what} cannot be negative.`)
    .max(Math.PI / 18, `The ${what} must be at most 10°.`);

/** The driver's eye: from the seat reference point plus a rule's offset, or typed directly. */
export const vehicleEye = z.discriminatedUnion(
  'method',
  [
    z.object({
      method: z.literal('seat'),
      rule: z.enum(eyeOffsetRules, { message: 'Choose which rule places the eye above the seat: UN R46 or ISO 5006.' }),
      seatBehindFrontM: metres('seat point’s distance behind the front', 0, 30),
      seatFromCentreM: metres('seat point’s distance from the centreline', 0, 2),
      seatHeightM: metres('seat point’s height above the ground', 0.1, 4),
    }),
    z.object({
      method: z.literal('direct'),
      eyeBehindFrontM: metres('eye’s distance behind the front', 0, 30),
      eyeFromCentreM: metres('eye’s distance from the centreline', 0, 2),
      eyeHeightM: metres('eye height', 0.5, 5),
    }),
  ],
  { message: 'Give the driver’s eye from the seat point or directly.' },
);
export type VehicleEye = z.infer<typeof vehicleEye>;

/**
 * A part of the body as an upright box standing on the ground (cab, load body, trailer,
 * bonnet). `windowLineM`: glass above this height, so the box hides sightlines only below it
 * (the cab the driver sits in must have one).
 */
export const bodyBox = z
  .object({
    id,
    name: name('body part'),
    frontBehindM: metres('body part’s front distance behind the vehicle front', 0, 40),
    rearBehindM: metres('body part’s rear distance behind the vehicle front', 0, 40),
    widthM: positiveMetres('body part’s width', 3.5),
    offsetM: metres('body part’s offset toward the driver’s side', -2, 2).default(0),
    heightM: positiveMetres('body part’s height', 6),
    windowLineM: metres('window line height', 0, 6).nullable().default(null),
  })
  .refine((b) => b.rearBehindM - b.frontBehindM >= 0.05, {
    message: 'The body part’s rear must be at least 50 mm behind its front.',
    path: ['rearBehindM'],
  })
  .refine((b) => b.windowLineM === null || b.windowLineM < b.heightM, {
    message: 'The window line must be below the top of the body part.',
    path: ['windowLineM'],
  });
export type BodyBox = z.infer<typeof bodyBox>;

/** A ground area the installer wants seen, in plan (x forward, y left, metres). */
export const userGroundField = z.object({
  id,
  name: name('ground field'),
  polygonM: z
    .array(planPoint)
    .min(3, 'A ground field needs at least three corners.')
    .max(VEHICLE_LIMITS.cornersPerField, `A ground field may have at most ${VEHICLE_LIMITS.cornersPerField} corners.`)
    .refine((ring) => isSimpleRing(ring), 'The ground field’s outline crosses or touches itself; redraw it as one simple outline.'),
  requiredShare: z
    .number({ message: 'Enter the share that must be seen (0 to 1).' })
    .min(0.01, 'The required share must be at least 1 %.')
    .max(1, 'The required share cannot exceed 100 %.')
    .default(0.9),
  eyes: z.enum(['both', 'one'], { message: 'Choose whether either eye counts or one eye point.' }).default('both'),
});
export type UserGroundField = z.infer<typeof userGroundField>;

/**
 * An upright test cylinder standing on the ground (the school-bus case). The angles are the
 * pass rule for its image: at least `insideEdgeRad` inside the mirror's edge and, when given,
 * at least `minShortRad` in its shortest and `minLongRad` in its longest dimension.
 */
export const pointTarget = z.object({
  id,
  name: name('test cylinder'),
  positionM: planPoint,
  diameterM: positiveMetres('cylinder diameter', 2),
  heightM: positiveMetres('cylinder height', 5),
  insideEdgeRad: arcAngle('angle inside the mirror edge').default(3 * ARCMIN),
  minShortRad: arcAngle('smallest image size').nullable().default(null),
  minLongRad: arcAngle('smallest image length').nullable().default(null),
  eyes: z.enum(['both', 'one'], { message: 'Choose whether either eye counts or one eye point.' }).default('one'),
});
export type PointTarget = z.infer<typeof pointTarget>;

export const vehicle = z
  .object({
    kind: z.enum(vehicleKinds, {
      message: 'Choose a kind of vehicle: car or van, bus or coach, rigid truck, tractor unit, school bus or site machine.',
    }),
    driverSide: z.enum(driverSides, { message: 'Choose left- or right-hand drive.' }),
    lengthM: positiveMetres('overall length', 40),
    widthM: positiveMetres('overall width without mirrors', 3.5),
    cabWidthM: positiveMetres('cab width', 3.5),
    cabFrontBehindM: metres('cab front’s distance behind the front bumper', 0, 10),
    eye: vehicleEye,
    bodyBoxes: z
      .array(bodyBox)
      .max(VEHICLE_LIMITS.bodyBoxes, `Describe the body with at most ${VEHICLE_LIMITS.bodyBoxes} boxes.`)
      .default([]),
    groundFields: z
      .array(userGroundField)
      .max(VEHICLE_LIMITS.groundFields, `At most ${VEHICLE_LIMITS.groundFields} ground fields per vehicle.`)
      .default([]),
    targets: z.array(pointTarget).max(VEHICLE_LIMITS.targets, `At most ${VEHICLE_LIMITS.targets} test cylinders per vehicle.`).default([]),
  })
  .superRefine((v, ctx) => {
    const say = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path, message });
    if (v.cabWidthM > v.widthM + 1e-9) say(['cabWidthM'], 'The cab cannot be wider than the vehicle.');
    if (v.cabFrontBehindM >= v.lengthM) say(['cabFrontBehindM'], 'The cab front must lie within the vehicle’s length.');
    const behind = v.eye.method === 'seat' ? v.eye.seatBehindFrontM : v.eye.eyeBehindFrontM;
    const across = v.eye.method === 'seat' ? v.eye.seatFromCentreM : v.eye.eyeFromCentreM;
    const eyePath = v.eye.method === 'seat' ? ['eye', 'seatBehindFrontM'] : ['eye', 'eyeBehindFrontM'];
    if (behind >= v.lengthM)
      say(eyePath, 'The driver sits within the vehicle: the distance behind the front must be less than its length.');
    if (across >= v.widthM / 2)
      say(
        ['eye', v.eye.method === 'seat' ? 'seatFromCentreM' : 'eyeFromCentreM'],
        'The driver sits within the vehicle: the distance from the centreline must be less than half its width.',
      );
    const seen = new Set<string>();
    v.bodyBoxes.forEach((b, i) => {
      if (seen.has(b.id)) say(['bodyBoxes', i, 'id'], 'Two body parts share an id.');
      seen.add(b.id);
      if (b.rearBehindM > v.lengthM + 1e-9)
        say(['bodyBoxes', i, 'rearBehindM'], 'The body part reaches behind the vehicle’s overall length.');
      if (Math.abs(b.offsetM) + b.widthM / 2 > v.widthM / 2 + 1e-9)
        say(['bodyBoxes', i, 'widthM'], 'The body part is wider than the vehicle or sticks out past its side.');
      const e = eyeMidpointM(v.eye, v.driverSide);
      const yBox = (v.driverSide === 'left' ? 1 : -1) * b.offsetM;
      const eyeInside = -e[0] > b.frontBehindM && -e[0] < b.rearBehindM && Math.abs(e[1] - yBox) < b.widthM / 2 && e[2] < b.heightM;
      if (eyeInside && (b.windowLineM === null || b.windowLineM >= e[2])) {
        say(
          ['bodyBoxes', i, 'windowLineM'],
          `The driver’s eye is inside “${b.name}” below its window line; give it a window line lower than the eye (${e[2].toFixed(2)} m).`,
        );
      }
    });
    v.groundFields.forEach((f, i) => {
      if (seen.has(f.id)) say(['groundFields', i, 'id'], 'Two items of the vehicle share an id.');
      seen.add(f.id);
    });
    v.targets.forEach((t, i) => {
      if (seen.has(t.id)) say(['targets', i, 'id'], 'Two items of the vehicle share an id.');
      seen.add(t.id);
      if (t.minShortRad !== null && t.minLongRad !== null && t.minShortRad > t.minLongRad) {
        say(['targets', i, 'minLongRad'], 'The image’s required length cannot be less than its required width.');
      }
    });
  });
/** A vehicle as typed (defaults may be missing). */
export type VehicleInput = z.input<typeof vehicle>;
/** A vehicle after parsing: every default filled in. */
export type Vehicle = z.infer<typeof vehicle>;

/**
 * Starting points per kind of vehicle, to be adjusted with a tape measure. Every figure is a
 * typical value (trade practice, from memory, VEHICLE-FIELDS' "Trade practice" section and
 * docs/vehicle-sources.md), except the car's eye height, which sits between the published sedan
 * (1.117 m) and SUV (1.386 m) eye heights of the eye-height survey listed there.
 */
export function vehiclePreset(kind: VehicleKind, driverSide: DriverSide): Vehicle {
  return vehicle.parse({ ...PRESET_FIGURES[kind], kind, driverSide, groundFields: [], targets: [] });
}

/** A preset's figures: everything but the kind, the drive side and the installer's own fields and cylinders. */
type PresetFigures = Omit<VehicleInput, 'kind' | 'driverSide' | 'groundFields' | 'targets'>;

const PRESET_FIGURES: Record<VehicleKind, PresetFigures> = {
  'car-van': {
    lengthM: 4.8,
    widthM: 1.85,
    cabWidthM: 1.85,
    cabFrontBehindM: 0.9,
    eye: { method: 'direct', eyeBehindFrontM: 2.3, eyeFromCentreM: 0.37, eyeHeightM: 1.25 },
    bodyBoxes: [
      { id: 'bonnet', name: 'Bonnet', frontBehindM: 0, rearBehindM: 0.9, widthM: 1.8, heightM: 0.9 },
      { id: 'cabin', name: 'Cabin', frontBehindM: 0.9, rearBehindM: 4.8, widthM: 1.85, heightM: 1.45, windowLineM: 0.95 },
    ],
  },
  'bus-coach': {
    lengthM: 12,
    widthM: 2.55,
    cabWidthM: 2.55,
    cabFrontBehindM: 0,
    eye: { method: 'seat', rule: 'un-r46', seatBehindFrontM: 1.0, seatFromCentreM: 0.75, seatHeightM: 1.3 },
    bodyBoxes: [{ id: 'body', name: 'Body', frontBehindM: 0, rearBehindM: 12, widthM: 2.55, heightM: 3.2, windowLineM: 1.1 }],
  },
  'rigid-truck': {
    lengthM: 10,
    widthM: 2.55,
    cabWidthM: 2.35,
    cabFrontBehindM: 0.1,
    eye: { method: 'seat', rule: 'un-r46', seatBehindFrontM: 1.1, seatFromCentreM: 0.65, seatHeightM: 1.75 },
    bodyBoxes: [
      { id: 'cab', name: 'Cab', frontBehindM: 0.1, rearBehindM: 2.4, widthM: 2.35, heightM: 3.1, windowLineM: 1.85 },
      { id: 'body', name: 'Load body', frontBehindM: 2.6, rearBehindM: 10, widthM: 2.55, heightM: 3.6 },
    ],
  },
  'tractor-unit': {
    lengthM: 16.5,
    widthM: 2.55,
    cabWidthM: 2.5,
    cabFrontBehindM: 0.1,
    eye: { method: 'seat', rule: 'un-r46', seatBehindFrontM: 1.2, seatFromCentreM: 0.65, seatHeightM: 1.85 },
    bodyBoxes: [
      { id: 'cab', name: 'Cab', frontBehindM: 0.1, rearBehindM: 2.4, widthM: 2.5, heightM: 3.9, windowLineM: 1.95 },
      { id: 'trailer', name: 'Trailer', frontBehindM: 2.9, rearBehindM: 16.5, widthM: 2.55, heightM: 4.0 },
    ],
  },
  'school-bus': {
    lengthM: 11,
    widthM: 2.44,
    cabWidthM: 2.44,
    cabFrontBehindM: 1.3,
    eye: { method: 'direct', eyeBehindFrontM: 2.0, eyeFromCentreM: 0.6, eyeHeightM: 1.95 },
    bodyBoxes: [
      { id: 'hood', name: 'Bonnet', frontBehindM: 0, rearBehindM: 1.3, widthM: 1.9, heightM: 1.4 },
      { id: 'body', name: 'Body', frontBehindM: 1.3, rearBehindM: 11, widthM: 2.44, heightM: 3.0, windowLineM: 1.3 },
    ],
  },
  'site-machine': {
    lengthM: 6,
    widthM: 2.5,
    cabWidthM: 1.1,
    cabFrontBehindM: 2.0,
    eye: { method: 'seat', rule: 'iso-5006', seatBehindFrontM: 2.9, seatFromCentreM: 0, seatHeightM: 1.6 },
    bodyBoxes: [
      { id: 'front', name: 'Front frame', frontBehindM: 0, rearBehindM: 2.0, widthM: 2.5, heightM: 1.2 },
      { id: 'cab', name: 'Cab', frontBehindM: 2.0, rearBehindM: 3.6, widthM: 1.1, heightM: 3.2, windowLineM: 1.3 },
      { id: 'engine', name: 'Engine cover', frontBehindM: 3.6, rearBehindM: 6.0, widthM: 2.2, heightM: 2.2 },
    ],
  },
};
