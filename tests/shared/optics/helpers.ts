import { distanceToBoundary, pointInMultiPolygon, type MultiPolygon } from '../../../shared/geometry/polygon';
import { visibleInMirror, type Mirror, type Pose, type Vec3, type Wall } from '../../../shared/optics';

/** Deterministic pseudo-random numbers (mulberry32) so failures can be replayed. */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** What both region checks need: the scene and the region traced for it. */
export interface RegionCase {
  region: MultiPolygon;
  mirror: Mirror;
  pose: Pose;
  eyeM: Vec3;
  maxRangeM: number;
  walls?: Wall[];
  planeHeightM?: number;
}

/** The exact point test (visibleInMirror) for plan point p of a region check, and whether the region holds p. */
export function regionVersusExact(c: RegionCase, p: Vec3): { inRegion: boolean; exact: boolean } {
  const { visible } = visibleInMirror({ mirror: c.mirror, pose: c.pose, eyeM: c.eyeM, pointM: p, walls: c.walls, maxRangeM: c.maxRangeM });
  return { inRegion: pointInMultiPolygon(c.region, [p[0], p[1]]), exact: visible };
}

/**
 * Compares the coverage polygon with the exact point test at random plan points in a box,
 * skipping points within `marginM` of the polygon's edge. Returns counts and the largest
 * distance from the edge of any disagreeing point (over all points, margin or not).
 */
export function agreement(
  args: RegionCase & {
    halfBoxM: number;
    n: number;
    marginM: number;
    seed: number;
  },
): { checked: number; inside: number; disagree: number; worstM: number } {
  const r = rng(args.seed);
  const v = args.pose.vertexM;
  let checked = 0;
  let inside = 0;
  let disagree = 0;
  let worstM = 0;
  for (let i = 0; i < args.n; i++) {
    const p: Vec3 = [v[0] + (2 * r() - 1) * args.halfBoxM, v[1] + (2 * r() - 1) * args.halfBoxM, args.planeHeightM ?? 0];
    const { inRegion: inPoly, exact } = regionVersusExact(args, p);
    if (inPoly !== exact) worstM = Math.max(worstM, distanceToBoundary(args.region, [p[0], p[1]]));
    if (distanceToBoundary(args.region, [p[0], p[1]]) < args.marginM) continue;
    checked++;
    if (exact) inside++;
    if (inPoly !== exact) disagree++;
  }
  return { checked, inside, disagree, worstM };
}
