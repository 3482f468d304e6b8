/**
 * Planar polygons in polygon-clipping's (GeoJSON-like) format: a Ring is a list of [x, y]
 * pairs in metres, a Polygon is an outer ring followed by hole rings, a MultiPolygon is a
 * list of Polygons. Rings may or may not repeat their first point at the end.
 */
import { boundsOfPoints } from './bounds';

export type Pair = [number, number];
export type Ring = Pair[];
export type Polygon = Ring[];
export type MultiPolygon = Polygon[];

/** Number of distinct vertices of a ring (ignores a closing repeat of the first point). */
export function ringLength(ring: Ring): number {
  const n = ring.length;
  if (n > 1 && ring[0][0] === ring[n - 1][0] && ring[0][1] === ring[n - 1][1]) return n - 1;
  return n;
}

/**
 * Signed area of a ring in m², positive when counter-clockwise.
 * Source: the shoelace (surveyor's) formula, A = ½ Σ (xᵢ·yᵢ₊₁ − xᵢ₊₁·yᵢ); computed about the
 * first vertex to keep rounding small for plans far from the origin.
 */
export function signedRingArea(ring: Ring): number {
  const n = ringLength(ring);
  if (n < 3) return 0;
  const x0 = ring[0][0];
  const y0 = ring[0][1];
  let twice = 0;
  for (let i = 1; i < n - 1; i++) {
    const ax = ring[i][0] - x0;
    const ay = ring[i][1] - y0;
    const bx = ring[i + 1][0] - x0;
    const by = ring[i + 1][1] - y0;
    twice += ax * by - bx * ay;
  }
  return twice / 2;
}

/** Area of a polygon in m²: outer ring minus holes (orientation of the input does not matter). */
export function polygonArea(polygon: Polygon): number {
  if (polygon.length === 0) return 0;
  let area = Math.abs(signedRingArea(polygon[0]));
  for (let i = 1; i < polygon.length; i++) area -= Math.abs(signedRingArea(polygon[i]));
  return Math.max(0, area);
}

/** Area of a multipolygon in m², assuming its polygons do not overlap (polygon-clipping output). */
export function multiPolygonArea(mp: MultiPolygon): number {
  let area = 0;
  for (const p of mp) area += polygonArea(p);
  return area;
}

/** Orientation of the triangle (a, b, c): > 0 counter-clockwise, < 0 clockwise, 0 collinear. */
export function orient(a: Pair, b: Pair, c: Pair): number {
  return (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
}

function onSegment(a: Pair, b: Pair, p: Pair): boolean {
  return Math.min(a[0], b[0]) <= p[0] && p[0] <= Math.max(a[0], b[0]) && Math.min(a[1], b[1]) <= p[1] && p[1] <= Math.max(a[1], b[1]);
}

/** True when closed segments ab and cd share at least one point. */
export function segmentsIntersect(a: Pair, b: Pair, c: Pair, d: Pair): boolean {
  const d1 = orient(c, d, a);
  const d2 = orient(c, d, b);
  const d3 = orient(a, b, c);
  const d4 = orient(a, b, d);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) {
    return true;
  }
  if (d1 === 0 && onSegment(c, d, a)) return true;
  if (d2 === 0 && onSegment(c, d, b)) return true;
  if (d3 === 0 && onSegment(a, b, c)) return true;
  if (d4 === 0 && onSegment(a, b, d)) return true;
  return false;
}

/**
 * True when the ring is a simple polygon: at least three distinct vertices, finite
 * coordinates, non-zero area, and no two edges touching except neighbours at their shared
 * vertex. O(n²), meant for zones drawn by hand, not for traced regions.
 */
export function isSimpleRing(ring: Ring): boolean {
  const n = ringLength(ring);
  if (n < 3) return false;
  for (let i = 0; i < n; i++) {
    const p = ring[i];
    if (!Array.isArray(p) || p.length !== 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
      return false;
    }
  }
  if (signedRingArea(ring) === 0) return false;
  for (let i = 0; i < n; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % n];
    if (a[0] === b[0] && a[1] === b[1]) return false;
    for (let j = i + 1; j < n; j++) {
      const adjacent = j === i + 1 || (i === 0 && j === n - 1);
      const c = ring[j];
      const d = ring[(j + 1) % n];
      if (adjacent) {
        // Neighbours share one vertex; they must not fold back onto each other.
        const shared = j === i + 1 ? b : a;
        const other1 = j === i + 1 ? a : b;
        const other2 = j === i + 1 ? d : c;
        if (orient(other1, shared, other2) === 0) {
          const v1x = other1[0] - shared[0];
          const v1y = other1[1] - shared[1];
          const v2x = other2[0] - shared[0];
          const v2y = other2[1] - shared[1];
          if (v1x * v2x + v1y * v2y > 0) return false;
        }
        continue;
      }
      if (segmentsIntersect(a, b, c, d)) return false;
    }
  }
  return true;
}

/**
 * Winding number of a ring around point p (non-zero rule). Source: the crossing-number /
 * winding-number test as in D. Sunday's formulation (sign of the crossing edge).
 */
export function windingNumber(ring: Ring, p: Pair): number {
  const n = ringLength(ring);
  let wn = 0;
  for (let i = 0; i < n; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % n];
    if (a[1] <= p[1]) {
      if (b[1] > p[1] && orient(a, b, p) > 0) wn++;
    } else if (b[1] <= p[1] && orient(a, b, p) < 0) {
      wn--;
    }
  }
  return wn;
}

/** True when p lies inside the polygon (inside the outer ring, outside every hole). */
export function pointInPolygon(polygon: Polygon, p: Pair): boolean {
  if (polygon.length === 0 || windingNumber(polygon[0], p) === 0) return false;
  for (let i = 1; i < polygon.length; i++) if (windingNumber(polygon[i], p) !== 0) return false;
  return true;
}

/** True when p lies inside any polygon of the multipolygon. */
export function pointInMultiPolygon(mp: MultiPolygon, p: Pair): boolean {
  for (const poly of mp) if (pointInPolygon(poly, p)) return true;
  return false;
}

/** Distance from p to segment ab, in the units of the points (metres on the plan, pixels on screen). */
export function pointSegmentDistance(p: Pair, a: Pair, b: Pair): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  let t = len2 > 0 ? ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2 : 0;
  t = Math.max(0, Math.min(1, t));
  return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy));
}

/** Distance from p to the nearest edge of any ring of the multipolygon, metres. */
export function distanceToBoundary(mp: MultiPolygon, p: Pair): number {
  let best = Infinity;
  for (const poly of mp) {
    for (const ring of poly) {
      const n = ringLength(ring);
      for (let i = 0; i < n; i++) {
        best = Math.min(best, pointSegmentDistance(p, ring[i], ring[(i + 1) % n]));
      }
    }
  }
  return best;
}

/**
 * A closed counter-clockwise ring approximating a circle by an inscribed regular polygon.
 * The chord error (largest gap to the true circle) is r·(1 − cos(π/segments)).
 */
export function circleRing(centre: Pair, radiusM: number, segments: number): Ring {
  const ring: Ring = [];
  for (let k = 0; k < segments; k++) {
    const a = (2 * Math.PI * k) / segments;
    ring.push([centre[0] + radiusM * Math.cos(a), centre[1] + radiusM * Math.sin(a)]);
  }
  ring.push([ring[0][0], ring[0][1]]);
  return ring;
}

/** Axis-aligned bounding box [minX, minY, maxX, maxY] of a multipolygon's outer rings (infinite and inverted when empty). */
export function bbox(mp: MultiPolygon): [number, number, number, number] {
  const b = boundsOfPoints(mp.flatMap((poly) => poly[0] ?? []));
  return b ? [b.minX, b.minY, b.maxX, b.maxY] : [Infinity, Infinity, -Infinity, -Infinity];
}
