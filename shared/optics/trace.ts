import { dot, norm, sub, type Vec3 } from '../geometry/vec3';
import { checkEye, type Constraint, type PlacedMirror } from './mirror';
import { REL_EPS } from '../geometry/tolerance';

/**
 * Forward ray tracing from the eye over the visible outline of a mirror.
 *
 * The reflecting part seen by the eye is the set of sphere points C + R·m with
 * - m·k ≥ c for each constraint of the mirror's portion (rim circle, panel edges, dome faces);
 * - m·ê ≥ R/|E − C| (ê = unit (E − C)): the eye is on the outer side of the tangent plane.
 * Each constraint is a circle on the sphere. Along every great circle leaving an interior
 * point m₀ in direction g, the constraint's value is A·cos(ρ − δ), so the first angle ρ at
 * which it becomes active has the closed form ρ = δ + acos(c/A). The outline in direction g is
 * the smallest such ρ. Corners (where two constraint circles meet) are added exactly, so
 * rectangle corners and dome edges are not cut off. The region is star-shaped about m₀ along
 * these great circles (caps no larger than a hemisphere are convex; a panel's edge planes are
 * crossed once on the front hemisphere).
 */

export type Outline = {
  /** Unit directions m from the centre, 3 per point. */
  m: Float64Array;
  count: number;
  /** Polar angle of each point about the interior point (radians, increasing), see {@link OutlineParam}. */
  b: Float64Array;
  /** The outline's parametrisation, to place more points on it or inside it. */
  param: OutlineParam;
};

/**
 * Polar parametrisation of the visible part about its interior point m₀: the point at angle b
 * and fraction s ∈ [0, 1] is cos(s·ρ(b))·m₀ + sin(s·ρ(b))·(cos b·e₁ + sin b·e₂), where ρ(b) is
 * the outline's arc distance from m₀ in direction b (closed form, {@link outlineRho}).
 * (e₁, e₂, m₀) is right-handed, so b increases counter-clockwise seen from outside the sphere
 * and the visible part lies to the left of the outline traversed with increasing b.
 */
export type OutlineParam = {
  m0: Vec3;
  e1: Vec3;
  e2: Vec3;
  /** Per constraint: k·m₀, k·e₁, k·e₂ and c. */
  kn: Float64Array;
  k1: Float64Array;
  k2: Float64Array;
  c: Float64Array;
};

function constraintsWithEye(pm: PlacedMirror, eyeM: Vec3): Constraint[] {
  const e = sub(eyeM, pm.C);
  const d = norm(e);
  return [...pm.portion, { k: [e[0] / d, e[1] / d, e[2] / d], c: pm.R / d }];
}

/** Builds the polar parametrisation of the part of the mirror the eye sees (validates the eye). */
export function outlineParam(pm: PlacedMirror, eyeM: Vec3): { param: OutlineParam; cons: Constraint[] } {
  const m0 = checkEye(pm, eyeM);
  const cons = constraintsWithEye(pm, eyeM);
  // Tangent basis at m0: the panel's own (u, v) so rectangle corners sit at atan2(h, w).
  let e1: Vec3;
  let e2: Vec3;
  if (!pm.isDome) {
    e1 = pm.frame.u;
    e2 = pm.frame.v;
  } else {
    const a: Vec3 = Math.abs(m0[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
    const t = dot(a, m0);
    const x: Vec3 = [a[0] - t * m0[0], a[1] - t * m0[1], a[2] - t * m0[2]];
    const xn = norm(x);
    e1 = [x[0] / xn, x[1] / xn, x[2] / xn];
    e2 = [m0[1] * e1[2] - m0[2] * e1[1], m0[2] * e1[0] - m0[0] * e1[2], m0[0] * e1[1] - m0[1] * e1[0]];
  }
  const nk = cons.length;
  const param: OutlineParam = {
    m0,
    e1,
    e2,
    kn: new Float64Array(nk),
    k1: new Float64Array(nk),
    k2: new Float64Array(nk),
    c: new Float64Array(nk),
  };
  for (let i = 0; i < nk; i++) {
    param.kn[i] = dot(cons[i].k, m0);
    param.k1[i] = dot(cons[i].k, e1);
    param.k2[i] = dot(cons[i].k, e2);
    param.c[i] = cons[i].c;
  }
  return { param, cons };
}

/**
 * Arc distance ρ(b) from m₀ to the outline in direction b: along the great circle the value of
 * constraint k·m ≥ c is A·cos(ρ − δ), which first reaches c at ρ = δ + acos(c/A).
 */
export function outlineRho(par: OutlineParam, b: number): number {
  const cb = Math.cos(b);
  const sb = Math.sin(b);
  let rho = Math.PI;
  const { kn, k1, k2, c } = par;
  for (let i = 0; i < kn.length; i++) {
    const an = kn[i];
    const ag = cb * k1[i] + sb * k2[i];
    const A = Math.sqrt(an * an + ag * ag);
    if (A === 0) continue;
    const ratio = c[i] / A;
    if (ratio <= -1) continue;
    const r = Math.atan2(ag, an) + Math.acos(Math.min(1, ratio));
    if (r > 0 && r < rho) rho = r;
  }
  return rho;
}

/** Unit direction of the point at angle b and fraction s of the way from m₀ to the outline. */
export function outlinePoint(par: OutlineParam, b: number, s = 1): Vec3 {
  const rho = s * outlineRho(par, b);
  const cb = Math.cos(b);
  const sb = Math.sin(b);
  const cr = Math.cos(rho);
  const sr = Math.sin(rho);
  const { m0, e1, e2 } = par;
  return [
    cr * m0[0] + sr * (cb * e1[0] + sb * e2[0]),
    cr * m0[1] + sr * (cb * e1[1] + sb * e2[1]),
    cr * m0[2] + sr * (cb * e1[2] + sb * e2[2]),
  ];
}

/**
 * Outline of the part of the mirror that the eye sees, as unit directions from the sphere's
 * centre, ordered around the interior point; `samples` evenly spaced directions plus corners.
 */
export function visibleOutline(pm: PlacedMirror, eyeM: Vec3, samples: number): Outline {
  const { param, cons } = outlineParam(pm, eyeM);
  const { e1, e2 } = param;
  const angles: number[] = [];
  for (let j = 0; j < samples; j++) angles.push(-Math.PI + (2 * Math.PI * j) / samples);
  for (const corner of corners(cons)) {
    const b = Math.atan2(dot(corner, e2), dot(corner, e1));
    angles.push(b);
  }
  angles.sort((p, q) => p - q);

  const out = new Float64Array(3 * angles.length);
  const bs = new Float64Array(angles.length);
  let count = 0;
  let last = NaN;
  for (const b of angles) {
    if (b === last) continue;
    last = b;
    const rho = outlineRho(param, b);
    const cb = Math.cos(b);
    const sb = Math.sin(b);
    const cr = Math.cos(rho);
    const sr = Math.sin(rho);
    const { m0 } = param;
    out[3 * count] = cr * m0[0] + sr * (cb * e1[0] + sb * e2[0]);
    out[3 * count + 1] = cr * m0[1] + sr * (cb * e1[1] + sb * e2[1]);
    out[3 * count + 2] = cr * m0[2] + sr * (cb * e1[2] + sb * e2[2]);
    bs[count] = b;
    count++;
  }
  return { m: out, count, b: bs.subarray(0, count), param };
}

/** Points where two constraint circles meet and every other constraint holds. */
function corners(cons: Constraint[]): Vec3[] {
  const out: Vec3[] = [];
  for (let i = 0; i < cons.length; i++) {
    for (let j = i + 1; j < cons.length; j++) {
      const a = cons[i];
      const b = cons[j];
      const G = dot(a.k, b.k);
      const den = 1 - G * G;
      if (den < REL_EPS) continue;
      const al = (a.c - G * b.c) / den;
      const be = (b.c - G * a.c) / den;
      const base: Vec3 = [al * a.k[0] + be * b.k[0], al * a.k[1] + be * b.k[1], al * a.k[2] + be * b.k[2]];
      const rest = 1 - dot(base, base);
      if (rest < 0) continue;
      const cx: Vec3 = [a.k[1] * b.k[2] - a.k[2] * b.k[1], a.k[2] * b.k[0] - a.k[0] * b.k[2], a.k[0] * b.k[1] - a.k[1] * b.k[0]];
      const g = Math.sqrt(rest / den);
      for (const s of [1, -1]) {
        const p: Vec3 = [base[0] + s * g * cx[0], base[1] + s * g * cx[1], base[2] + s * g * cx[2]];
        let ok = true;
        for (let q = 0; q < cons.length && ok; q++) {
          if (q !== i && q !== j && dot(p, cons[q].k) < cons[q].c - REL_EPS) ok = false;
        }
        if (ok) out.push(p);
      }
    }
  }
  return out;
}

export type TracedFan = {
  count: number;
  /** Reflection points on the mirror, 3 per ray, metres. */
  point: Float64Array;
  /** Unit reflected directions, 3 per ray. */
  dir: Float64Array;
  /**
   * Where each reflected ray meets the plane when `hits` is 1; otherwise a point `farM` out
   * along the ray's horizontal direction, for drawing only (that direction is meaningless for
   * a ray near vertical, so the region is never built from these points).
   */
  gx: Float64Array;
  gy: Float64Array;
  /** 1 when the ray really meets the plane within `farM` of its reflection point. */
  hits: Uint8Array;
  /** Lowest reflection point height, metres. */
  minZ: number;
};

/**
 * Traces eye → outline point → reflected ray → plane z = planeHeightM for every outline point.
 * Reflection uses the local normal n = m (unit, outward): r = i − 2(i·n)n with i the unit
 * incident direction. A ray that rises, runs level, or meets the plane farther than `farM`
 * (horizontally) is marked as a miss (see {@link TracedFan}).
 */
export function traceOutline(pm: PlacedMirror, eyeM: Vec3, outline: Outline, planeHeightM: number, farM: number): TracedFan {
  const n = outline.count;
  const point = new Float64Array(3 * n);
  const dir = new Float64Array(3 * n);
  const gx = new Float64Array(n);
  const gy = new Float64Array(n);
  const hits = new Uint8Array(n);
  const R = pm.R;
  const cx = pm.C[0];
  const cy = pm.C[1];
  const cz = pm.C[2];
  const ex = eyeM[0];
  const ey = eyeM[1];
  const ez = eyeM[2];
  const m = outline.m;
  let minZ = Infinity;
  let lastHx = 1;
  let lastHy = 0;
  for (let j = 0; j < n; j++) {
    const mx = m[3 * j];
    const my = m[3 * j + 1];
    const mz = m[3 * j + 2];
    const px = cx + R * mx;
    const py = cy + R * my;
    const pz = cz + R * mz;
    let ix = px - ex;
    let iy = py - ey;
    let iz = pz - ez;
    const il = Math.sqrt(ix * ix + iy * iy + iz * iz);
    ix /= il;
    iy /= il;
    iz /= il;
    const k = 2 * (ix * mx + iy * my + iz * mz);
    const rx = ix - k * mx;
    const ry = iy - k * my;
    const rz = iz - k * mz;
    point[3 * j] = px;
    point[3 * j + 1] = py;
    point[3 * j + 2] = pz;
    dir[3 * j] = rx;
    dir[3 * j + 1] = ry;
    dir[3 * j + 2] = rz;
    if (pz < minZ) minZ = pz;
    const h = Math.sqrt(rx * rx + ry * ry);
    let hx = lastHx;
    let hy = lastHy;
    if (h > 0) {
      hx = rx / h;
      hy = ry / h;
      lastHx = hx;
      lastHy = hy;
    }
    const dz = planeHeightM - pz;
    // t along the unit ray to the plane; horizontal run is t·h.
    if (rz < 0 && dz < 0 && (dz / rz) * h <= farM) {
      const t = dz / rz;
      gx[j] = px + t * rx;
      gy[j] = py + t * ry;
      hits[j] = 1;
    } else {
      gx[j] = px + hx * farM;
      gy[j] = py + hy * farM;
      hits[j] = 0;
    }
  }
  return { count: n, point, dir, gx, gy, hits, minZ };
}

/**
 * Traces the eye's ray to the sphere point C + R·m, reflects it (r = i − 2(i·n)n, n = m) and
 * meets the plane z = h0. Writes the meeting point's x, y and the horizontal run from the
 * reflection point into `out` and returns true when the ray meets the plane within `farM`
 * horizontally (the same test as {@link traceOutline}).
 */
export function traceToPlane(pm: PlacedMirror, eyeM: Vec3, m: Vec3, h0: number, farM: number, out: Float64Array): boolean {
  const px = pm.C[0] + pm.R * m[0];
  const py = pm.C[1] + pm.R * m[1];
  const pz = pm.C[2] + pm.R * m[2];
  let ix = px - eyeM[0];
  let iy = py - eyeM[1];
  let iz = pz - eyeM[2];
  const il = Math.sqrt(ix * ix + iy * iy + iz * iz);
  ix /= il;
  iy /= il;
  iz /= il;
  const k = 2 * (ix * m[0] + iy * m[1] + iz * m[2]);
  const rx = ix - k * m[0];
  const ry = iy - k * m[1];
  const rz = iz - k * m[2];
  const h = Math.sqrt(rx * rx + ry * ry);
  const dz = h0 - pz;
  if (rz < 0 && dz < 0 && (dz / rz) * h <= farM) {
    const t = dz / rz;
    out[0] = px + t * rx;
    out[1] = py + t * ry;
    out[2] = t * h;
    return true;
  }
  return false;
}
