import { palette } from '@/constants/theme';

/**
 * How well a zone is covered, in words as well as colour (colour alone fails in sunlight and for
 * colour-blind readers). The figure, the band and its words are one shared rule
 * (shared/zone-verdict.ts); the colours are the app's.
 */
import type { ZoneBand } from '@/shared/zone-verdict';

export { bandWords, formatCoveredShare, zoneBand, type ZoneBand } from '@/shared/zone-verdict';

/** Stroke (strong) and fill (soft) per band, from the Yardlight palette. */
export const bandColours: Record<ZoneBand, { stroke: string; fill: string; text: string }> = {
  good: { stroke: palette.go, fill: palette.goSoft, text: palette.go },
  partial: { stroke: palette.beaconPressed, fill: palette.beaconSoft, text: palette.asphalt },
  poor: { stroke: palette.stop, fill: palette.stopSoft, text: palette.stop },
  unknown: { stroke: palette.haze, fill: palette.ruleSoft, text: palette.haze },
};
