import { angleBetween, sub, type Vec3 } from '../geometry/vec3';
import { sphereReflectionPoint } from './alhazen';
import { OpticsInputError, requirePoint, requirePositive } from './errors';
import { checkEye, onPortion, placeMirror, type Mirror } from './mirror';
import type { Pose } from './pose';
import { anyWallBlocks, checkWalls, type Wall } from './walls';

export type Visibility = {
  visible: boolean;
  /** Where the sightline reflects, metres, whenever that point is on the mirror. */
  reflectionPointM?: Vec3;
  /** Why not, for a person: which condition failed first. */
  reason: 'visible' | 'hidden-by-mirror-body' | 'off-the-mirror' | 'beyond-range' | 'blocked-eye-side' | 'blocked-far-side';
};

export type VisibilityInput = {
  mirror: Mirror;
  pose: Pose;
  eyeM: Vec3;
  pointM: Vec3;
  walls?: readonly Wall[];
  /** When given, points farther than this horizontally from the point under the vertex are not counted. */
  maxRangeM?: number;
};

/**
 * Whether the eye sees a point in the mirror, exactly. The reflection point on the sphere is
 * found by solving Alhazen's problem (see `sphereReflectionPoint`); the point is seen when that
 * reflection point exists (the sphere does not hide one from the other), lies on the mirror's
 * reflecting part, is within range, and no wall blocks either leg of the sightline (eye →
 * mirror or mirror → point) below its top.
 */
export function visibleInMirror(input: VisibilityInput): Visibility {
  const pm = placeMirror(input.mirror, input.pose);
  const eyeM = requirePoint('eyeM', input.eyeM, 'eye position');
  const pointM = requirePoint('pointM', input.pointM, 'point');
  const walls = checkWalls(input.walls);
  checkEye(pm, eyeM);
  if (input.maxRangeM !== undefined) {
    const r = requirePositive('maxRangeM', input.maxRangeM, 'range');
    const v = pm.pose.vertexM;
    if (Math.hypot(pointM[0] - v[0], pointM[1] - v[1]) > r) return { visible: false, reason: 'beyond-range' };
  }
  const m = sphereReflectionPoint(pm.C, pm.R, eyeM, pointM);
  if (!m) return { visible: false, reason: 'hidden-by-mirror-body' };
  const P: Vec3 = [pm.C[0] + pm.R * m[0], pm.C[1] + pm.R * m[1], pm.C[2] + pm.R * m[2]];
  if (!onPortion(pm, m)) return { visible: false, reason: 'off-the-mirror' };
  if (anyWallBlocks(walls, eyeM, P)) return { visible: false, reflectionPointM: P, reason: 'blocked-eye-side' };
  if (anyWallBlocks(walls, P, pointM)) return { visible: false, reflectionPointM: P, reason: 'blocked-far-side' };
  return { visible: true, reflectionPointM: P, reason: 'visible' };
}

/**
 * Exact angle (radians) that a straight target subtends at the eye as seen in the mirror:
 * the target runs from `pointM` for `targetSizeM` along `directionM` (default straight up, a
 * person or post standing at the point). Each end's reflection point is found exactly and the
 * angle is that between the two eye → reflection-point directions. Returns null when either
 * end is not seen in the mirror (walls and range are not considered here).
 */
export function apparentAngle(input: {
  mirror: Mirror;
  pose: Pose;
  eyeM: Vec3;
  pointM: Vec3;
  targetSizeM: number;
  directionM?: Vec3;
}): number | null {
  const h = requirePositive('targetSizeM', input.targetSizeM, 'target size');
  const dir = input.directionM === undefined ? ([0, 0, 1] as Vec3) : requirePoint('directionM', input.directionM, 'target direction');
  const dl = Math.hypot(dir[0], dir[1], dir[2]);
  if (!(dl > 0)) throw new OpticsInputError('directionM', 'The target direction cannot be the zero vector.');
  const a = visibleInMirror({ mirror: input.mirror, pose: input.pose, eyeM: input.eyeM, pointM: input.pointM });
  const top: Vec3 = [input.pointM[0] + (h * dir[0]) / dl, input.pointM[1] + (h * dir[1]) / dl, input.pointM[2] + (h * dir[2]) / dl];
  const b = visibleInMirror({ mirror: input.mirror, pose: input.pose, eyeM: input.eyeM, pointM: top });
  if (!a.visible || !b.visible || !a.reflectionPointM || !b.reflectionPointM) return null;
  return angleBetween(sub(a.reflectionPointM, input.eyeM), sub(b.reflectionPointM, input.eyeM));
}
