/**
 * The driver's eye points. Marks as in docs/vehicle-sources.md: [P] published text, [M] from
 * memory (fairly sure), [M?] from memory (unsure), [D] derived here.
 */
import type { Vec3 } from '../geometry/vec3';

/** Eye point above (and ahead of) the seat point, per rule. */
export const EYE_OFFSETS = {
  /** UN R46 ocular points: 635 mm above the seat R-point [P]; no fore-aft offset [M]. */
  'un-r46': { upM: 0.635, forwardM: 0 },
  /** ISO 5006: filament centre 680 mm above and 20 mm forward of the seat index point [P]. */
  'iso-5006': { upM: 0.68, forwardM: 0.02 },
} as const;

/** UN R46 ocular points are 65 mm apart [M], side by side across the vehicle. */
export const OCULAR_SEPARATION_M = 0.065;

type EyeFields =
  | { method: 'seat'; rule: keyof typeof EYE_OFFSETS; seatBehindFrontM: number; seatFromCentreM: number; seatHeightM: number }
  | { method: 'direct'; eyeBehindFrontM: number; eyeFromCentreM: number; eyeHeightM: number };

/**
 * The midpoint of the driver's eyes in plan (x forward from the front, y left, z up), metres.
 * `driverSide` 'left' puts the driver at +y.
 */
export function eyeMidpointM(eye: EyeFields, driverSide: 'left' | 'right'): Vec3 {
  const s = driverSide === 'left' ? 1 : -1;
  if (eye.method === 'direct') return [-eye.eyeBehindFrontM, s * eye.eyeFromCentreM, eye.eyeHeightM];
  const o = EYE_OFFSETS[eye.rule];
  return [-eye.seatBehindFrontM + o.forwardM, s * eye.seatFromCentreM, eye.seatHeightM + o.upM];
}
