import { LENGTH_EPS_M } from '../geometry/tolerance';
import { clipToSlab } from '../geometry/clip';
import { robustIntersection } from '../geometry/robust-boolean';
import type { Pair, Ring } from '../geometry/polygon';
import { cross, dot, norm, type Vec3 } from '../geometry/vec3';
import { onPortion, type PlacedMirror } from './mirror';
import type { TracedFan } from './trace';
import type { Wall } from './walls';

/**
 * Floor hidden because a wall stands between the eye and the mirror (the eye → mirror leg).
 *
 * Method: in the eye's gnomonic image plane (central projection about the eye → vertex
 * direction), where straight 3-D edges stay straight, the wall's rectangle is intersected with
 * the outline of the visible mirror. Each point of that intersection is a direction from the
 * eye; it is traced exactly (ray–sphere, reflect, plane) to the plane, giving the floor that
 * the wall hides. Only the part of the wall nearer to the eye than the nearest point of the
 * mirror is used: a wall behind the mirror (for instance the wall it is mounted on) never hides
 * it. Approximation: a wall that reaches into the mirror's own depth band (within the mirror's
 * few centimetres of depth as seen by the eye) is treated as not hiding that part.
 */
export function eyeSideShadows(pm: PlacedMirror, eyeM: Vec3, fan: TracedFan, walls: readonly Wall[], h0: number, farM: number): Ring[] {
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
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
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
    minX = Math.min(minX, g[0]);
    minY = Math.min(minY, g[1]);
    maxX = Math.max(maxX, g[0]);
    maxY = Math.max(maxY, g[1]);
  }
  const back: Vec3 = [-d0[0], -d0[1], -d0[2]];
  const eC: Vec3 = [E[0] - pm.C[0], E[1] - pm.C[1], E[2] - pm.C[2]];
  if (onPortion(pm, back) && dot(back, eC) > pm.R) {
    zmin = Math.min(zmin, depth(pm.C[0] - pm.R * d0[0], pm.C[1] - pm.R * d0[1], pm.C[2] - pm.R * d0[2]));
  }
  outline.push([outline[0][0], outline[0][1]]);
  const step = Math.hypot(maxX - minX, maxY - minY) / 64;

  // A wall can stand between the eye and the mirror only if it meets the plan box of both.
  let bx0 = E[0];
  let by0 = E[1];
  let bx1 = E[0];
  let by1 = E[1];
  for (let j = 0; j < fan.count; j++) {
    bx0 = Math.min(bx0, fan.point[3 * j]);
    by0 = Math.min(by0, fan.point[3 * j + 1]);
    bx1 = Math.max(bx1, fan.point[3 * j]);
    by1 = Math.max(by1, fan.point[3 * j + 1]);
  }
  const out: Ring[] = [];
  for (const w of walls) {
    if (Math.max(w.aM[0], w.bM[0]) < bx0 || Math.min(w.aM[0], w.bM[0]) > bx1 || Math.max(w.aM[1], w.bM[1]) < by0 || Math.min(w.aM[1], w.bM[1]) > by1) {
      continue;
    }
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
    let ix0 = Infinity;
    let iy0 = Infinity;
    let ix1 = -Infinity;
    let iy1 = -Infinity;
    for (const q of img) {
      ix0 = Math.min(ix0, q[0]);
      iy0 = Math.min(iy0, q[1]);
      ix1 = Math.max(ix1, q[0]);
      iy1 = Math.max(iy1, q[1]);
    }
    if (ix0 > maxX || ix1 < minX || iy0 > maxY || iy1 < minY) continue;
    img.push([img[0][0], img[0][1]]);
    const hidden = robustIntersection([outline], [img]);
    for (const poly of hidden) {
      for (const ring of poly) {
        const floor: Ring = [];
        for (let k = 0; k + 1 < ring.length; k++) {
          const [x0, y0] = ring[k];
          const [x1, y1] = ring[k + 1];
          const n = Math.max(1, Math.ceil(Math.hypot(x1 - x0, y1 - y0) / step));
          for (let s = 0; s < n; s++) {
            const f = s / n;
            floor.push(traceDirection(pm, E, d0, e1, e2, x0 + f * (x1 - x0), y0 + f * (y1 - y0), h0, farM));
          }
        }
        if (floor.length >= 3) {
          floor.push([floor[0][0], floor[0][1]]);
          out.push(floor);
        }
      }
    }
  }
  return out;
}

/** Traces the eye ray of image-plane point (x, y) to the sphere, reflects it, and meets the plane (parked at farM if not). */
function traceDirection(pm: PlacedMirror, E: Vec3, d0: Vec3, e1: Vec3, e2: Vec3, x: number, y: number, h0: number, farM: number): Pair {
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
  const px = E[0] + t * dx;
  const py = E[1] + t * dy;
  const pz = E[2] + t * dz;
  const mx = (px - pm.C[0]) / pm.R;
  const my = (py - pm.C[1]) / pm.R;
  const mz = (pz - pm.C[2]) / pm.R;
  const k = 2 * (dx * mx + dy * my + dz * mz);
  const rx = dx - k * mx;
  const ry = dy - k * my;
  const rz = dz - k * mz;
  const h = Math.hypot(rx, ry);
  const dzp = h0 - pz;
  if (rz < 0 && dzp < 0 && (dzp / rz) * h <= farM) {
    const s = dzp / rz;
    return [px + s * rx, py + s * ry];
  }
  return h > 0 ? [px + (rx / h) * farM, py + (ry / h) * farM] : [px, py];
}
