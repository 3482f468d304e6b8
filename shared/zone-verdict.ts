/**
 * How a zone's covered share is shown and judged: one rule for the figure and the verdict, used by
 * the plan, the editor and the sheet, so a verdict never contradicts the number beside it.
 *
 * The share is shown as a whole percent rounded down — coverage is never overstated (a zone at
 * 94.6 % reads "94 %") — and the verdict is read from that shown figure: at least 95 % counts as
 * covered, 60–94 % as partly covered, below that as a large gap. The thresholds are a product
 * choice (common practice for "nearly all of it"), not taken from a standard.
 */
import { palette } from './palette';

export type ZoneBand = 'good' | 'partial' | 'poor' | 'unknown';

export const COVERED_FROM_PERCENT = 95;
export const PARTLY_FROM_PERCENT = 60;

/** The whole percent shown for a share (0..1), rounded down; null when it could not be computed. */
export function coveredPercent(fraction: number): number | null {
  if (!Number.isFinite(fraction)) return null;
  // The millionth keeps a share computed as 0.9499999999 (a full 95 % in floating point) at 95.
  return Math.floor(Math.min(1, Math.max(0, fraction)) * 100 + 1e-6);
}

/** "94 %", or "—" when the share could not be computed. */
export function formatCoveredShare(fraction: number): string {
  const p = coveredPercent(fraction);
  return p === null ? '—' : `${p} %`;
}

export function zoneBand(fraction: number): ZoneBand {
  const p = coveredPercent(fraction);
  if (p === null) return 'unknown';
  if (p >= COVERED_FROM_PERCENT) return 'good';
  if (p >= PARTLY_FROM_PERCENT) return 'partial';
  return 'poor';
}

export const bandWords: Record<ZoneBand, string> = {
  good: 'covered',
  partial: 'partly covered',
  poor: 'large gap',
  unknown: 'not computed',
};

/** Stroke (strong), fill (soft) and text colour per band, from the one palette: the plan and the sheet. */
export const bandColours: Record<ZoneBand, { stroke: string; fill: string; text: string }> = {
  good: { stroke: palette.go, fill: palette.goSoft, text: palette.go },
  partial: { stroke: palette.beaconPressed, fill: palette.beaconSoft, text: palette.asphalt },
  poor: { stroke: palette.stop, fill: palette.stopSoft, text: palette.stop },
  unknown: { stroke: palette.haze, fill: palette.ruleSoft, text: palette.haze },
};
