import { clipRingToConvex } from './clip';
import { orient, ringLength, signedRingArea, type MultiPolygon, type Pair, type Polygon, type Ring } from './polygon';

/**
 * Signed area (m²) of the part of a ring inside a convex counter-clockwise polygon, by
 * Sutherland–Hodgman clipping (./clip.ts). The clipped contour may contain zero-width bridges
 * when the result has several pieces; they enclose no area, so the shoelace sum is still exact.
 * Sign follows the ring's orientation, so holes (clockwise) subtract.
 */
export function clippedRingArea(ring: Ring, convex: Ring): number {
  const inside = clipRingToConvex(ring, convex);
  return inside.length >= 3 ? signedRingArea(inside) : 0;
}

/**
 * Ear-clipping triangulation of a simple ring (H. Meisters, "Polygons have ears", 1975).
 * Returns counter-clockwise triangles whose union is the ring. O(n²); zones are small.
 */
export function triangulateRing(ring: Ring): Ring[] {
  const n = ringLength(ring);
  const pts: Pair[] = [];
  for (let i = 0; i < n; i++) pts.push(ring[i]);
  if (signedRingArea(ring) < 0) pts.reverse();
  const idx = pts.map((_, i) => i);
  const tris: Ring[] = [];
  let guard = 0;
  while (idx.length > 3 && guard++ < 10 * n * n) {
    let clipped = false;
    for (let k = 0; k < idx.length; k++) {
      const a = pts[idx[(k + idx.length - 1) % idx.length]];
      const b = pts[idx[k]];
      const c = pts[idx[(k + 1) % idx.length]];
      if (orient(a, b, c) <= 0) continue;
      let empty = true;
      for (const j of idx) {
        const p = pts[j];
        if (p === a || p === b || p === c) continue;
        if (orient(a, b, p) >= 0 && orient(b, c, p) >= 0 && orient(c, a, p) >= 0) {
          empty = false;
          break;
        }
      }
      if (!empty) continue;
      tris.push([a, b, c]);
      idx.splice(k, 1);
      clipped = true;
      break;
    }
    if (!clipped) break;
  }
  if (idx.length === 3) tris.push([pts[idx[0]], pts[idx[1]], pts[idx[2]]]);
  return tris;
}

/**
 * Convex pieces of a simple polygon with holes, each with a sign (+1 outer, −1 hole), so
 * that the area of any region inside the polygon is Σ sign·area(region ∩ piece).
 */
export function signedPieces(polygon: Polygon): { ring: Ring; sign: number }[] {
  const out: { ring: Ring; sign: number }[] = [];
  polygon.forEach((ring, i) => {
    for (const tri of triangulateRing(ring)) out.push({ ring: tri, sign: i === 0 ? 1 : -1 });
  });
  return out;
}

/**
 * Area (m²) of region ∩ zone, where the zone is given as signed convex pieces and the region's
 * rings are oriented outer counter-clockwise, holes clockwise (polygon-clipping's convention).
 */
export function intersectionAreaWithPieces(region: MultiPolygon, pieces: { ring: Ring; sign: number }[]): number {
  let area = 0;
  for (const { ring: piece, sign } of pieces) {
    for (const poly of region) {
      for (const ring of poly) area += sign * clippedRingArea(ring, piece);
    }
  }
  return Math.max(0, area);
}
