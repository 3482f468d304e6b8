/** Plain numbers the schemas enforce, kept free of zod so screens can import them without it. */

/** Ranges a placement's mounting values must stay in; the editor's steppers use the same. */
export const PLACEMENT_LIMITS = {
  heightM: { min: 0.2, max: 30 },
  azimuthRad: { min: -4 * Math.PI, max: 4 * Math.PI },
  tiltDownRad: { min: -Math.PI / 2, max: Math.PI / 2 },
} as const;
