/**
 * Figures that describe what a placed mirror actually shows to its actual viewer, read off the
 * traced floor region rather than an on-axis formula: how wide the seen floor spreads around the
 * mirror, how near and how far it reaches, and how far the eye is off the mirror's axis (the
 * on-axis field of view assumes 0°).
 */
import type { MultiPolygon, Pair, Pose, Vec3 } from '../optics';
import { pointInMultiPolygon } from '../optics';

export interface FloorSeenFigures {
  /**
   * Horizontal angle (rad) the seen floor spans as seen from the point under the mirror, from its
   * leftmost to its rightmost direction; 2π when the seen floor surrounds that point.
   */
  spreadRad: number;
  /** Horizontal distance (m) from the point under the mirror to the nearest floor point seen (0 when beneath it). */
  nearestM: number;
  /** Horizontal distance (m) from the point under the mirror to the farthest floor point seen. */
  farthestM: number;
}

const TWO_PI = 2 * Math.PI;

/** Distance from the origin to segment a–b (plan, metres). */
function originSegmentDistance(a: Pair, b: Pair): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t = len2 > 0 ? Math.max(0, Math.min(1, -(a[0] * dx + a[1] * dy) / len2)) : 0;
  return Math.hypot(a[0] + t * dx, a[1] + t * dy);
}

/**
 * The largest angular gap (rad) left by a set of arcs [start, start + length] on the circle;
 * 0 when they cover it all. Arcs may start anywhere and wrap past 2π.
 */
function largestGap(arcs: [number, number][]): number {
  const pieces: [number, number][] = [];
  for (const [s0, len] of arcs) {
    if (len >= TWO_PI) return 0;
    const s = ((s0 % TWO_PI) + TWO_PI) % TWO_PI;
    const e = s + len;
    if (e > TWO_PI) pieces.push([s, TWO_PI], [0, e - TWO_PI]);
    else pieces.push([s, e]);
  }
  if (pieces.length === 0) return TWO_PI;
  pieces.sort((p, q) => p[0] - q[0]);
  let gap = 0;
  let end = pieces[0][1];
  for (const [s, e] of pieces.slice(1)) {
    if (s > end) gap = Math.max(gap, s - end);
    end = Math.max(end, e);
  }
  // The gap that wraps from the last end back round to the first start.
  return Math.max(gap, TWO_PI - end + pieces[0][0]);
}

/**
 * Spread, nearest and farthest distance of a seen floor region around `footM` (the plan point
 * under the mirror's vertex). Each boundary edge, a straight segment, covers the arc between its
 * ends' directions (the shorter way round, as a segment not through the foot subtends less than
 * half a turn); the spread is a full turn less the largest direction no edge covers. Null for an
 * empty region.
 */
export function floorSeenFigures(region: MultiPolygon, footM: Pair): FloorSeenFigures | null {
  const arcs: [number, number][] = [];
  let nearestM = Infinity;
  let farthestM = 0;
  for (const polygon of region) {
    for (const ring of polygon) {
      for (let i = 0; i < ring.length; i++) {
        const a: Pair = [ring[i][0] - footM[0], ring[i][1] - footM[1]];
        const q = ring[(i + 1) % ring.length];
        const b: Pair = [q[0] - footM[0], q[1] - footM[1]];
        farthestM = Math.max(farthestM, Math.hypot(a[0], a[1]));
        nearestM = Math.min(nearestM, originSegmentDistance(a, b));
        const ta = Math.atan2(a[1], a[0]);
        let d = Math.atan2(b[1], b[0]) - ta;
        if (d > Math.PI) d -= TWO_PI;
        if (d < -Math.PI) d += TWO_PI;
        arcs.push(d >= 0 ? [ta, d] : [ta + d, -d]);
      }
    }
  }
  if (arcs.length === 0) return null;
  const inside = pointInMultiPolygon(region, footM);
  return {
    spreadRad: inside ? TWO_PI : TWO_PI - largestGap(arcs),
    nearestM: inside ? 0 : nearestM,
    farthestM,
  };
}

/** Angle (rad) between the mirror's axis and the direction from its vertex to the eye: 0 when the eye is on the axis. */
export function eyeOffAxisRad(pose: Pose, eyeM: Vec3): number {
  const v = pose.vertexM;
  const e: Vec3 = [eyeM[0] - v[0], eyeM[1] - v[1], eyeM[2] - v[2]];
  const n = Math.hypot(e[0], e[1], e[2]);
  const w = pose.axis;
  const c = (e[0] * w[0] + e[1] * w[1] + e[2] * w[2]) / (n * Math.hypot(w[0], w[1], w[2]));
  return Math.acos(Math.max(-1, Math.min(1, c)));
}
