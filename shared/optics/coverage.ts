import {
  bbox,
  multiPolygonArea,
  pointInMultiPolygon,
  pointSegmentDistance,
  polygonArea,
  ringLength,
  segmentsIntersect,
  windingNumber,
  type MultiPolygon,
  type Pair,
  type Ring,
} from '../geometry/polygon';
import { boundsOfPoints, boxesMeet, packedPoints, segmentBounds } from '../geometry/bounds';
import { clipRingToBox, clipToHalfSpace } from '../geometry/clip';
import { clipOrientedCurvesToDisc } from '../geometry/clip-disc';
import { simplifyMultiPolygon, simplifyRing } from '../geometry/simplify';
import { robustDifference } from '../geometry/robust-boolean';
import type { Vec3 } from '../geometry/vec3';
import { OpticsInputError, requireNonNegative, requirePoint, requirePositive } from './errors';
import { onPortion, placeMirror, type Mirror, type PlacedMirror } from './mirror';
import { sphereReflectionPoint } from './alhazen';
import { fanBoundary } from './fan-boundary';
import type { Pose } from './pose';
import { traceOutline, visibleOutline, type Outline, type TracedFan } from './trace';
import { checkWalls, wallShadowRing, type Wall } from './walls';
import { eyeSideShadows } from './eye-side';
import { MOUNT_TOLERANCE_M, sideOfWallLine } from './mount';
import { wallsInBox } from './wall-index';
import { OUTLINE_SIMPLIFY_M, SLIVER_AREA_M2 } from '../geometry/tolerance';

export type CoverageInput = {
  mirror: Mirror;
  pose: Pose;
  /** The viewer's eye, metres. */
  eyeM: Vec3;
  /** Height of the plane on which coverage is measured, metres (0 = floor). */
  planeHeightM?: number;
  /** Coverage ends this far (horizontally) from the point under the mirror's vertex, metres. */
  maxRangeM: number;
  walls?: readonly Wall[];
  /** Points traced along the visible outline of the mirror (default 256). */
  rimSamples?: number;
  /** Largest angle of one chord of the range circle, radians (default: chords within 5 mm of the circle). */
  arcStepRad?: number;
  /**
   * Douglas–Peucker tolerance applied to the outline before walls and scoring, metres
   * (default 0.001; 0 keeps every traced point). Area changes by at most this × perimeter.
   */
  simplifyM?: number;
  /** Largest gap, metres, between a wall shadow's traced edge and its straight pieces (default 0.005). */
  wallToleranceM?: number;
};

export type CoverageResult = {
  /** Seen part of the plane, polygon-clipping's MultiPolygon in plan x, y (metres). */
  region: MultiPolygon;
  /** Its area, m² (shoelace). */
  areaM2: number;
};

export const DEFAULT_RIM_SAMPLES = 256;

/** Horizontal distance at which rays that miss the plane are parked before the range clip. */
export function farDistanceM(pm: PlacedMirror, maxRangeM: number): number {
  return 3 * maxRangeM + 4 * pm.R + 10;
}

export type PreparedCoverage = {
  pm: PlacedMirror;
  eyeM: Vec3;
  h0: number;
  maxRangeM: number;
  farM: number;
  outline: Outline;
  fan: TracedFan;
};

/** Validates the input and traces the fan; shared by {@link coverage} and the sizing search. */
export function prepareCoverage(input: CoverageInput): PreparedCoverage {
  const pm = placeMirror(input.mirror, input.pose);
  const eyeM = requirePoint('eyeM', input.eyeM, 'eye position');
  const h0 = requireNonNegative('planeHeightM', input.planeHeightM ?? 0, 'plane height');
  const maxRangeM = requirePositive('maxRangeM', input.maxRangeM, 'range');
  const samples = input.rimSamples ?? DEFAULT_RIM_SAMPLES;
  if (!Number.isInteger(samples) || samples < 8 || samples > 1_000_000) {
    throw new OpticsInputError('rimSamples', 'Trace between 8 and 1,000,000 rays around the rim.');
  }
  const farM = farDistanceM(pm, maxRangeM);
  const outline = visibleOutline(pm, eyeM, samples);
  const fan = traceOutline(pm, eyeM, outline, h0, farM);
  if (!(lowestSeenPointZ(pm, eyeM, fan.minZ) > h0)) {
    throw new OpticsInputError(
      'planeHeightM',
      'The mirror reaches down to the plane being measured; mount it higher or measure a lower plane.',
    );
  }
  return { pm, eyeM, h0, maxRangeM, farM, outline, fan };
}

/**
 * Height of the lowest point of the part of the mirror the eye sees. Height restricted to a
 * sphere has its only minimum at the bottom point C − R·ẑ, so the lowest point is that one
 * when the eye sees it on the mirror, and otherwise lies on the outline (`outlineMinZ`).
 */
function lowestSeenPointZ(pm: PlacedMirror, eyeM: Vec3, outlineMinZ: number): number {
  const down: Vec3 = [0, 0, -1];
  const ez = eyeM[2] - pm.C[2];
  const ed = Math.hypot(eyeM[0] - pm.C[0], eyeM[1] - pm.C[1], ez);
  if (onPortion(pm, down) && -ez / ed >= pm.R / ed) return Math.min(outlineMinZ, pm.C[2] - pm.R);
  return outlineMinZ;
}

/**
 * Chord angle for the range circle such that no chord strays more than 5 mm inside the circle:
 * sagitta r(1 − cos(θ/2)) = 0.005 m, and never coarser than 2π/64. The range is a chosen limit
 * (often the recognisable range), so millimetres on it carry no meaning.
 */
export function defaultArcStepRad(maxRangeM: number): number {
  return Math.min((2 * Math.PI) / 64, 2 * Math.acos(Math.max(-1, 1 - 0.005 / maxRangeM)));
}

/** Largest distance, metres, between a traced fan edge and the true edge near the range disc. */
export const FAN_EDGE_TOLERANCE_M = 0.003;

/**
 * The traced fan clipped to the range circle, before walls: the boundary pieces from
 * {@link fanBoundary} (oriented, so a region that lies outside the outline's image is not
 * mistaken for one inside it) walked with the range circle. When no piece enters the disc the
 * whole disc is in or out, decided by the exact point test at its centre.
 */
export function fanRegion(p: PreparedCoverage, arcStepRad = defaultArcStepRad(p.maxRangeM)): MultiPolygon {
  const v = p.pm.pose.vertexM;
  const disc = { cx: v[0], cy: v[1], r: p.maxRangeM };
  const { curves } = fanBoundary(p.pm, p.eyeM, p.outline, p.fan, p.h0, p.farM, disc, FAN_EDGE_TOLERANCE_M);
  return clipOrientedCurvesToDisc(curves, disc.cx, disc.cy, disc.r, arcStepRad, () => {
    const m = sphereReflectionPoint(p.pm.C, p.pm.R, p.eyeM, [v[0], v[1], p.h0]);
    return m !== null && onPortion(p.pm, m);
  });
}

/**
 * The part of a plane (z = planeHeightM) that the eye sees in the mirror, by exact 3-D ray
 * tracing: rays from the eye to the outline of the mirror's visible part reflect about the
 * local normal (r = i − 2(i·n)n) and meet the plane; a convex mirror maps its surface
 * one-to-one onto the reflected rays, so inside the range disc (`maxRangeM` around the point
 * under the vertex) the region is bounded by the images of the outline pieces whose rays meet
 * the plane, oriented by the map itself (see `fanBoundary`: sightlines reflected upward, even
 * in the middle of the mirror, are handled). Then the floor hidden by each
 * wall is removed: on the mirror → floor leg (see `wallShadowRing`) and on the eye → mirror
 * leg (see `eyeSideShadows`); each states its approximation.
 *
 * Accuracy: the outline is a polygon through exact traced points, `rimSamples` of them plus
 * exact corners, with chords refined near the range disc until their traced midpoints lie
 * within 3 mm; the range circle is a polygon with chords of `arcStepRad`; the result is then
 * simplified within `simplifyM` (1 mm). Property tests over every accepted input find no
 * point farther than 2 cm from the polygon's edge where it and the exact point test disagree.
 */
export function coverage(input: CoverageInput): CoverageResult {
  const p = prepareCoverage(input);
  const walls = checkWalls(input.walls);
  const arcStep = input.arcStepRad ?? defaultArcStepRad(p.maxRangeM);
  if (!(arcStep > 0 && arcStep <= Math.PI / 4)) {
    throw new OpticsInputError('arcStepRad', 'The range circle step must be between 0 and 45°.');
  }
  const simplifyM = input.simplifyM ?? OUTLINE_SIMPLIFY_M;
  if (!(simplifyM >= 0 && simplifyM <= 0.1)) {
    throw new OpticsInputError('simplifyM', 'The outline simplification must be between 0 and 0.1 m.');
  }
  let region = fanRegion(p, arcStep);
  if (simplifyM > 0) region = simplifyMultiPolygon(region, simplifyM);
  if (walls.length > 0 && region.length > 0) region = subtractWalls(p, region, walls, input.wallToleranceM ?? 0.005);
  return { region, areaM2: multiPolygonArea(region) };
}

/** Walls traced per boolean step; after each step the region is smaller and more walls drop out. */
const WALL_BATCH = 12;

/**
 * Removes wall shadows from a region. Only walls that can touch the fan are traced:
 * - an R-tree over the walls' plan boxes ({@link wallsInBox}) keeps the walls that meet the box
 *   around the region and the mirror (a wall can hide a floor point only if it stands between
 *   the point and the reflection point, which lies within `reach` of the vertex); for the eye →
 *   mirror leg, the box around the eye and the mirror;
 * - walls beyond the range circle, and walls whose bounding wedge ({@link shadowBound}) misses
 *   the region, are skipped before the exact (Alhazen) shadow is traced;
 * - walls are taken nearest first, in batches: each batch's shadows that still meet the region
 *   are cut to its box, simplified within `tolM`/5, and removed with one boolean difference, so
 *   later walls are tested against what is left (behind dense racking little is).
 * Every skip is exact (it cannot change the result); the simplification moves a shadow's edge by
 * at most tolM/5.
 */
export function subtractWalls(p: PreparedCoverage, region: MultiPolygon, walls: readonly Wall[], tolM: number): MultiPolygon {
  const v = p.pm.pose.vertexM;
  // Every reflection point lies within `reach` of the vertex (the outline bounds the mirror).
  let reach = 0;
  for (let j = 0; j < p.fan.count; j++) {
    reach = Math.max(reach, Math.hypot(p.fan.point[3 * j] - v[0], p.fan.point[3 * j + 1] - v[1], p.fan.point[3 * j + 2] - v[2]));
  }
  const keepArea = (mp: MultiPolygon): MultiPolygon => mp.filter((poly) => polygonArea(poly) > SLIVER_AREA_M2);

  // Eye → mirror leg first: a wall in front of the mirror can hide much of the fan at once.
  const leg = boundsOfPoints([[p.eyeM[0], p.eyeM[1]], ...packedPoints(p.fan.point, p.fan.count, 3)])!;
  const eyeWalls = wallsInBox(walls, leg.minX, leg.minY, leg.maxX, leg.maxY).map((i) => walls[i]);
  const eyeShadows = eyeSideShadows(p.pm, p.eyeM, p.fan, eyeWalls, p.h0, p.farM, p.maxRangeM);
  // Slivers left where a shadow's traced edge runs along the region's own edge enclose no
  // meaningful area (below one square millimetre); drop them.
  if (eyeShadows.length > 0) region = keepArea(robustDifference(region, ...eyeShadows));
  if (region.length === 0) return region;

  // Mirror → floor leg.
  let [minX, minY, maxX, maxY] = bbox(region);
  const candidates = wallsInBox(
    walls,
    Math.min(minX, v[0] - reach),
    Math.min(minY, v[1] - reach),
    Math.max(maxX, v[0] + reach),
    Math.max(maxY, v[1] + reach),
  )
    .map((i) => ({ w: walls[i], d: pointSegmentDistance([v[0], v[1]], walls[i].aM, walls[i].bM) }))
    .filter((c) => c.w.heightM > p.h0 && c.d < p.maxRangeM)
    .sort((a, b) => a.d - b.d);
  for (let k = 0; k < candidates.length && region.length > 0; k += WALL_BATCH) {
    const shadows: Ring[][] = [];
    for (const { w } of candidates.slice(k, k + WALL_BATCH)) {
      // Still able to stand between the mirror and what is left of the region?
      const reachBox = {
        minX: Math.min(minX, v[0] - reach),
        minY: Math.min(minY, v[1] - reach),
        maxX: Math.max(maxX, v[0] + reach),
        maxY: Math.max(maxY, v[1] + reach),
      };
      if (!boxesMeet(segmentBounds(w.aM, w.bM), reachBox)) continue;
      const bound = shadowBound(w, v, reach, p.farM);
      if (bound) {
        const cut = clipRingToBox(bound, minX, minY, maxX, maxY);
        if (cut.length < 4 || !overlaps(region, cut)) continue;
      }
      // A wall with the whole mirror on one side of its line (the wall the mirror hangs on, or one
      // beside it) hides only floor on its other side: a reflected sightline from the mirror to a
      // point on the mirror's side stays on that side and never crosses the line.
      const beyond = beyondWallLine(p.pm, w);
      if (beyond && region.every((poly) => poly.every((r) => r.every((q) => beyond(q) <= MOUNT_TOLERANCE_M)))) continue;
      let ring = wallShadowRing(p.pm, p.eyeM, w, p.h0, p.farM, tolM);
      if (ring && beyond) {
        const kept = clipToHalfSpace(ring.slice(0, ringLength(ring)), beyond);
        ring = kept.length >= 3 ? [...kept, [kept[0][0], kept[0][1]]] : null;
      }
      if (!ring) continue;
      // Cut to the region's box; a shadow that misses the region costs the grid sweep little.
      const cut = clipRingToBox(ring, minX - 0.01, minY - 0.01, maxX + 0.01, maxY + 0.01);
      if (cut.length >= 4) shadows.push([simplifyRing(cut, tolM / 5)]);
    }
    if (shadows.length === 0) continue;
    region = keepArea(robustDifference(region, ...shadows));
    if (region.length > 0) [minX, minY, maxX, maxY] = bbox(region);
  }
  return region;
}

/**
 * For a wall with the whole mirror body on one side of its line: the signed distance of a plan
 * point beyond that line (positive on the side away from the mirror). Null when the body reaches
 * across the line.
 */
function beyondWallLine(pm: PlacedMirror, w: Wall): ((q: Pair) => number) | null {
  const side = sideOfWallLine(pm, w);
  if (side === 0) return null;
  const ex = w.bM[0] - w.aM[0];
  const ey = w.bM[1] - w.aM[1];
  const L = Math.hypot(ex, ey);
  const nx = (-ey / L) * -side;
  const ny = (ex / L) * -side;
  return (q) => nx * (q[0] - w.aM[0]) + ny * (q[1] - w.aM[1]);
}

/**
 * A cheap polygon sure to contain a wall's shadow, whatever the reflection point within
 * `reach` of the vertex: every shadow point lies on a ray from a reflection point P through the
 * wall's foot segment A–B, beyond it. The direction from A is within asin(reach/|A − V|) of the
 * direction from the vertex V, so the wedge behind A–B bounded by the rays from A and from B
 * turned outward by those angles, out to `farM`, contains the shadow. Returns null when the
 * vertex is too close to the wall for the bound (then the exact shadow is always computed).
 */
export function shadowBound(w: Wall, v: Vec3, reach: number, farM: number): Ring | null {
  const A = w.aM;
  const B = w.bM;
  const ax = A[0] - v[0];
  const ay = A[1] - v[1];
  const bx = B[0] - v[0];
  const by = B[1] - v[1];
  const la = Math.hypot(ax, ay);
  const lb = Math.hypot(bx, by);
  if (la <= reach * 1.5 || lb <= reach * 1.5 || pointSegmentDistance([v[0], v[1]], w.aM, w.bM) <= reach * 1.5) return null;
  // Outward: away from the other end, seen from V.
  const side = ax * by - ay * bx >= 0 ? 1 : -1; // sign of the turn from A to B about V
  const da = -side * Math.asin(reach / la);
  const db = side * Math.asin(reach / lb);
  const rot = (x: number, y: number, l: number, t: number): Pair => {
    const c = Math.cos(t);
    const s = Math.sin(t);
    return [((x * c - y * s) / l) * farM, ((x * s + y * c) / l) * farM];
  };
  const fa = rot(ax, ay, la, da);
  const fb = rot(bx, by, lb, db);
  return [
    [A[0], A[1]],
    [B[0], B[1]],
    [B[0] + fb[0], B[1] + fb[1]],
    [A[0] + fa[0], A[1] + fa[1]],
    [A[0], A[1]],
  ];
}

/**
 * Exact test that a ring and a region share some area or boundary: an edge crossing, or one
 * inside the other. Used only to skip boolean work that could not change the result.
 */
export function overlaps(region: MultiPolygon, ring: Ring): boolean {
  const box = boundsOfPoints(ring);
  if (!box) return false;
  const nr = ringLength(ring);
  for (const poly of region) {
    for (const rr of poly) {
      const n = ringLength(rr);
      for (let i = 0; i < n; i++) {
        const a = rr[i];
        const b = rr[(i + 1) % n];
        if (!boxesMeet(segmentBounds(a, b), box)) continue;
        for (let j = 0; j < nr; j++) if (segmentsIntersect(a, b, ring[j], ring[(j + 1) % nr])) return true;
      }
    }
    if (poly.length > 0 && windingNumber(ring, poly[0][0]) !== 0) return true;
  }
  return ring.length > 0 && pointInMultiPolygon(region, ring[0]);
}
