/**
 * Sutherland–Hodgman clipping (I. Sutherland, G. Hodgman, "Reentrant polygon clipping", CACM
 * 17(1), 1974): the one implementation, for points of any dimension. A closed polygon (no repeated
 * closing point) is cut by one half-space at a time; what remains of a concave polygon may
 * contain zero-width bridges, which enclose no area.
 */
import { ringLength, type Pair, type Ring } from './polygon';

/** The part of a closed polygon where the affine function f is ≥ 0. */
export function clipToHalfSpace<P extends readonly number[]>(poly: readonly P[], f: (p: P) => number): P[] {
  const out: P[] = [];
  for (let i = 0; i < poly.length; i++) {
    const p = poly[i];
    const q = poly[(i + 1) % poly.length];
    const fp = f(p);
    const fq = f(q);
    if (fp >= 0) out.push(p);
    if (fp >= 0 !== fq >= 0) {
      const t = fp / (fp - fq);
      out.push(p.map((v, k) => v + t * (q[k] - v)) as unknown as P);
    }
  }
  return out;
}

/** The part of a closed polygon where lo ≤ f(p) ≤ hi, for an affine f. */
export function clipToSlab<P extends readonly number[]>(poly: readonly P[], f: (p: P) => number, lo: number, hi: number): P[] {
  return clipToHalfSpace(
    clipToHalfSpace(poly, (p) => f(p) - lo),
    (p) => hi - f(p),
  );
}

/** A ring cut to the box [x0, x1] × [y0, y1]; the result repeats its first point (empty when nothing is left). */
export function clipRingToBox(ring: Ring, x0: number, y0: number, x1: number, y1: number): Ring {
  let pts: Pair[] = ring.slice(0, ringLength(ring));
  pts = clipToSlab(pts, (p) => p[0], x0, x1);
  pts = clipToSlab(pts, (p) => p[1], y0, y1);
  return pts.length > 0 ? [...pts, [pts[0][0], pts[0][1]]] : pts;
}

/** A ring cut to a convex counter-clockwise polygon (the part on the left of every edge). */
export function clipRingToConvex(ring: Ring, convex: Ring): Pair[] {
  const m = ringLength(convex);
  let pts: Pair[] = ring.slice(0, ringLength(ring));
  for (let e = 0; e < m && pts.length > 0; e++) {
    const [ax, ay] = convex[e];
    const [bx, by] = convex[(e + 1) % m];
    pts = clipToHalfSpace(pts, (p) => (bx - ax) * (p[1] - ay) - (by - ay) * (p[0] - ax));
  }
  return pts;
}
