import { ANGLE_EPS_RAD } from '../geometry/tolerance';
import { cross, norm, type Vec3 } from '../geometry/vec3';
import { OpticsInputError, requireFinite, requirePoint } from './errors';

/**
 * Where a mirror is and where it faces. `vertexM` is the point of the mirror surface on its
 * central axis (the centre of a panel's face; for a dome, the pole of the dome portion).
 * `axis` is the outward normal there, pointing toward the viewer's side (any length; it is
 * normalised).
 */
export type Pose = { vertexM: Vec3; axis: Vec3 };

/**
 * A pose from an installer's aim: azimuth measured in the floor plane from +x toward +y
 * (0 = +x, π/2 = +y), tilt measured down from horizontal (0 = level, π/2 = straight down).
 * axis = (cos t·cos az, cos t·sin az, −sin t).
 */
export function poseFromAim(input: { vertexM: Vec3; azimuthRad: number; tiltDownRad: number }): Pose {
  const vertexM = requirePoint('vertexM', input.vertexM, 'mirror position');
  const az = requireFinite('azimuthRad', input.azimuthRad, 'aim (azimuth)');
  const tilt = requireFinite('tiltDownRad', input.tiltDownRad, 'tilt');
  if (Math.abs(tilt) > Math.PI / 2 + ANGLE_EPS_RAD) {
    throw new OpticsInputError('tiltDownRad', 'Tilt must be between 90° up and 90° down.');
  }
  const c = Math.cos(tilt);
  return { vertexM: [...vertexM] as Vec3, axis: [c * Math.cos(az), c * Math.sin(az), -Math.sin(tilt)] };
}

/**
 * Orthonormal frame of a pose: w = unit axis; u = horizontal unit vector across the mirror
 * (ẑ × w normalised, so the width of a rectangular panel is horizontal); v = w × u (the panel's
 * "up" on its face). For an axis exactly vertical, u = +x.
 */
export type Frame = { u: Vec3; v: Vec3; w: Vec3 };

export function frameOf(axis: Vec3): Frame {
  const n = norm(axis);
  const w: Vec3 = [axis[0] / n, axis[1] / n, axis[2] / n];
  let u: Vec3 = [-w[1], w[0], 0];
  const un = Math.hypot(u[0], u[1]);
  u = un > 0 ? [u[0] / un, u[1] / un, 0] : [1, 0, 0];
  const v = cross(w, u);
  return { u, v, w };
}

/** Validates a pose and returns a copy with a unit axis. */
export function checkPose(pose: Pose, field = 'pose'): Pose {
  if (typeof pose !== 'object' || pose === null) {
    throw new OpticsInputError(field, 'Give the mirror a position and an aim.');
  }
  const vertexM = requirePoint(`${field}.vertexM`, pose.vertexM, 'mirror position');
  const axis = requirePoint(`${field}.axis`, pose.axis, 'mirror axis');
  const n = norm(axis);
  if (!(n > 0)) throw new OpticsInputError(`${field}.axis`, 'The mirror axis cannot be the zero vector.');
  return { vertexM: [...vertexM] as Vec3, axis: [axis[0] / n, axis[1] / n, axis[2] / n] };
}

/** Azimuth (rad, from +x toward +y) and downward tilt (rad) of a pose's axis. */
export function aimOfPose(pose: Pose): { azimuthRad: number; tiltDownRad: number } {
  const w = pose.axis;
  const n = norm(w);
  return { azimuthRad: Math.atan2(w[1], w[0]), tiltDownRad: Math.asin(Math.max(-1, Math.min(1, -w[2] / n))) };
}
