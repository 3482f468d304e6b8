import type { Pair } from '../geometry/polygon';
import type { Vec3 } from '../geometry/vec3';
import { checkEye, placeMirror, type Mirror, type PlacedMirror } from './mirror';
import { poseFromAim, type Pose } from './pose';
import { anyWallBlocks, checkWalls, type Wall } from './walls';

/**
 * How far (metres) a mirror's body may reach past a wall's face and still count as sitting on
 * it: a bracket or a dome's flat face laid on a wall is placed to the millimetre at best.
 */
export const MOUNT_TOLERANCE_M = 0.005;

/** A wall that passes through a mirror's body. */
export type WallIntrusion = {
  /** Index of the wall in the list given. */
  wallIndex: number;
  /** How deep the body reaches past the wall on its shallower side, metres. */
  depthM: number;
  /**
   * The two horizontal moves of the mirror (plan x, y, metres), one to each side of the wall,
   * that take its body just out of this wall (the nearer side first).
   */
  movesM: [[number, number], [number, number]];
};

/** Half-space k·x ≥ d in world coordinates, k a unit vector. */
type Plane = { k: Vec3; d: number };

/**
 * The mirror's solid body as a ball intersected with half-spaces: the sphere it is cut from
 * and, for a panel, the plane through its rim (round) or its corners (rectangular) and its side
 * planes; for a dome, its flat faces (the planes it is mounted on).
 */
function bodyPlanes(pm: PlacedMirror): Plane[] {
  const C = pm.C;
  const planes: Plane[] = [];
  const m = pm.mirror;
  for (const { k, c } of pm.portion) {
    let cc = c;
    // A rectangular panel's front hemisphere constraint (c = 0) is replaced by the plane of its corners.
    if (m.shape === 'rect' && c === 0) {
      const hw = m.widthM / (2 * pm.R);
      const hh = m.heightM / (2 * pm.R);
      cc = Math.sqrt(Math.max(0, 1 - hw * hw - hh * hh));
    }
    planes.push({ k, d: k[0] * C[0] + k[1] * C[1] + k[2] * C[2] + pm.R * cc });
  }
  return planes;
}

const dot3 = (a: Vec3, b: Vec3): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];

/**
 * Largest value of g·x over the convex body {|x − C| ≤ R} ∩ {k·x ≥ d for each plane}, and a
 * point of the body where it is reached; null when the body is empty. Exact: the maximum lies on the sphere (g's own direction), on the
 * circle where one plane cuts the sphere, where two planes' line meets the sphere, or at a
 * corner of three planes; every such candidate is tried and the feasible best kept.
 */
export function maxLinearOverBody(C: Vec3, R: number, planes: readonly Plane[], g: Vec3): { value: number; pointM: Vec3 } | null {
  const eps = 1e-9 * Math.max(1, R);
  const feasible = (x: Vec3): boolean => {
    const dx = x[0] - C[0];
    const dy = x[1] - C[1];
    const dz = x[2] - C[2];
    if (dx * dx + dy * dy + dz * dz > R * R * (1 + 1e-9) + eps) return false;
    for (const p of planes) if (dot3(p.k, x) < p.d - eps) return false;
    return true;
  };
  let best: { value: number; pointM: Vec3 } | null = null;
  const consider = (x: Vec3): void => {
    if (!feasible(x)) return;
    const v = dot3(g, x);
    if (best === null || v > best.value) best = { value: v, pointM: x };
  };
  const gl = Math.hypot(g[0], g[1], g[2]);
  consider([C[0] + (R * g[0]) / gl, C[1] + (R * g[1]) / gl, C[2] + (R * g[2]) / gl]);
  const n = planes.length;
  for (let i = 0; i < n; i++) {
    const { k, d } = planes[i];
    const off = d - dot3(k, C);
    if (Math.abs(off) > R) continue;
    const c: Vec3 = [C[0] + off * k[0], C[1] + off * k[1], C[2] + off * k[2]];
    const r = Math.sqrt(R * R - off * off);
    const gk = dot3(g, k);
    const gp: Vec3 = [g[0] - gk * k[0], g[1] - gk * k[1], g[2] - gk * k[2]];
    const gpl = Math.hypot(gp[0], gp[1], gp[2]);
    consider(gpl > 1e-12 ? [c[0] + (r * gp[0]) / gpl, c[1] + (r * gp[1]) / gpl, c[2] + (r * gp[2]) / gpl] : c);
    for (let j = i + 1; j < n; j++) {
      const q = planes[j];
      const l: Vec3 = [k[1] * q.k[2] - k[2] * q.k[1], k[2] * q.k[0] - k[0] * q.k[2], k[0] * q.k[1] - k[1] * q.k[0]];
      const ll = dot3(l, l);
      if (ll < 1e-18) continue;
      // Point on both planes: p0 = ((d_i − k_i·C)(k_j × l) + (d_j − k_j·C)(l × k_i)) / |l|² + C.
      const a = d - dot3(k, C);
      const b = q.d - dot3(q.k, C);
      const kjl: Vec3 = [q.k[1] * l[2] - q.k[2] * l[1], q.k[2] * l[0] - q.k[0] * l[2], q.k[0] * l[1] - q.k[1] * l[0]];
      const lki: Vec3 = [l[1] * k[2] - l[2] * k[1], l[2] * k[0] - l[0] * k[2], l[0] * k[1] - l[1] * k[0]];
      const p0: Vec3 = [
        C[0] + (a * kjl[0] + b * lki[0]) / ll,
        C[1] + (a * kjl[1] + b * lki[1]) / ll,
        C[2] + (a * kjl[2] + b * lki[2]) / ll,
      ];
      // Where the line p0 + t·l meets the sphere.
      const w: Vec3 = [p0[0] - C[0], p0[1] - C[1], p0[2] - C[2]];
      const B = dot3(w, l) / ll;
      const disc = B * B - (dot3(w, w) - R * R) / ll;
      if (disc >= 0) {
        const s = Math.sqrt(disc);
        for (const t of [-B - s, -B + s]) consider([p0[0] + t * l[0], p0[1] + t * l[1], p0[2] + t * l[2]]);
      }
      for (let h = j + 1; h < n; h++) {
        const r3 = planes[h];
        const det = dot3(r3.k, l);
        if (Math.abs(det) < 1e-12) continue;
        // Corner of three planes (Cramer's rule): x = (d_i (k_j × k_h) + d_j (k_h × k_i) + d_h (k_i × k_j)) / (k_h · (k_i × k_j)).
        const jh: Vec3 = [q.k[1] * r3.k[2] - q.k[2] * r3.k[1], q.k[2] * r3.k[0] - q.k[0] * r3.k[2], q.k[0] * r3.k[1] - q.k[1] * r3.k[0]];
        const hi: Vec3 = [r3.k[1] * k[2] - r3.k[2] * k[1], r3.k[2] * k[0] - r3.k[0] * k[2], r3.k[0] * k[1] - r3.k[1] * k[0]];
        consider([
          (d * jh[0] + q.d * hi[0] + r3.d * l[0]) / det,
          (d * jh[1] + q.d * hi[1] + r3.d * l[1]) / det,
          (d * jh[2] + q.d * hi[2] + r3.d * l[2]) / det,
        ]);
      }
    }
  }
  return best;
}

/** Largest value of g·x over a placed mirror's body (metres along g, a unit vector); its reflecting surface lies inside. */
export function bodyReach(pm: PlacedMirror, g: Vec3): number {
  const best = maxLinearOverBody(pm.C, pm.R, bodyPlanes(pm), g);
  // The body always holds its vertex; null only when rounding empties it.
  return best ? best.value : dot3(g, pm.pose.vertexM);
}

/**
 * Which side of a wall's line the whole mirror body lies on: +1 on the side of the wall's left
 * normal (−ey, ex), −1 on the other, 0 when the body reaches past the line on both sides by more
 * than `toleranceM` (the mounting tolerance: a body that only touches the face counts as beside it).
 */
export function sideOfWallLine(pm: PlacedMirror, wall: Wall, toleranceM = MOUNT_TOLERANCE_M): -1 | 0 | 1 {
  const ex = wall.bM[0] - wall.aM[0];
  const ey = wall.bM[1] - wall.aM[1];
  const L = Math.hypot(ex, ey);
  const n: Vec3 = [-ey / L, ex / L, 0];
  const offset = n[0] * wall.aM[0] + n[1] * wall.aM[1];
  if (bodyReach(pm, [-n[0], -n[1], 0]) + offset <= toleranceM) return 1;
  if (bodyReach(pm, n) - offset <= toleranceM) return -1;
  return 0;
}

/**
 * Walls and racks that pass through a mirror's body. A wall is a vertical rectangle with no
 * thickness (see {@link Wall}); it passes through the body when the part of the body beside the
 * rectangle (between its ends and below its top) reaches more than `toleranceM` past its plane
 * on both sides. A mirror whose back, rim or flat face only touches a wall's face (as when it is
 * mounted on it) is therefore accepted, and so is one wholly in front of or behind a wall.
 *
 * The body is the solid the reflecting surface bounds: for a panel the cap between the sphere
 * and the plane of its rim (round) or corners (rectangular), for a dome the part of the ball
 * inside its flat faces. Depths are exact (see {@link maxLinearOverBody}).
 */
export function wallsThroughMirror(input: { mirror: Mirror; pose: Pose; walls: readonly Wall[]; toleranceM?: number }): WallIntrusion[] {
  const pm = placeMirror(input.mirror, input.pose);
  const walls = checkWalls(input.walls);
  const tol = input.toleranceM ?? MOUNT_TOLERANCE_M;
  const body = bodyPlanes(pm);
  const out: WallIntrusion[] = [];
  const C = pm.C;
  walls.forEach((w, wallIndex) => {
    const ex = w.bM[0] - w.aM[0];
    const ey = w.bM[1] - w.aM[1];
    const L = Math.hypot(ex, ey);
    const e: Vec3 = [ex / L, ey / L, 0];
    // Cheap rejection: the ball misses the wall's plan segment or lies above its top.
    const t = Math.max(0, Math.min(L, (C[0] - w.aM[0]) * e[0] + (C[1] - w.aM[1]) * e[1]));
    if (Math.hypot(C[0] - w.aM[0] - t * e[0], C[1] - w.aM[1] - t * e[1]) >= pm.R || C[2] - pm.R >= w.heightM) return;
    const eA = e[0] * w.aM[0] + e[1] * w.aM[1];
    const beside: Plane[] = [...body, { k: e, d: eA }, { k: [-e[0], -e[1], 0], d: -(eA + L) }, { k: [0, 0, -1], d: -w.heightM }];
    const n: Vec3 = [-e[1], e[0], 0];
    const nA = n[0] * w.aM[0] + n[1] * w.aM[1];
    const plus = maxLinearOverBody(C, pm.R, beside, n);
    const minus = maxLinearOverBody(C, pm.R, beside, [-n[0], -n[1], 0]);
    if (plus === null || minus === null) return;
    const front = plus.value - nA; // how far the body reaches onto the +n side
    const back = minus.value + nA; // … and onto the −n side
    if (Math.min(front, back) <= tol) return;
    const toPlus: [number, number] = [back * n[0], back * n[1]];
    const toMinus: [number, number] = [-front * n[0], -front * n[1]];
    out.push({ wallIndex, depthM: Math.min(front, back), movesM: back <= front ? [toPlus, toMinus] : [toMinus, toPlus] });
  });
  return out;
}

/**
 * A flat vertical face a mirror hangs on (a wall or a rack's end): `normal` is its horizontal
 * unit normal pointing out of the face, toward the side the mirror hangs on; `maxStandOffM`, when
 * given, is how far the mirror's vertex may stand off the face and still hang on it.
 */
export type MountFace = { normal: Pair; maxStandOffM?: number };

/**
 * Where a mirror's vertex goes when it hangs on a face with this aim: `onFaceM` is the point of
 * the face it hangs at (plan x, y and the mounting height); the vertex is moved out along the
 * face's normal until the rearmost point of its body lies on the face, so its back sits on the
 * wall and the body is wholly in front of it (the same rule as a placement on a site plan: the
 * position is the vertex, and no wall may pass through the body, see {@link wallsThroughMirror}).
 * Turning the mirror on its bracket therefore moves the vertex out from the wall.
 * Null when the aim would face the mirror into the face or along it (its axis has no part
 * pointing out of the face), or when the vertex would stand further off than `maxStandOffM`.
 */
export function vertexOnFace(input: {
  mirror: Mirror;
  onFaceM: Vec3;
  azimuthRad: number;
  tiltDownRad: number;
  face: MountFace;
}): { vertexM: Vec3; standOffM: number } | null {
  const [nx, ny] = input.face.normal;
  const nl = Math.hypot(nx, ny);
  const n: Vec3 = [nx / nl, ny / nl, 0];
  const pose = poseFromAim({ vertexM: input.onFaceM, azimuthRad: input.azimuthRad, tiltDownRad: input.tiltDownRad });
  // Facing out of the face: a mirror cannot look into the wall it hangs on, nor hang edge-on to it.
  if (!(pose.axis[0] * n[0] + pose.axis[1] * n[1] > 1e-6)) return null;
  const pm = placeMirror(input.mirror, pose);
  const rear = maxLinearOverBody(pm.C, pm.R, bodyPlanes(pm), [-n[0], -n[1], 0]);
  if (rear === null) return null;
  const P = input.onFaceM;
  // How far the body reaches behind the face when its vertex is on it (never negative: the vertex is part of the body).
  const standOffM = Math.max(0, rear.value + (n[0] * P[0] + n[1] * P[1]));
  if (input.face.maxStandOffM !== undefined && standOffM > input.face.maxStandOffM) return null;
  return { vertexM: [P[0] + standOffM * n[0], P[1] + standOffM * n[1], P[2]], standOffM };
}

/**
 * The smallest horizontal move (plan x, y, metres) that takes the mirror's body out of every
 * wall, or null when none of the moves tried works. Tried: each wall's move to either side,
 * and each pair of them (a mirror in a corner between two faces). A move must leave the eye,
 * when given, in front of the mirror; moves that leave the straight line from the eye to the
 * mirror's vertex clear of walls are preferred. Returns [0, 0] when nothing passes through.
 */
export function moveOutOfWalls(input: {
  mirror: Mirror;
  pose: Pose;
  walls: readonly Wall[];
  eyeM?: Vec3;
  toleranceM?: number;
}): [number, number] | null {
  const first = wallsThroughMirror(input);
  if (first.length === 0) return [0, 0];
  const singles = first.flatMap((w) => w.movesM);
  const moves: [number, number][] = [...singles];
  for (let i = 0; i < singles.length; i++)
    for (let j = i + 1; j < singles.length; j++) moves.push([singles[i][0] + singles[j][0], singles[i][1] + singles[j][1]]);
  // A hair beyond the face, so that rounding cannot put the body back inside it.
  const nudge = (m: [number, number]): [number, number] => {
    const l = Math.hypot(m[0], m[1]);
    return l > 0 ? [m[0] * (1 + 1e-6 / l), m[1] * (1 + 1e-6 / l)] : m;
  };
  let best: { move: [number, number]; clear: boolean; len: number } | null = null;
  const v = input.pose.vertexM;
  for (const raw of moves) {
    const move = nudge(raw);
    const pose: Pose = { ...input.pose, vertexM: [v[0] + move[0], v[1] + move[1], v[2]] };
    if (wallsThroughMirror({ ...input, pose }).length > 0) continue;
    let clear = true;
    if (input.eyeM) {
      try {
        checkEye(placeMirror(input.mirror, pose), input.eyeM);
      } catch {
        continue;
      }
      clear = !anyWallBlocks(checkWalls(input.walls), input.eyeM, pose.vertexM);
    }
    const len = Math.hypot(move[0], move[1]);
    if (!best || (clear && !best.clear) || (clear === best.clear && len < best.len)) best = { move, clear, len };
  }
  return best ? best.move : null;
}
