import type { MultiPolygon, Pair, Ring } from './polygon';

/**
 * Douglas–Peucker simplification of a closed ring (D. Douglas, T. Peucker, "Algorithms for the
 * reduction of the number of points required to represent a digitized line or its
 * caricature", The Canadian Cartographer 10(2), 1973): drops vertices while every dropped
 * vertex stays within `tolM` of the simplified outline, so the area changes by at most
 * tolM × perimeter. The ring is split at its vertex farthest from the first.
 */
export function simplifyRing(ring: Ring, tolM: number): Ring {
  const closed = ring.length > 1 && ring[0][0] === ring[ring.length - 1][0] && ring[0][1] === ring[ring.length - 1][1];
  const pts: Pair[] = closed ? ring : [...ring, ring[0]];
  const n = pts.length - 1;
  if (n < 4 || !(tolM > 0)) return pts;
  const keep = new Uint8Array(n + 1);
  keep[0] = 1;
  keep[n] = 1;
  let far = 0;
  let fd = -1;
  for (let i = 1; i < n; i++) {
    const d = Math.hypot(pts[i][0] - pts[0][0], pts[i][1] - pts[0][1]);
    if (d > fd) {
      fd = d;
      far = i;
    }
  }
  keep[far] = 1;
  const stack: number[] = [0, far, far, n];
  while (stack.length > 0) {
    const b = stack.pop() as number;
    const a = stack.pop() as number;
    const ax = pts[a][0];
    const ay = pts[a][1];
    const dx = pts[b][0] - ax;
    const dy = pts[b][1] - ay;
    const L = Math.hypot(dx, dy);
    let best = -1;
    let bi = -1;
    for (let i = a + 1; i < b; i++) {
      const d = L > 0 ? Math.abs((pts[i][0] - ax) * dy - (pts[i][1] - ay) * dx) / L : Math.hypot(pts[i][0] - ax, pts[i][1] - ay);
      if (d > best) {
        best = d;
        bi = i;
      }
    }
    if (best > tolM) {
      keep[bi] = 1;
      stack.push(a, bi, bi, b);
    }
  }
  const out: Ring = [];
  for (let i = 0; i <= n; i++) if (keep[i]) out.push(pts[i]);
  return out.length >= 4 ? out : pts;
}

/** {@link simplifyRing} applied to every ring of a multipolygon. */
export function simplifyMultiPolygon(mp: MultiPolygon, tolM: number): MultiPolygon {
  return mp.map((poly) => poly.map((ring) => simplifyRing(ring, tolM)));
}
