/**
 * The part of a zone no mirror shows: the zone minus the union of the coverage regions, in metres.
 * The plan on screen and the sheet both hatch it, from this one rule. Through the robust booleans;
 * if even those fail, a sentence says the gap could not be drawn rather than showing no gap.
 */
import type { MultiPolygon, Ring } from './polygon';
import { robustDifference, robustUnion } from './robust-boolean';

export type UncoveredPart = { ok: true; region: MultiPolygon } | { ok: false; problem: string };

export function uncoveredPart(zone: Ring, regions: readonly MultiPolygon[], zoneName: string): UncoveredPart {
  const nonEmpty = regions.filter((r) => r.length > 0);
  try {
    if (nonEmpty.length === 0) return { ok: true, region: [[zone]] };
    const merged = nonEmpty.length === 1 ? nonEmpty[0] : robustUnion(nonEmpty[0], ...nonEmpty.slice(1));
    return { ok: true, region: robustDifference([zone], merged) };
  } catch {
    return {
      ok: false,
      problem: `The uncovered part of “${zoneName}” could not be drawn (its outline and the coverage meet at odd angles); its percentage still stands.`,
    };
  }
}
