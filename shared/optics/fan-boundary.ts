import type { Vec3 } from '../geometry/vec3';
import type { OrientedCurve } from '../geometry/clip-disc';
import type { PlacedMirror } from './mirror';
import { outlinePoint, traceToPlane, type Outline, type TracedFan } from './trace';

/**
 * The boundary of the seen part of a plane, inside a range disc, as curves oriented with the
 * seen part on their left.
 *
 * Why this is enough: let D be the part of the mirror the eye sees and S ⊂ D the part whose
 * reflected rays meet the plane within `farM` horizontally. A convex mirror maps its surface
 * one-to-one onto reflected rays, so the map G (mirror point → plane point) is one-to-one on S
 * and the seen region G(S) is bounded by the images of S's boundary: (a) the pieces of D's
 * outline that lie in S and (b) the curve inside D where rays meet the plane exactly `farM`
 * away. Every point of (b) lies `farM` from its reflection point, so far outside the range
 * disc (farM exceeds the range by more than the mirror's size). Inside the disc, then, the
 * boundary is the image of the outline pieces that hit, and the region is recovered by walking
 * those pieces and the range circle (`clipOrientedCurvesToDisc`) once their orientation is
 * known. The orientation comes from G itself at one outline point (the image of the step
 * along the outline and of the step into the mirror), not from the curve's shoelace sum, which
 * is wrong when the outline encloses a part that reflects upward (then the region lies outside
 * the outline's image: a hole in the floor, not an island).
 *
 * Each piece of the outline that hits is extended at both ends to a point at least farM/2 away
 * (bisection on the outline), so every open piece starts and ends outside the disc: farM/2 =
 * 1.5·range + 2R + 5 m (`farDistanceM`) and no point of the sphere is more than 2R from the
 * vertex, so such a point is more than 1.5·range + 5 m from the disc's centre. Chords
 * whose traced midpoint strays more than `tolM` from them are subdivided near the disc.
 */
export type FanBoundary = {
  /** Oriented curves, seen part on the left; open curves start and end outside the disc. */
  curves: OrientedCurve[];
  /** False when no traced outline ray meets the plane (then there is no boundary in the disc). */
  anyHit: boolean;
};

/** Largest number of halvings of one outline step when refining a chord. */
const MAX_DEPTH = 14;
/** Cap on extra traces per region, so a pathological case stays bounded in time. */
const MAX_EXTRA_TRACES = 40_000;

/**
 * A closed loop on the mirror sphere bounding a part of the mirror: samples at increasing
 * parameters t (the loop closes after `period`), with their traces already done.
 */
export type SphereLoop = {
  count: number;
  t: ArrayLike<number>;
  period: number;
  /** Unit direction from the sphere's centre of the loop point at parameter t. */
  at(t: number): Vec3;
  /** A point of the enclosed part a small step `eps` (parameter units) in from the loop at t. */
  inside(t: number, eps: number): Vec3;
  /** Per sample: 1 when its ray meets the plane within farM, and where. */
  hits: Uint8Array;
  gx: ArrayLike<number>;
  gy: ArrayLike<number>;
  /** Per sample: horizontal run from its reflection point to the plane (hits only). */
  run: ArrayLike<number>;
};

/** {@link loopBoundary} for the whole visible outline of the mirror (the coverage fan). */
export function fanBoundary(
  pm: PlacedMirror,
  eyeM: Vec3,
  outline: Outline,
  fan: TracedFan,
  h0: number,
  farM: number,
  disc: { cx: number; cy: number; r: number },
  tolM: number,
): FanBoundary {
  const n = outline.count;
  const run = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const dx = fan.gx[j] - fan.point[3 * j];
    const dy = fan.gy[j] - fan.point[3 * j + 1];
    run[j] = Math.sqrt(dx * dx + dy * dy);
  }
  const par = outline.param;
  const loop: SphereLoop = {
    count: n,
    t: outline.b,
    period: 2 * Math.PI,
    at: (b) => outlinePoint(par, b),
    inside: (b, eps) => outlinePoint(par, b, 1 - eps),
    hits: fan.hits,
    gx: fan.gx,
    gy: fan.gy,
    run,
  };
  return loopBoundary(pm, eyeM, loop, h0, farM, disc, tolM);
}

/** The boundary, inside a disc, of the part of the plane seen in the part of the mirror a loop encloses. */
export function loopBoundary(
  pm: PlacedMirror,
  eyeM: Vec3,
  loop: SphereLoop,
  h0: number,
  farM: number,
  disc: { cx: number; cy: number; r: number },
  tolM: number,
): FanBoundary {
  const n = loop.count;
  const fan = loop;
  const bAt = (idx: number): number => loop.t[idx % n] + loop.period * Math.floor(idx / n);
  let firstMiss = -1;
  let anyHit = false;
  for (let j = 0; j < n; j++) {
    if (fan.hits[j]) anyHit = true;
    else if (firstMiss < 0) firstMiss = j;
  }
  if (!anyHit) return { curves: [], anyHit: false };

  const tmp = new Float64Array(3);
  let traces = 0;
  const trace = (b: number): boolean => {
    traces++;
    return traceToPlane(pm, eyeM, loop.at(b), h0, farM, tmp);
  };

  const curves: OrientedCurve[] = [];
  let cur: { xs: number[]; ys: number[] } | null = null;
  const emit = (x: number, y: number): void => {
    if (!cur) {
      cur = { xs: [], ys: [] };
    }
    cur.xs.push(x);
    cur.ys.push(y);
  };
  const endCurve = (): void => {
    if (cur && cur.xs.length >= 2) curves.push({ xs: cur.xs, ys: cur.ys, closed: false });
    cur = null;
  };

  /** A point on the outline between a hit (bHit) and a miss (bMiss) that hits at least farM/2 away. */
  const crossing = (bHit: number, bMiss: number): [number, number, number] => {
    let hx = NaN;
    let hy = NaN;
    let hb = bHit;
    for (let it = 0; it < 60; it++) {
      const bm = 0.5 * (bHit + bMiss);
      if (trace(bm)) {
        bHit = bm;
        hb = bm;
        hx = tmp[0];
        hy = tmp[1];
        if (tmp[2] >= farM / 2) break;
      } else {
        bMiss = bm;
      }
    }
    if (Number.isNaN(hx)) {
      trace(hb);
      hx = tmp[0];
      hy = tmp[1];
    }
    return [hb, hx, hy];
  };

  const { cx, cy, r } = disc;
  /** Emits the points strictly between two hitting outline points A and B, refining near the disc. */
  /** Distance from the disc's centre to the segment A–B. */
  const segDist = (xA: number, yA: number, xB: number, yB: number): number => {
    const dx = xB - xA;
    const dy = yB - yA;
    const l2 = dx * dx + dy * dy;
    let t = l2 > 0 ? ((cx - xA) * dx + (cy - yA) * dy) / l2 : 0;
    t = t < 0 ? 0 : t > 1 ? 1 : t;
    const ex = xA + t * dx - cx;
    const ey = yA + t * dy - cy;
    return Math.sqrt(ex * ex + ey * ey);
  };
  /** Emits the points strictly between two hitting outline points A and B, refining near the disc. */
  const segment = (bA: number, xA: number, yA: number, bB: number, xB: number, yB: number, depth: number): void => {
    if (depth >= MAX_DEPTH || traces > MAX_EXTRA_TRACES) return;
    const dx = xB - xA;
    const dy = yB - yA;
    const len = Math.sqrt(dx * dx + dy * dy);
    const dChord = segDist(xA, yA, xB, yB);
    // Far from the disc a chord cannot matter: the traced curve between A and B stays near it.
    if (dChord > r + len) return;
    const bM = 0.5 * (bA + bB);
    if (!trace(bM)) {
      // A part of the outline that misses the plane hides between the two samples.
      const [b1, x1, y1] = crossing(bA, bM);
      segment(bA, xA, yA, b1, x1, y1, depth + 1);
      emit(x1, y1);
      endCurve();
      const [b2, x2, y2] = crossing(bB, bM);
      emit(x2, y2);
      segment(b2, x2, y2, bB, xB, yB, depth + 1);
      return;
    }
    const xM = tmp[0];
    const yM = tmp[1];
    // Distance of the traced midpoint from the chord.
    const dev = len > 0 ? Math.abs((xM - xA) * dy - (yM - yA) * dx) / len : Math.sqrt((xM - xA) ** 2 + (yM - yA) ** 2);
    // Refine only where the curve (within about twice the midpoint's deviation of the chord)
    // can reach the disc.
    if (dev > tolM && dChord < r + 2 * dev + tolM) {
      segment(bA, xA, yA, bM, xM, yM, depth + 1);
      emit(xM, yM);
      segment(bM, xM, yM, bB, xB, yB, depth + 1);
    }
  };

  /**
   * Whether the chord from sample j to the next could stray from the traced curve by more than
   * the tolerance: a smooth curve sampled at even steps strays from its chord by about an
   * eighth of its second difference, checked at both ends (uneven steps and corners only make
   * the estimate larger, so they get traced).
   */
  const sd = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const a = j === 0 ? n - 1 : j - 1;
    const c = j + 1 === n ? 0 : j + 1;
    if (!fan.hits[a] || !fan.hits[j] || !fan.hits[c]) {
      sd[j] = Infinity;
      continue;
    }
    const ddx = fan.gx[a] - 2 * fan.gx[j] + fan.gx[c];
    const ddy = fan.gy[a] - 2 * fan.gy[j] + fan.gy[c];
    sd[j] = Math.sqrt(ddx * ddx + ddy * ddy);
  }
  const smooth = (j: number): boolean => Math.max(sd[j], sd[j + 1 === n ? 0 : j + 1]) < 4 * tolM;
  const step = (idx: number): void => {
    const j = idx % n;
    const k = (idx + 1) % n;
    if (!smooth(j)) segment(bAt(idx), fan.gx[j], fan.gy[j], bAt(idx + 1), fan.gx[k], fan.gy[k], 0);
  };

  if (firstMiss < 0) {
    // The whole outline hits: one closed curve, unless refinement finds a gap.
    for (let idx = 0; idx < n; idx++) {
      emit(fan.gx[idx], fan.gy[idx]);
      step(idx);
    }
    if (curves.length === 0 && cur) {
      const c = cur as { xs: number[]; ys: number[] };
      curves.push({ xs: c.xs, ys: c.ys, closed: true });
    } else if (cur) {
      // A gap was found: the last open piece runs on into the first one.
      const c = cur as { xs: number[]; ys: number[] };
      const first = curves[0];
      curves[0] = { xs: [...c.xs, ...first.xs], ys: [...c.ys, ...first.ys], closed: false };
    }
  } else {
    for (let idx = firstMiss; idx < firstMiss + n; idx++) {
      const j = idx % n;
      const k = (idx + 1) % n;
      const hj = fan.hits[j] === 1;
      const hk = fan.hits[k] === 1;
      if (hj && hk) {
        step(idx);
        emit(fan.gx[k], fan.gy[k]);
      } else if (hj) {
        const [b1, x1, y1] = crossing(bAt(idx), bAt(idx + 1));
        segment(bAt(idx), fan.gx[j], fan.gy[j], b1, x1, y1, 0);
        emit(x1, y1);
        endCurve();
      } else if (hk) {
        const [b2, x2, y2] = crossing(bAt(idx + 1), bAt(idx));
        endCurve();
        emit(x2, y2);
        segment(b2, x2, y2, bAt(idx + 1), fan.gx[k], fan.gy[k], 0);
        emit(fan.gx[k], fan.gy[k]);
      }
    }
    endCurve();
  }

  if (!isInsideLeft(pm, eyeM, loop, h0, farM)) {
    for (const c of curves) {
      c.xs.reverse();
      c.ys.reverse();
    }
  }
  return { curves, anyHit: true };
}

/**
 * Orientation of the map from the mirror to the plane, measured at the outline point whose ray
 * meets the plane nearest: true when the traced image of a small step into the mirror lies to
 * the left of the image of a small step along the outline (increasing b), i.e. the seen part
 * is on the left of the traced outline.
 */
function isInsideLeft(pm: PlacedMirror, eyeM: Vec3, loop: SphereLoop, h0: number, farM: number): boolean {
  const n = loop.count;
  // The nearest hit first (its neighbourhood surely hits too), then any other hit.
  let nearest = -1;
  for (let j = 0; j < n; j++) if (loop.hits[j] && (nearest < 0 || loop.run[j] < loop.run[nearest])) nearest = j;
  const order = [nearest];
  for (let j = 0; j < n; j++) if (loop.hits[j] && j !== nearest) order.push(j);
  const t = new Float64Array(3);
  for (const j of order) {
    const b = loop.t[j];
    const ax = loop.gx[j];
    const ay = loop.gy[j];
    for (const step of [1e-6, 1e-4, 1e-3]) {
      if (!traceToPlane(pm, eyeM, loop.at(b + step), h0, farM, t)) continue;
      const ux = t[0] - ax;
      const uy = t[1] - ay;
      if (!traceToPlane(pm, eyeM, loop.inside(b, step), h0, farM, t)) continue;
      const vx = t[0] - ax;
      const vy = t[1] - ay;
      const cr = ux * vy - uy * vx;
      if (cr !== 0 && Number.isFinite(cr)) return cr > 0;
    }
  }
  // No usable point (every hit is degenerate): fall back to counter-clockwise.
  return true;
}
