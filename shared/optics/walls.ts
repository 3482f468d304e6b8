import type { Pair, Ring } from '../geometry/polygon';
import type { Vec3 } from '../geometry/vec3';
import { sphereReflectionPoint } from './alhazen';
import { OpticsInputError } from './errors';
import type { PlacedMirror } from './mirror';
import { REL_EPS } from '../geometry/tolerance';

/**
 * A wall, rack or other obstacle: a vertical rectangle standing on the floor (z = 0) over the
 * segment aM–bM (metres, plan x, y) up to `heightM`. It blocks a sightline only where the
 * line passes below its top; it has no thickness.
 */
export type Wall = { aM: Pair; bM: Pair; heightM: number };

/**
 * Validates walls; a wall needs two distinct finite ends and a positive finite height. Returns
 * the same array (not a copy), so that the spatial index cached for it is found again.
 */
export function checkWalls(walls: readonly Wall[] | undefined, field = 'walls'): readonly Wall[] {
  if (walls === undefined) return [];
  if (!Array.isArray(walls)) throw new OpticsInputError(field, 'Walls must be a list.');
  walls.forEach((w, i) => {
    const f = `${field}[${i}]`;
    const okPair = (p: unknown): p is Pair =>
      Array.isArray(p) && p.length === 2 && p.every((c) => typeof c === 'number' && Number.isFinite(c));
    if (typeof w !== 'object' || w === null || !okPair(w.aM) || !okPair(w.bM)) {
      throw new OpticsInputError(f, `Wall ${i + 1} needs two end points (x, y in metres).`);
    }
    if (w.aM[0] === w.bM[0] && w.aM[1] === w.bM[1]) {
      throw new OpticsInputError(f, `Wall ${i + 1} has both ends at the same point; give it a length.`);
    }
    if (typeof w.heightM !== 'number' || !Number.isFinite(w.heightM) || w.heightM <= 0) {
      throw new OpticsInputError(`${f}.heightM`, `Wall ${i + 1} needs a height greater than zero.`);
    }
  });
  return walls;
}

/**
 * True when the straight sightline S → T passes through the wall below its top. The ends of
 * the sightline themselves are not counted (a point on a wall's foot is not hidden by it).
 */
export function wallBlocks(wall: Wall, S: Vec3, T: Vec3): boolean {
  const dx = T[0] - S[0];
  const dy = T[1] - S[1];
  const ex = wall.bM[0] - wall.aM[0];
  const ey = wall.bM[1] - wall.aM[1];
  const den = dx * ey - dy * ex;
  if (den === 0) return false;
  const ax = wall.aM[0] - S[0];
  const ay = wall.aM[1] - S[1];
  const s = (ax * ey - ay * ex) / den;
  const t = (ax * dy - ay * dx) / den;
  if (s <= REL_EPS || s >= 1 - REL_EPS || t < 0 || t > 1) return false;
  const z = S[2] + s * (T[2] - S[2]);
  return z < wall.heightM;
}

/** True when any wall blocks the sightline S → T. */
export function anyWallBlocks(walls: readonly Wall[], S: Vec3, T: Vec3): boolean {
  for (const w of walls) if (wallBlocks(w, S, T)) return true;
  return false;
}

/**
 * The part of the plane z = h0 hidden by a wall from the mirror's reflected rays (the
 * mirror → floor leg), as a ring.
 *
 * Exact statement: Q is hidden when the reflected sightline P(Q) → Q passes below the wall's
 * top, P(Q) being Q's reflection point. The hidden set is bounded by the wall's foot A–B and by
 * the images of the wall's other three edges (its two vertical sides and its top): for a point
 * T on them, the reflected ray through T continues past T to the plane at
 * Q = T + (T − P(T))·(z_T − h0)/(z_P − z_T), with P(T) found exactly (Alhazen). Because P(T)
 * changes along the edge, the image is curved; it is followed by adaptive subdivision until the
 * midpoint of every chord lies within `tolM` of it (at most 2⁸ pieces per edge). A point whose
 * reflection point is not above it sends the shadow out to `farM`.
 */
/** How far below its reflection point a grazing sightline is taken to pass (see `far`). */
const GRAZE_BELOW_M = 1e-4;

export function wallShadowRing(pm: PlacedMirror, eyeM: Vec3, wall: Wall, h0: number, farM: number, tolM = 0.005): Ring | null {
  const H = wall.heightM;
  if (H <= h0) return null;
  const A = wall.aM;
  const B = wall.bM;
  const reflectionAt = (x: number, y: number, z: number): Vec3 => {
    const m = sphereReflectionPoint(pm.C, pm.R, eyeM, [x, y, z]);
    return m ? [pm.C[0] + pm.R * m[0], pm.C[1] + pm.R * m[1], pm.C[2] + pm.R * m[2]] : pm.pose.vertexM;
  };
  const far = (x: number, y: number, z: number): Pair => {
    if (z <= h0) return [x, y];
    const P = reflectionAt(x, y, z);
    const dx = x - P[0];
    const dy = y - P[1];
    const dl = Math.hypot(dx, dy);
    if (dl === 0) return [x, y];
    const run = P[2] > z ? Math.min(farM, (dl * (z - h0)) / (P[2] - z)) : farM;
    return [x + (dx / dl) * run, y + (dy / dl) * run];
  };
  const ring: Ring = [
    [A[0], A[1]],
    [B[0], B[1]],
  ];
  // The highest point of a vertical side whose sightline still comes down to the plane: the whole
  // side when the wall is lower than its reflection point, else just below where they meet.
  const sideTop = (x: number, y: number): number => {
    let z = H;
    for (let i = 0; i < 8; i++) {
      const Pz = reflectionAt(x, y, z)[2];
      if (Pz > z) return z;
      z = Math.max(h0 + 1e-9, Pz - GRAZE_BELOW_M);
    }
    return z;
  };
  const zB = sideTop(B[0], B[1]);
  const zA = sideTop(A[0], A[1]);
  // Edges as T(s), s in [0, 1]: side at B going up, top from B to A, side at A going down. A side
  // is followed only up to its grazing height: above it every image lies at `farM`, and sampling
  // there would skip the curved part of the side's image below.
  const edges: ((s: number) => Vec3)[] = [
    (s) => [B[0], B[1], h0 + s * (zB - h0)],
    (s) => [B[0] + s * (A[0] - B[0]), B[1] + s * (A[1] - B[1]), H],
    (s) => [A[0], A[1], zA - s * (zA - h0)],
  ];
  for (const edge of edges) {
    const t0 = edge(0);
    const t1 = edge(1);
    const q0 = far(t0[0], t0[1], t0[2]);
    const q1 = far(t1[0], t1[1], t1[2]);
    const refine = (s0: number, s1: number, a: Pair, b: Pair, depth: number): void => {
      const sm = 0.5 * (s0 + s1);
      const tm = edge(sm);
      const qm = far(tm[0], tm[1], tm[2]);
      if (depth < 8 && chordGap(a, b, qm) > tolM) {
        refine(s0, sm, a, qm, depth + 1);
        ring.push(qm);
        refine(sm, s1, qm, b, depth + 1);
      } else if (depth === 0) {
        // Always keep one midpoint so a gently curved image is not judged by its ends alone.
        ring.push(qm);
      }
    };
    if (edge !== edges[0]) ring.push(q0);
    refine(0, 1, q0, q1, 0);
    ring.push(q1);
  }
  ring.push([ring[0][0], ring[0][1]]);
  return ring;
}

function chordGap(a: Pair, b: Pair, p: Pair): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const L = Math.hypot(dx, dy);
  if (L === 0) return Math.hypot(p[0] - a[0], p[1] - a[1]);
  return Math.abs((p[0] - a[0]) * dy - (p[1] - a[1]) * dx) / L;
}
