import { distanceToBoundary } from '../../../shared/geometry/polygon';
import type { Vec3 } from '../../../shared/optics';
import { regionVersusExact, rng, type RegionCase } from './helpers';

export type Disagreement = { point: Vec3; inRegion: boolean; seen: boolean; edgeM: number };

/**
 * Compares a coverage region with the exact point test at `n` random points spread evenly
 * over the range disc (area-uniform), skipping points within `marginM` of the region's edge or
 * of the range circle (whose chords lie up to 5 mm inside it). Returns how many points were
 * compared, how many of them the point test sees, and every disagreement found.
 */
export function regionAgreement(
  args: RegionCase & {
    n: number;
    marginM: number;
    seed: number;
  },
): { checked: number; seen: number; disagreements: Disagreement[] } {
  const r = rng(args.seed);
  const v = args.pose.vertexM;
  let checked = 0;
  let seen = 0;
  const disagreements: Disagreement[] = [];
  for (let i = 0; i < args.n; i++) {
    const rad = args.maxRangeM * Math.sqrt(r());
    const ang = 2 * Math.PI * r();
    if (args.maxRangeM - rad < args.marginM) continue;
    const p: Vec3 = [v[0] + rad * Math.cos(ang), v[1] + rad * Math.sin(ang), args.planeHeightM ?? 0];
    const edgeM = distanceToBoundary(args.region, [p[0], p[1]]);
    if (edgeM < args.marginM) continue;
    checked++;
    const { inRegion, exact } = regionVersusExact(args, p);
    if (exact) seen++;
    if (inRegion !== exact) disagreements.push({ point: p, inRegion, seen: exact, edgeM });
  }
  return { checked, seen, disagreements };
}
