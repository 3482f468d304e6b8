/**
 * Boolean operations on polygons (polygon-clipping) that do not give up on nearly degenerate
 * input. polygon-clipping is exact in principle but, in floating point, occasionally throws
 * ("Unable to find segment … in SweepLine tree", "Unable to complete output ring") when edges
 * are nearly collinear or nearly share vertices — common with wall shadows that run along the
 * coverage outline. We retry on coordinates snapped to ever coarser grids, up to 1 mm, which is
 * inside the engine's stated accuracy (outlines are simplified within 1 mm anyway).
 */
import { difference, intersection, union } from 'polygon-clipping';
import type { MultiPolygon, Polygon, Ring } from './polygon';

/** Grid steps tried in turn, metres: none, 1 µm, 10 µm, 0.1 mm, 1 mm. */
export const SNAP_STEPS_M = [0, 1e-6, 1e-5, 1e-4, 1e-3] as const;

function snapRing(ring: Ring, q: number): Ring | null {
  const out: Ring = [];
  for (const [x, y] of ring) {
    const p: [number, number] = [Math.round(x / q) * q, Math.round(y / q) * q];
    const last = out[out.length - 1];
    if (!last || last[0] !== p[0] || last[1] !== p[1]) out.push(p);
  }
  while (out.length > 1 && out[0][0] === out[out.length - 1][0] && out[0][1] === out[out.length - 1][1]) out.pop();
  return out.length >= 3 ? out : null;
}

function snapPolygon(poly: Polygon, q: number): Polygon | null {
  const outer = poly[0] ? snapRing(poly[0], q) : null;
  if (!outer) return null;
  const holes = poly.slice(1).map((r) => snapRing(r, q)).filter((r): r is Ring => r !== null);
  return [outer, ...holes];
}

/** Snaps a MultiPolygon to a grid of q metres (q = 0 leaves it as is), dropping rings that collapse. */
export function snapMultiPolygon(mp: MultiPolygon, q: number): MultiPolygon {
  if (q === 0) return mp;
  return mp.map((p) => snapPolygon(p, q)).filter((p): p is Polygon => p !== null);
}

type Geom = Polygon | MultiPolygon;
/** A Polygon's first element is a ring of pairs (numbers two levels down); a MultiPolygon's is a polygon. */
const asMulti = (g: Geom): MultiPolygon => (g.length === 0 ? [] : typeof (g as Polygon)[0][0]?.[0] === 'number' ? [g as Polygon] : (g as MultiPolygon));

function withRetries(op: (q: number) => MultiPolygon): MultiPolygon {
  let last: unknown;
  for (const q of SNAP_STEPS_M) {
    try {
      return op(q);
    } catch (e) {
      last = e;
    }
  }
  throw last;
}

export function robustDifference(subject: Geom, ...clips: Geom[]): MultiPolygon {
  return withRetries((q) =>
    difference(snapMultiPolygon(asMulti(subject), q), ...clips.map((c) => snapMultiPolygon(asMulti(c), q))),
  );
}

export function robustUnion(first: Geom, ...rest: Geom[]): MultiPolygon {
  return withRetries((q) => union(snapMultiPolygon(asMulti(first), q), ...rest.map((c) => snapMultiPolygon(asMulti(c), q))));
}

export function robustIntersection(first: Geom, ...rest: Geom[]): MultiPolygon {
  return withRetries((q) =>
    intersection(snapMultiPolygon(asMulti(first), q), ...rest.map((c) => snapMultiPolygon(asMulti(c), q))),
  );
}
