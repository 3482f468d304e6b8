/**
 * Calibrating the plan underlay: while it runs, taps on the plan give points on the image (kept in
 * image pixels, so panning and zooming between the taps changes nothing); a third tap moves the
 * second point. The typed distance is read with the shared length parser in either unit system.
 */
import { useCallback, useState } from 'react';
import { planToUnderlay } from '@/shared/geometry/underlay';
import type { Underlay } from '@/shared/schemas/files';
import { parseLength, type UnitSystem } from '@/shared/units';
import type { PairM } from './plan-view';
import { calibrateUnderlay } from './underlay-edits';

/** The smallest gap between the two points, image pixels (the schema refuses points closer than 4). */
export const MIN_CALIBRATION_PX = 4;

export type CalibrationOutcome = { ok: true; underlay: Underlay } | { ok: false; message: string };

/** The calibrated underlay from two image points and the typed distance, or the sentence that stops it. */
export function calibrationFrom(u: Underlay, pointsPx: readonly PairM[], distanceText: string, units: UnitSystem): CalibrationOutcome {
  if (pointsPx.length < 2) return { ok: false, message: 'Tap two points on the plan whose real distance you know.' };
  const [a, b] = pointsPx;
  if (Math.hypot(b[0] - a[0], b[1] - a[1]) < MIN_CALIBRATION_PX)
    return { ok: false, message: 'The two points are too close together; tap the ends of a long wall or a dimension line.' };
  const parsed = parseLength(distanceText, units);
  if (!parsed.ok) return { ok: false, message: parsed.message };
  if (!(parsed.m > 0)) return { ok: false, message: 'The distance must be more than zero.' };
  if (parsed.m > 2000) return { ok: false, message: 'A plan distance over 2 km is not a building.' };
  return { ok: true, underlay: calibrateUnderlay(u, a, b, parsed.m) };
}

export function useUnderlayCalibration() {
  const [pointsPx, setPointsPx] = useState<PairM[] | null>(null);
  const active = pointsPx !== null;
  const start = useCallback(() => setPointsPx([]), []);
  const cancel = useCallback(() => setPointsPx(null), []);
  const restart = useCallback(() => setPointsPx((p) => (p === null ? p : [])), []);
  const tap = useCallback((u: Underlay, pointM: PairM) => {
    const px = planToUnderlay(u, pointM);
    setPointsPx((p) => (p === null ? p : p.length < 2 ? [...p, px] : [p[0], px]));
  }, []);
  return { active, pointsPx: pointsPx ?? [], start, cancel, restart, tap };
}
