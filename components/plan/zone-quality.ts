/**
 * How well a zone is covered, in words as well as colour (colour alone fails in sunlight and for
 * colour-blind readers). The figure, the band, its words and its colours are one shared rule
 * (shared/zone-verdict.ts), used by the plan and the sheet alike.
 */
export { bandColours, bandWords, formatCoveredShare, zoneBand, type ZoneBand } from '@/shared/zone-verdict';
