/**
 * Where a point of the plan is on site, as an installer finds it with a tape measure: two
 * dimensions, each taken square to a wall face they can reach ("1.20 m from wall W3 (north face)"),
 * or, where no wall serves, from a grid line through the plan's origin ("19.75 m east of grid line
 * x = 0"). Used by the sheet's plan page and its mirror tables.
 *
 * Plan frame: metres, x to the right (east), y up (north); "north" means plan north, the top of the
 * printed plan.
 *
 * The rule (a product choice, common setting-out practice: measure square off the nearest faces,
 * two roughly perpendicular ones):
 * 1. A wall can be measured from when it is a wall or racking (not a doorway), at least
 *    `MIN_WALL_M` long, the foot of the perpendicular from the point lies on it, that foot is at most
 *    `MAX_TAPE_M` away, and no other wall or racking stands across the tape.
 * 2. The first dimension is taken from the nearest such wall.
 * 3. The second from the nearest such wall within `PERPENDICULAR_TOLERANCE_RAD` of square to the
 *    first; if none, from the origin grid line across the first wall's direction, when that wall is
 *    within the same tolerance of a grid axis (else both from the grid, as in 4).
 * 4. With no wall at all, both come from the origin grid lines x = 0 and y = 0.
 */
import { segmentsIntersect, type Pair } from './geometry/polygon';

export const MIN_WALL_M = 0.3;
/** A common long tape (30 m); farther faces are not offered as a place to measure from. */
export const MAX_TAPE_M = 30;
/** How far from square two measuring walls may be. */
export const PERPENDICULAR_TOLERANCE_RAD = (20 * Math.PI) / 180;

export interface DatumWall {
  kind: 'wall' | 'racking' | 'door';
  aM: readonly [number, number];
  bM: readonly [number, number];
}

export type Face = 'north' | 'north-east' | 'east' | 'south-east' | 'south' | 'south-west' | 'west' | 'north-west';

export interface WallDimension {
  kind: 'wall';
  /** Index into the walls given. */
  wallIndex: number;
  /** "W3" (a wall) or "R2" (racking), numbered by kind in plan order: see `wallNames`. */
  name: string;
  /** The face measured from: the side of the wall the point is on. */
  face: Face;
  distanceM: number;
  /** Where the tape meets the face. */
  footM: [number, number];
}

export interface GridDimension {
  kind: 'grid';
  /** Grid line x = 0 (a distance east or west) or y = 0 (north or south). */
  line: 'x' | 'y';
  /** Signed: the point's coordinate across that line. */
  offsetM: number;
  footM: [number, number];
}

export type Dimension = WallDimension | GridDimension;

/** Names for walls ("W1", "W2" …) and racking ("R1" …) in plan order; null for a doorway. */
export function wallNames(walls: readonly Pick<DatumWall, 'kind'>[]): (string | null)[] {
  let w = 0;
  let r = 0;
  return walls.map((wall) => (wall.kind === 'wall' ? `W${++w}` : wall.kind === 'racking' ? `R${++r}` : null));
}

const FACES: Face[] = ['east', 'north-east', 'north', 'north-west', 'west', 'south-west', 'south', 'south-east'];

/** The compass name (plan north up) nearest to direction (dx, dy). */
export function faceOf(dx: number, dy: number): Face {
  const sector = Math.round(Math.atan2(dy, dx) / (Math.PI / 4));
  return FACES[(sector + 8) % 8];
}

interface Candidate {
  index: number;
  distanceM: number;
  footM: [number, number];
  /** Unit direction of the wall. */
  dir: [number, number];
}

/** A wall's foot of the perpendicular from `p`, if it falls on the wall; null for a doorway or a short wall. */
function candidate(p: Pair, wall: DatumWall, index: number): Candidate | null {
  if (wall.kind === 'door') return null;
  const [ax, ay] = wall.aM;
  const dx = wall.bM[0] - ax;
  const dy = wall.bM[1] - ay;
  const len = Math.hypot(dx, dy);
  if (!(len >= MIN_WALL_M)) return null;
  const t = ((p[0] - ax) * dx + (p[1] - ay) * dy) / (len * len);
  if (t < 0 || t > 1) return null;
  const footM: [number, number] = [ax + t * dx, ay + t * dy];
  const distanceM = Math.hypot(p[0] - footM[0], p[1] - footM[1]);
  if (distanceM > MAX_TAPE_M) return null;
  return { index, distanceM, footM, dir: [dx / len, dy / len] };
}

/** The tape from `p` to the foot, less a millimetre at each end, meets no other wall or racking. */
function clearTape(p: Pair, c: Candidate, walls: readonly DatumWall[]): boolean {
  const dx = c.footM[0] - p[0];
  const dy = c.footM[1] - p[1];
  const len = Math.hypot(dx, dy);
  if (len <= 0.002) return true;
  const s = 0.001 / len;
  const from: Pair = [p[0] + dx * s, p[1] + dy * s];
  const to: Pair = [c.footM[0] - dx * s, c.footM[1] - dy * s];
  return walls.every((w, i) => i === c.index || w.kind === 'door' || !segmentsIntersect(from, to, [w.aM[0], w.aM[1]], [w.bM[0], w.bM[1]]));
}

function toWallDimension(p: Pair, c: Candidate, names: readonly (string | null)[]): WallDimension {
  // The face the point looks at: from the foot toward the point; a point on the wall's line takes
  // the wall's left-hand normal.
  const along = c.distanceM > 1e-9;
  const face = along ? faceOf(p[0] - c.footM[0], p[1] - c.footM[1]) : faceOf(-c.dir[1], c.dir[0]);
  return { kind: 'wall', wallIndex: c.index, name: names[c.index] ?? '', face, distanceM: c.distanceM, footM: c.footM };
}

const gridX = (p: Pair): GridDimension => ({ kind: 'grid', line: 'x', offsetM: p[0], footM: [0, p[1]] });
const gridY = (p: Pair): GridDimension => ({ kind: 'grid', line: 'y', offsetM: p[1], footM: [p[0], 0] });

/** Two dimensions that place `point` on site (see the rule at the top of this file). */
export function locate(point: readonly [number, number], walls: readonly DatumWall[]): [Dimension, Dimension] {
  const p: Pair = [point[0], point[1]];
  const names = wallNames(walls);
  const candidates = walls
    .map((w, i) => candidate(p, w, i))
    .filter((c): c is Candidate => c !== null)
    .sort((a, b) => a.distanceM - b.distanceM || a.index - b.index);
  const first = candidates.find((c) => clearTape(p, c, walls));
  if (!first) return [gridX(p), gridY(p)];
  const maxCos = Math.sin(PERPENDICULAR_TOLERANCE_RAD);
  const second = candidates.find(
    (c) => c !== first && Math.abs(c.dir[0] * first.dir[0] + c.dir[1] * first.dir[1]) <= maxCos + 1e-12 && clearTape(p, c, walls),
  );
  const a = toWallDimension(p, first, names);
  if (second) return [a, toWallDimension(p, second, names)];
  // Along the first wall: from the grid line that crosses it most squarely, if that is near enough
  // to square; a wall at a slant (say 45°) with no square partner gives way to the grid entirely.
  const alongX = Math.abs(first.dir[0]) >= Math.abs(first.dir[1]);
  const skew = alongX ? Math.abs(first.dir[1]) : Math.abs(first.dir[0]);
  if (skew > maxCos + 1e-12) return [gridX(p), gridY(p)];
  return [a, alongX ? gridX(p) : gridY(p)];
}

/** "1.20 m from wall W3 (north face)", "19.75 m east of grid line x = 0", in the reader's units. */
export function describeDimension(d: Dimension, dist: (m: number) => string): string {
  if (d.kind === 'wall') {
    const what = d.name.startsWith('R') ? 'racking' : 'wall';
    return `${dist(d.distanceM)} from ${what} ${d.name} (${d.face} face)`;
  }
  const dir = d.line === 'x' ? (d.offsetM < 0 ? 'west' : 'east') : d.offsetM < 0 ? 'south' : 'north';
  return `${dist(Math.abs(d.offsetM))} ${dir} of grid line ${d.line} = 0`;
}
