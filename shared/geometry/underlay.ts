/**
 * Where an underlay's pixels land on the plan (see `underlay` in shared/schemas/files.ts).
 * Image pixels: x right, y down. Plan: metres, x east, y north.
 */
import type { Underlay } from '../schemas/files';

type Pt = readonly [number, number];

/** Metres per image pixel, from the two calibration points and their real distance. */
export function metresPerPixel(u: Pick<Underlay, 'calibration'>): number {
  const { aPx, bPx, distanceM } = u.calibration;
  return distanceM / Math.hypot(bPx[0] - aPx[0], bPx[1] - aPx[1]);
}

/** A pixel of the underlay image to plan metres. */
export function underlayToPlan(u: Underlay, p: Pt): [number, number] {
  const s = metresPerPixel(u);
  const x = p[0] * s;
  const y = -p[1] * s;
  const c = Math.cos(u.rotationRad);
  const n = Math.sin(u.rotationRad);
  return [u.originM[0] + x * c - y * n, u.originM[1] + x * n + y * c];
}

/** Plan metres to a pixel of the underlay image (the inverse of `underlayToPlan`). */
export function planToUnderlay(u: Underlay, m: Pt): [number, number] {
  const s = metresPerPixel(u);
  const dx = m[0] - u.originM[0];
  const dy = m[1] - u.originM[1];
  const c = Math.cos(u.rotationRad);
  const n = Math.sin(u.rotationRad);
  const x = dx * c + dy * n;
  const y = -dx * n + dy * c;
  return [x / s, -y / s];
}
