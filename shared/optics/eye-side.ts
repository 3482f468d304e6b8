import { LENGTH_EPS_M } from '../geometry/tolerance';
import { boundsOfPoints, boxesMeet, packedPoints, segmentBounds } from '../geometry/bounds';
import { clipToSlab } from '../geometry/clip';
import { robustIntersection } from '../geometry/robust-boolean';
import { clipOrientedCurvesToDisc } from '../geometry/clip-disc';
import { signedRingArea, windingNumber, type Pair, type Polygon, type Ring } from '../geometry/polygon';
import { cross, dot, norm, type Vec3 } from '../geometry/vec3';
import { sphereReflectionPoint } from './alhazen';
import { loopBoundary, type SphereLoop } from './fan-boundary';
import { onPortion, type PlacedMirror } from './mirror';
import { traceToPlane, type TracedFan } from './trace';
import type { Wall } from './walls';

/**
 * Floor hidden because a wall stands between the eye and the mirror (the eye → mirror leg).
 *
 * Method: in the eye's gnomonic image plane (central projection about the eye → vertex
 * direction), where straight 3-D edges stay straight, the wall's rectangle is intersected with
 * the outline of the visible mirror. Each point of that intersection is a direction from the
 * eye; its outline is traced exactly (ray–sphere, reflect, plane) and the floor that the wall
 * hides is built inside the range disc (`maxRangeM` around the vertex, plus 0.1 m so the
 * shadow covers the region's own circle chords) from the outline pieces that meet the plane,
 * exactly as the coverage fan is (see `loopBoundary`): parts of the hidden patch that reflect
 * upward are handled, not parked. Only the part of the wall nearer to the eye than the nearest point of the
 * mirror is used: a wall behind the mirror (for instance the wall it is mounted on) never hides
 * it. Approximation: a wall that reaches into the mirror's own depth band (within the mirror's
 * few centimetres of depth as seen by the eye) is treated as not hiding that part.
 */
export function eyeSideShadows(
  pm: PlacedMirror,
  eyeM: Vec3,
  fan: TracedFan,
  walls: readonly Wall[],
  h0: number,
  farM: number,
  maxRangeM: number,
): Polygon[] {
  if (walls.length === 0) return [];
  const E = eyeM;
  const V = pm.pose.vertexM;
  const d0raw: Vec3 = [V[0] - E[0], V[1] - E[1], V[2] - E[2]];
  const d0l = norm(d0raw);
  const d0: Vec3 = [d0raw[0] / d0l, d0raw[1] / d0l, d0raw[2] / d0l];
  const a: Vec3 = Math.abs(d0[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
  const e1raw = cross(a, d0);
  const e1l = norm(e1raw);
  const e1: Vec3 = [e1raw[0] / e1l, e1raw[1] / e1l, e1raw[2] / e1l];
  const e2 = cross(d0, e1);
  const depth = (x: number, y: number, z: number): number => (x - E[0]) * d0[0] + (y - E[1]) * d0[1] + (z - E[2]) * d0[2];

  // Outline of the mirror in the image plane, and its nearest depth.
  const outline: Ring = [];
  let zmin = d0l;
  for (let j = 0; j < fan.count; j++) {
    const px = fan.point[3 * j];
    const py = fan.point[3 * j + 1];
    const pz = fan.point[3 * j + 2];
    const z = depth(px, py, pz);
    if (!(z > 0)) return []; // outline reaches beside the eye: not handled (see above)
    zmin = Math.min(zmin, z);
    const g: Pair = [
      ((px - E[0]) * e1[0] + (py - E[1]) * e1[1] + (pz - E[2]) * e1[2]) / z,
      ((px - E[0]) * e2[0] + (py - E[1]) * e2[1] + (pz - E[2]) * e2[2]) / z,
    ];
    outline.push(g);
  }
  const image = boundsOfPoints(outline)!;
  const back: Vec3 = [-d0[0], -d0[1], -d0[2]];
  const eC: Vec3 = [E[0] - pm.C[0], E[1] - pm.C[1], E[2] - pm.C[2]];
  if (onPortion(pm, back) && dot(back, eC) > pm.R) {
    zmin = Math.min(zmin, depth(pm.C[0] - pm.R * d0[0], pm.C[1] - pm.R * d0[1], pm.C[2] - pm.R * d0[2]));
  }
  outline.push([outline[0][0], outline[0][1]]);
  const step = Math.hypot(image.maxX - image.minX, image.maxY - image.minY) / 64;

  // A wall can stand between the eye and the mirror only if it meets the plan box of both.
  const legBox = boundsOfPoints([[E[0], E[1]], ...packedPoints(fan.point, fan.count, 3)])!;
  const V2 = pm.pose.vertexM;
  const disc = { cx: V2[0], cy: V2[1], r: maxRangeM + 0.1 };
  // Chords of the shadow's circle stay within 5 cm of it, so outside the region's own circle.
  const arcStep = Math.min(Math.PI / 8, 2 * Math.acos(Math.max(-1, 1 - 0.05 / disc.r)));
  const sphereDir = (x: number, y: number): Vec3 => sphereDirection(pm, E, d0, e1, e2, x, y);
  const out: Polygon[] = [];
  for (const w of walls) {
    if (!boxesMeet(segmentBounds(w.aM, w.bM), legBox)) continue;
    const quad: Vec3[] = [
      [w.aM[0], w.aM[1], 0],
      [w.bM[0], w.bM[1], 0],
      [w.bM[0], w.bM[1], w.heightM],
      [w.aM[0], w.aM[1], w.heightM],
    ];
    const near = clipToSlab(quad, (p) => depth(p[0], p[1], p[2]), LENGTH_EPS_M, zmin);
    if (near.length < 3) continue;
    const img: Ring = near.map((p) => {
      const z = depth(p[0], p[1], p[2]);
      return [
        ((p[0] - E[0]) * e1[0] + (p[1] - E[1]) * e1[1] + (p[2] - E[2]) * e1[2]) / z,
        ((p[0] - E[0]) * e2[0] + (p[1] - E[1]) * e2[1] + (p[2] - E[2]) * e2[2]) / z,
      ];
    });
    if (!boxesMeet(boundsOfPoints(img)!, image)) continue;
    img.push([img[0][0], img[0][1]]);
    const hidden = robustIntersection([outline], [img]);
    for (const poly of hidden) {
      for (const ring of poly) {
        const loop = imageLoop(ring, step, sphereDir, pm, E, h0, farM);
        if (!loop) continue;
        const { curves } = loopBoundary(pm, E, loop, h0, farM, disc, 0.003);
        const hiddenCentre = (): boolean => {
          const m = sphereReflectionPoint(pm.C, pm.R, E, [V2[0], V2[1], h0]);
          if (!m || !onPortion(pm, m)) return false;
          const px = pm.C[0] + pm.R * m[0] - E[0];
          const py = pm.C[1] + pm.R * m[1] - E[1];
          const pz = pm.C[2] + pm.R * m[2] - E[2];
          const z = px * d0[0] + py * d0[1] + pz * d0[2];
          const g: Pair = [(px * e1[0] + py * e1[1] + pz * e1[2]) / z, (px * e2[0] + py * e2[1] + pz * e2[2]) / z];
          return windingNumber(ring, g) !== 0;
        };
        for (const shadow of clipOrientedCurvesToDisc(curves, disc.cx, disc.cy, disc.r, arcStep, hiddenCentre)) out.push(shadow);
      }
    }
  }
  return out;
}

/**
 * The outline of a hidden patch (a ring in the eye's image plane) as a loop on the mirror:
 * parameter t runs along the ring's edges (edge k for k ≤ t < k + 1), sampled every `step`
 * of image-plane length; "inside" steps toward the ring's interior.
 */
function imageLoop(
  ringIn: Ring,
  step: number,
  sphereDir: (x: number, y: number) => Vec3,
  pm: PlacedMirror,
  E: Vec3,
  h0: number,
  farM: number,
): SphereLoop | null {
  const ring = ringIn.slice();
  const last = ring[ring.length - 1];
  if (ring.length > 1 && last[0] === ring[0][0] && last[1] === ring[0][1]) ring.pop();
  const N = ring.length;
  if (N < 3) return null;
  const ccw = signedRingArea(ring) >= 0 ? 1 : -1;
  const point = (t: number): Pair => {
    const tt = ((t % N) + N) % N;
    const k = Math.min(N - 1, Math.floor(tt));
    const f = tt - k;
    const a = ring[k];
    const b = ring[(k + 1) % N];
    return [a[0] + f * (b[0] - a[0]), a[1] + f * (b[1] - a[1])];
  };
  const ts: number[] = [];
  for (let k = 0; k < N; k++) {
    const a = ring[k];
    const b = ring[(k + 1) % N];
    const n = Math.max(1, Math.ceil(Math.hypot(b[0] - a[0], b[1] - a[1]) / step));
    for (let s = 0; s < n; s++) ts.push(k + s / n);
  }
  const count = ts.length;
  const hits = new Uint8Array(count);
  const gx = new Float64Array(count);
  const gy = new Float64Array(count);
  const run = new Float64Array(count);
  const tmp = new Float64Array(3);
  for (let j = 0; j < count; j++) {
    const q = point(ts[j]);
    if (traceToPlane(pm, E, sphereDir(q[0], q[1]), h0, farM, tmp)) {
      hits[j] = 1;
      gx[j] = tmp[0];
      gy[j] = tmp[1];
      run[j] = tmp[2];
    }
  }
  return {
    count,
    t: ts,
    period: N,
    at: (t) => {
      const q = point(t);
      return sphereDir(q[0], q[1]);
    },
    inside: (t, eps) => {
      const tt = ((t % N) + N) % N;
      const k = Math.min(N - 1, Math.floor(tt));
      const a = ring[k];
      const b = ring[(k + 1) % N];
      const q = point(t);
      // Left normal of the edge (interior side of a counter-clockwise ring), edge-length scaled.
      return sphereDir(q[0] - ccw * eps * (b[1] - a[1]), q[1] + ccw * eps * (b[0] - a[0]));
    },
    hits,
    gx,
    gy,
    run,
  };
}

/** Unit direction from the sphere's centre of the point where the eye ray of image-plane point (x, y) meets the sphere (the tangent point for a ray that just misses it). */
function sphereDirection(pm: PlacedMirror, E: Vec3, d0: Vec3, e1: Vec3, e2: Vec3, x: number, y: number): Vec3 {
  let dx = d0[0] + x * e1[0] + y * e2[0];
  let dy = d0[1] + x * e1[1] + y * e2[1];
  let dz = d0[2] + x * e1[2] + y * e2[2];
  const l = Math.sqrt(dx * dx + dy * dy + dz * dz);
  dx /= l;
  dy /= l;
  dz /= l;
  const ox = E[0] - pm.C[0];
  const oy = E[1] - pm.C[1];
  const oz = E[2] - pm.C[2];
  const b = ox * dx + oy * dy + oz * dz;
  const c = ox * ox + oy * oy + oz * oz - pm.R * pm.R;
  const disc = Math.max(0, b * b - c);
  const t = -b - Math.sqrt(disc);
  const mx = (E[0] + t * dx - pm.C[0]) / pm.R;
  const my = (E[1] + t * dy - pm.C[1]) / pm.R;
  const mz = (E[2] + t * dz - pm.C[2]) / pm.R;
  const ml = Math.sqrt(mx * mx + my * my + mz * mz);
  return [mx / ml, my / ml, mz / ml];
}
