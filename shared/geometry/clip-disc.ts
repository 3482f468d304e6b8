import type { MultiPolygon, Ring } from './polygon';

/**
 * Intersection of a region bounded by one closed curve with a disc, computed directly
 * (a Weiler–Atherton walk specialised to a circle) instead of through a general boolean
 * library, because it runs for every placement and must be cheap.
 *
 * The curve is given as parallel coordinate arrays (first `n` entries, not repeated at the
 * end). It may wander outside the disc in any way, even overlapping itself there, as long as
 * the part inside the disc is simple and the curve winds once around the region. Arcs of the
 * circle are approximated by chords with at most `arcStepRad` of angle each, so the result
 * lies inside the true intersection by at most r·(1 − cos(arcStepRad/2)).
 *
 * Output: counter-clockwise closed rings, one Polygon each (no holes can arise).
 */
export function clipCurveToDisc(
  xs: Float64Array,
  ys: Float64Array,
  n: number,
  cx: number,
  cy: number,
  r: number,
  arcStepRad: number,
): MultiPolygon {
  if (n < 3) return [];
  // Orientation of the whole curve: the folded parts outside contribute no area, so the
  // sign of the shoelace sum is the sign of the winding around the interior.
  let twice = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    twice += (xs[i] - cx) * (ys[j] - cy) - (xs[j] - cx) * (ys[i] - cy);
  }
  const ccw = twice >= 0;
  const X = (k: number): number => xs[ccw ? k : n - 1 - k];
  const Y = (k: number): number => ys[ccw ? k : n - 1 - k];
  const r2 = r * r;
  const inside = new Uint8Array(n);
  let anyInside = false;
  for (let k = 0; k < n; k++) {
    const dx = X(k) - cx;
    const dy = Y(k) - cy;
    inside[k] = dx * dx + dy * dy < r2 ? 1 : 0;
    if (inside[k]) anyInside = true;
  }

  // Crossings in ring order: edge index, parameter, entering?, point, angle.
  const evEdge: number[] = [];
  const evT: number[] = [];
  const evIn: boolean[] = [];
  const evX: number[] = [];
  const evY: number[] = [];
  const evAng: number[] = [];
  const push = (k: number, t: number, entering: boolean, x0: number, y0: number, dx: number, dy: number): void => {
    const x = x0 + t * dx;
    const y = y0 + t * dy;
    evEdge.push(k);
    evT.push(t);
    evIn.push(entering);
    evX.push(x);
    evY.push(y);
    evAng.push(Math.atan2(y - cy, x - cx));
  };
  for (let k = 0; k < n; k++) {
    const k1 = k + 1 === n ? 0 : k + 1;
    const x0 = X(k);
    const y0 = Y(k);
    const dx = X(k1) - x0;
    const dy = Y(k1) - y0;
    const a = dx * dx + dy * dy;
    if (a === 0) continue;
    const px = x0 - cx;
    const py = y0 - cy;
    const b = 2 * (dx * px + dy * py);
    const c = px * px + py * py - r2;
    const disc = b * b - 4 * a * c;
    if (inside[k] !== inside[k1]) {
      const sq = Math.sqrt(Math.max(0, disc));
      // Numerically stable roots of a·t² + b·t + c = 0.
      const q = -0.5 * (b + (b >= 0 ? sq : -sq));
      const t1 = q / a;
      const t2 = q !== 0 ? c / q : t1;
      const lo = Math.min(t1, t2);
      const hi = Math.max(t1, t2);
      const t = inside[k] ? hi : lo;
      push(k, Math.min(1, Math.max(0, t)), inside[k] === 0, x0, y0, dx, dy);
    } else if (!inside[k] && disc > 0) {
      const sq = Math.sqrt(disc);
      const q = -0.5 * (b + (b >= 0 ? sq : -sq));
      const t1 = q / a;
      const t2 = q !== 0 ? c / q : t1;
      const lo = Math.min(t1, t2);
      const hi = Math.max(t1, t2);
      if (lo > 0 && hi < 1 && hi > lo) {
        push(k, lo, true, x0, y0, dx, dy);
        push(k, hi, false, x0, y0, dx, dy);
      }
    }
  }

  const m = evEdge.length;
  if (m === 0) {
    if (anyInside) {
      const ring: Ring = [];
      for (let k = 0; k < n; k++) ring.push([X(k), Y(k)]);
      ring.push([X(0), Y(0)]);
      return [[ring]];
    }
    // The curve stays outside: either it encloses the whole disc or misses it.
    let wn = 0;
    for (let k = 0; k < n; k++) {
      const k1 = k + 1 === n ? 0 : k + 1;
      const ay = Y(k) - cy;
      const by = Y(k1) - cy;
      const cr = (X(k) - cx) * by - (X(k1) - cx) * ay;
      if (ay <= 0) {
        if (by > 0 && cr > 0) wn++;
      } else if (by <= 0 && cr < 0) wn--;
    }
    if (wn === 0) return [];
    return [[arcRing(cx, cy, r, 0, 2 * Math.PI, arcStepRad, true)]];
  }

  // Pieces of the curve inside the disc, each from an entry event to the next exit event.
  const pieceOfEntry = new Map<number, Ring>();
  const exitOfEntry = new Map<number, number>();
  for (let e = 0; e < m; e++) {
    if (!evIn[e]) continue;
    const piece: Ring = [[evX[e], evY[e]]];
    let f = (e + 1) % m;
    // Vertices strictly after the entry edge up to and including the exit edge's start.
    let k = (evEdge[e] + 1) % n;
    const stopEdge = evEdge[f];
    if (!(stopEdge === evEdge[e] && evT[f] > evT[e])) {
      let guard = 0;
      while (guard++ <= n) {
        piece.push([X(k), Y(k)]);
        if (k === stopEdge) break;
        k = (k + 1) % n;
      }
    }
    piece.push([evX[f], evY[f]]);
    if (evIn[f]) {
      // Numerical inconsistency (tangency): treat the next entry as this piece's exit.
      f = (f + m - 1) % m;
    }
    pieceOfEntry.set(e, piece);
    exitOfEntry.set(e, f);
  }

  const entries = [...pieceOfEntry.keys()];
  const used = new Set<number>();
  const out: MultiPolygon = [];
  for (const start of entries) {
    if (used.has(start)) continue;
    const ring: Ring = [];
    let cur = start;
    let guard = 0;
    while (!used.has(cur) && guard++ <= entries.length) {
      used.add(cur);
      const piece = pieceOfEntry.get(cur) as Ring;
      for (const p of piece) ring.push(p);
      const exitAng = evAng[exitOfEntry.get(cur) as number];
      // Next entry counter-clockwise along the circle from the exit.
      let best = -1;
      let bestDelta = Infinity;
      for (const cand of entries) {
        let delta = evAng[cand] - exitAng;
        while (delta < 0) delta += 2 * Math.PI;
        while (delta >= 2 * Math.PI) delta -= 2 * Math.PI;
        if (delta < bestDelta) {
          bestDelta = delta;
          best = cand;
        }
      }
      const arc = arcRing(cx, cy, r, exitAng, bestDelta, arcStepRad, false);
      for (const p of arc) ring.push(p);
      cur = best;
    }
    if (ring.length >= 3) {
      ring.push([ring[0][0], ring[0][1]]);
      out.push([ring]);
    }
  }
  return out;
}

/**
 * Points on a circle strictly between angle `from` and `from + sweep` (counter-clockwise),
 * spaced at most `stepRad` apart; with `closed`, a full closed ring.
 */
function arcRing(cx: number, cy: number, r: number, from: number, sweep: number, stepRad: number, closed: boolean): Ring {
  const pts: Ring = [];
  const k = Math.max(1, Math.ceil(sweep / stepRad));
  const step = sweep / k;
  if (closed) {
    for (let i = 0; i < k; i++) pts.push([cx + r * Math.cos(from + i * step), cy + r * Math.sin(from + i * step)]);
    pts.push([pts[0][0], pts[0][1]]);
    return pts;
  }
  for (let i = 1; i < k; i++) pts.push([cx + r * Math.cos(from + i * step), cy + r * Math.sin(from + i * step)]);
  return pts;
}

/**
 * A curve with the region on its left: closed (the last point joins the first) or open (it
 * starts and ends outside the disc).
 */
export type OrientedCurve = { xs: number[]; ys: number[]; closed: boolean };

/**
 * Intersection with a disc of a region given by its boundary curves, each oriented with the
 * region on its left (so, unlike {@link clipCurveToDisc}, orientation is never guessed from
 * areas). The curves may wander outside the disc in any way; inside it they must not cross.
 * The same walk: each piece of a curve inside the disc runs from where the curve enters to
 * where it leaves, and from each exit the boundary follows the circle counter-clockwise to the
 * next entry. When no curve enters the disc, closed curves wholly inside are kept (a
 * counter-clockwise one bounds an island; a clockwise one is a hole in a region that covers
 * the rest of the disc) and otherwise `discInside()` says whether the whole disc is in the
 * region or none of it.
 *
 * Output: counter-clockwise outer rings, clockwise holes, in polygon-clipping's format.
 */
export function clipOrientedCurvesToDisc(
  curves: readonly OrientedCurve[],
  cx: number,
  cy: number,
  r: number,
  arcStepRad: number,
  discInside: () => boolean,
): MultiPolygon {
  const r2 = r * r;
  type Piece = { pts: Ring; entryAng: number; exitAng: number };
  const pieces: Piece[] = [];
  const insideRings: Ring[] = [];
  for (const c of curves) {
    const n = c.xs.length;
    if (n < 2) continue;
    const nseg = c.closed ? n : n - 1;
    const inside = new Uint8Array(n);
    let anyInside = false;
    for (let k = 0; k < n; k++) {
      const dx = c.xs[k] - cx;
      const dy = c.ys[k] - cy;
      inside[k] = dx * dx + dy * dy < r2 ? 1 : 0;
      if (inside[k]) anyInside = true;
    }
    // Events in curve order: segment index, point, entering?
    const evSeg: number[] = [];
    const evIn: boolean[] = [];
    const evX: number[] = [];
    const evY: number[] = [];
    if (!c.closed && inside[0]) {
      // Not expected (open curves start far outside); enter at the first point.
      evSeg.push(-1);
      evIn.push(true);
      evX.push(c.xs[0]);
      evY.push(c.ys[0]);
    }
    for (let k = 0; k < nseg; k++) {
      const k1 = k + 1 === n ? 0 : k + 1;
      const x0 = c.xs[k];
      const y0 = c.ys[k];
      const dx = c.xs[k1] - x0;
      const dy = c.ys[k1] - y0;
      const a = dx * dx + dy * dy;
      if (a === 0) continue;
      const px = x0 - cx;
      const py = y0 - cy;
      const b = 2 * (dx * px + dy * py);
      const cc = px * px + py * py - r2;
      const disc = b * b - 4 * a * cc;
      const sq = Math.sqrt(Math.max(0, disc));
      const q = -0.5 * (b + (b >= 0 ? sq : -sq));
      const t1 = q / a;
      const t2 = q !== 0 ? cc / q : t1;
      const lo = Math.min(t1, t2);
      const hi = Math.max(t1, t2);
      if (inside[k] !== inside[k1]) {
        const t = Math.min(1, Math.max(0, inside[k] ? hi : lo));
        evSeg.push(k);
        evIn.push(inside[k] === 0);
        evX.push(x0 + t * dx);
        evY.push(y0 + t * dy);
      } else if (!inside[k] && disc > 0 && lo > 0 && hi < 1 && hi > lo) {
        evSeg.push(k, k);
        evIn.push(true, false);
        evX.push(x0 + lo * dx, x0 + hi * dx);
        evY.push(y0 + lo * dy, y0 + hi * dy);
      }
    }
    if (!c.closed && inside[n - 1]) {
      evSeg.push(n - 1);
      evIn.push(false);
      evX.push(c.xs[n - 1]);
      evY.push(c.ys[n - 1]);
    }
    const m = evSeg.length;
    if (m === 0) {
      if (c.closed && anyInside) {
        const ring: Ring = [];
        for (let k = 0; k < n; k++) ring.push([c.xs[k], c.ys[k]]);
        ring.push([c.xs[0], c.ys[0]]);
        insideRings.push(ring);
      }
      continue;
    }
    for (let e = 0; e < m; e++) {
      if (!evIn[e]) continue;
      // The matching exit: the next exit event along the curve (a tangency can leave two
      // entries in a row; the first exit after this entry ends the piece).
      let f = -1;
      for (let s = 1; s <= m; s++) {
        const cand = e + s;
        if (!c.closed && cand >= m) break;
        if (!evIn[cand % m]) {
          f = cand % m;
          break;
        }
      }
      if (f < 0) continue;
      const pts: Ring = [[evX[e], evY[e]]];
      if (!(evSeg[f] === evSeg[e] && f > e)) {
        let k = (evSeg[e] + 1) % n;
        let guard = 0;
        while (guard++ <= n) {
          pts.push([c.xs[k], c.ys[k]]);
          if (k === evSeg[f]) break;
          k = (k + 1) % n;
        }
      }
      pts.push([evX[f], evY[f]]);
      pieces.push({ pts, entryAng: Math.atan2(evY[e] - cy, evX[e] - cx), exitAng: Math.atan2(evY[f] - cy, evX[f] - cx) });
    }
  }

  const out: MultiPolygon = [];
  if (pieces.length === 0) {
    const holes = insideRings.filter((ring) => signedArea(ring) < 0);
    for (const ring of insideRings) if (signedArea(ring) >= 0) out.push([ring]);
    if (holes.length > 0 || (insideRings.length === 0 && discInside())) {
      out.push([arcRing(cx, cy, r, 0, 2 * Math.PI, arcStepRad, true), ...holes]);
    }
    return out;
  }
  const used = new Uint8Array(pieces.length);
  for (let start = 0; start < pieces.length; start++) {
    if (used[start]) continue;
    const ring: Ring = [];
    let cur = start;
    let guard = 0;
    while (!used[cur] && guard++ <= pieces.length) {
      used[cur] = 1;
      for (const p of pieces[cur].pts) ring.push(p);
      const exitAng = pieces[cur].exitAng;
      // Next entry counter-clockwise along the circle from the exit.
      let best = -1;
      let bestDelta = Infinity;
      for (let cand = 0; cand < pieces.length; cand++) {
        let delta = pieces[cand].entryAng - exitAng;
        while (delta < 0) delta += 2 * Math.PI;
        while (delta >= 2 * Math.PI) delta -= 2 * Math.PI;
        if (delta < bestDelta) {
          bestDelta = delta;
          best = cand;
        }
      }
      for (const p of arcRing(cx, cy, r, exitAng, bestDelta, arcStepRad, false)) ring.push(p);
      cur = best;
    }
    if (ring.length >= 3) {
      ring.push([ring[0][0], ring[0][1]]);
      out.push([ring]);
    }
  }
  // Clockwise rings wholly inside the disc are holes of the outer ring that contains them;
  // counter-clockwise ones are islands of their own.
  for (const ring of insideRings) {
    if (signedArea(ring) >= 0) {
      out.push([ring]);
      continue;
    }
    const host = out.find((poly) => contains(poly[0], ring[0]));
    if (host) host.push(ring);
  }
  return out;
}

function signedArea(ring: Ring): number {
  let twice = 0;
  const x0 = ring[0][0];
  const y0 = ring[0][1];
  for (let i = 1; i + 1 < ring.length; i++) {
    twice += (ring[i][0] - x0) * (ring[i + 1][1] - y0) - (ring[i + 1][0] - x0) * (ring[i][1] - y0);
  }
  return twice / 2;
}

function contains(ring: Ring, p: [number, number]): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}
