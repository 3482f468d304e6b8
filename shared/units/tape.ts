/**
 * How precisely a range is printed: to what a tape measure on site means, never to the centimetre
 * of a calculation ("48.08 m"). The rule (a product choice, common practice for site measurement):
 *
 * | system   | below               | step   | from                | step   |
 * |----------|---------------------|--------|---------------------|--------|
 * | metric   | 10 m                | 5 cm   | 10 m                | 0.1 m  |
 * | imperial | 30 ft (≈ 9.1 m)     | 1 in   | 30 ft               | 6 in   |
 *
 * A range ("recognised up to") is rounded DOWN to its step, so the printed figure never promises
 * more than the engine found; the same rule as a zone's share (shared/zone-verdict.ts).
 */
import { M_PER_FT, M_PER_IN } from './factors';
import { formatLength, type UnitSystem } from './index';

export const METRIC_FINE_BELOW_M = 10;
export const IMPERIAL_FINE_BELOW_M = 30 * M_PER_FT;

/** The tape step, in metres, for a range of `m` metres. */
export function rangeStepM(m: number, units: UnitSystem): number {
  const a = Math.abs(m);
  if (units === 'metric') return a < METRIC_FINE_BELOW_M ? 0.05 : 0.1;
  return a < IMPERIAL_FINE_BELOW_M ? M_PER_IN : 6 * M_PER_IN;
}

/** `m` rounded down to its tape step (toward zero for a negative value). */
export function roundRangeDown(m: number, units: UnitSystem): number {
  if (!Number.isFinite(m)) return m;
  const step = rangeStepM(m, units);
  // The millionth of a step keeps 9.999999999 m (10 m in floating point) at 10 m.
  const steps = Math.floor(Math.abs(m) / step + 1e-6);
  return Math.sign(m) * steps * step;
}

/** A range for a person: "4.35 m", "48 m" → "48.0 m", "12 ft 7 in", "157 ft 6 in". */
export function formatRange(m: number, units: UnitSystem): string {
  if (!Number.isFinite(m)) return '—';
  const r = roundRangeDown(m, units);
  if (units === 'metric') return formatLength(r, units, { precision: rangeStepM(m, units) < 0.1 ? 2 : 1 });
  return formatLength(r, units, { precision: 0 });
}
