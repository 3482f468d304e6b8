import { palette } from '@/constants/theme';

/**
 * How well a zone is covered, in words as well as colour (colour alone fails in sunlight and for
 * colour-blind readers). Bands: at least 95 % counts as covered, 60–95 % as partly covered, below
 * that as a gap worth fixing. The thresholds are a product choice, not taken from a standard.
 */
export type ZoneBand = 'good' | 'partial' | 'poor' | 'unknown';

export const GOOD_FROM = 0.95;
export const PARTIAL_FROM = 0.6;

export function zoneBand(fraction: number): ZoneBand {
  if (!Number.isFinite(fraction)) return 'unknown';
  if (fraction >= GOOD_FROM) return 'good';
  if (fraction >= PARTIAL_FROM) return 'partial';
  return 'poor';
}

export const bandWords: Record<ZoneBand, string> = {
  good: 'covered',
  partial: 'partly covered',
  poor: 'large gap',
  unknown: 'not computed',
};

/** Stroke (strong) and fill (soft) per band, from the Yardlight palette. */
export const bandColours: Record<ZoneBand, { stroke: string; fill: string; text: string }> = {
  good: { stroke: palette.go, fill: palette.goSoft, text: palette.go },
  partial: { stroke: palette.beaconPressed, fill: palette.beaconSoft, text: palette.asphalt },
  poor: { stroke: palette.stop, fill: palette.stopSoft, text: palette.stop },
  unknown: { stroke: palette.haze, fill: palette.ruleSoft, text: palette.haze },
};
