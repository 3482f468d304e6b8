import { EYE_MARGIN, REL_EPS } from '../geometry/tolerance';
import { dot, norm, scale, sub, type Vec3 } from '../geometry/vec3';
import { OpticsInputError, requirePositive } from './errors';
import { checkPose, frameOf, type Frame, type Pose } from './pose';

/**
 * A convex mirror. Panels are sphere caps cut by their outline as seen straight on:
 * - round: rim is a circle of diameter `diameterM` (the chord, as measured across the face);
 * - rect: the projection of the face onto the tangent plane at the vertex is a `widthM` ×
 *   `heightM` rectangle, width horizontal;
 * `radiusM` is the radius of curvature of the sphere.
 * Domes are parts of a sphere of radius `diameterM`/2 (model choice, documented in
 * {@link domePortionNormals}): full = hemisphere (ceiling), half = quarter sphere (wall and
 * ceiling), quarter = eighth sphere (corner of two walls and a ceiling).
 */
export type Mirror =
  | { shape: 'round'; diameterM: number; radiusM: number }
  | { shape: 'rect'; widthM: number; heightM: number; radiusM: number }
  | { shape: 'dome'; portion: 'full' | 'half' | 'quarter'; diameterM: number };

/** Validates a mirror; throws {@link OpticsInputError} with a sentence naming what to change. */
export function checkMirror(mirror: Mirror, field = 'mirror'): Mirror {
  if (typeof mirror !== 'object' || mirror === null) {
    throw new OpticsInputError(field, 'Choose a mirror: round, rectangular or dome.');
  }
  const m = mirror as Record<string, unknown>;
  switch (m.shape) {
    case 'round': {
      const d = requirePositive(`${field}.diameterM`, m.diameterM, 'mirror diameter');
      const r = requirePositive(`${field}.radiusM`, m.radiusM, 'radius of curvature');
      if (d >= 2 * r) {
        throw new OpticsInputError(
          `${field}.diameterM`,
          `A ${fmt(d)} m mirror cannot be cut from a sphere of radius ${fmt(r)} m: the diameter must be less than twice the radius of curvature (${fmt(2 * r)} m).`,
        );
      }
      return { shape: 'round', diameterM: d, radiusM: r };
    }
    case 'rect': {
      const w = requirePositive(`${field}.widthM`, m.widthM, 'mirror width');
      const h = requirePositive(`${field}.heightM`, m.heightM, 'mirror height');
      const r = requirePositive(`${field}.radiusM`, m.radiusM, 'radius of curvature');
      if (Math.hypot(w, h) >= 2 * r) {
        throw new OpticsInputError(
          `${field}.radiusM`,
          `A ${fmt(w)} × ${fmt(h)} m panel needs a radius of curvature above ${fmt(Math.hypot(w, h) / 2)} m (half its diagonal).`,
        );
      }
      return { shape: 'rect', widthM: w, heightM: h, radiusM: r };
    }
    case 'dome': {
      if ('radiusM' in m && m.radiusM !== undefined) {
        throw new OpticsInputError(
          `${field}.radiusM`,
          'A dome is a part of a sphere whose radius is half its diameter; give the diameter only.',
        );
      }
      const d = requirePositive(`${field}.diameterM`, m.diameterM, 'dome diameter');
      if (m.portion !== 'full' && m.portion !== 'half' && m.portion !== 'quarter') {
        throw new OpticsInputError(`${field}.portion`, 'Choose a full, half or quarter dome.');
      }
      return { shape: 'dome', portion: m.portion, diameterM: d };
    }
    default:
      throw new OpticsInputError(`${field}.shape`, 'Choose a mirror shape: round, rectangular or dome.');
  }
}

function fmt(x: number): string {
  return Number(x.toPrecision(4)).toString();
}

/** Radius of the sphere the mirror is cut from, metres. */
export function sphereRadiusM(mirror: Mirror): number {
  return mirror.shape === 'dome' ? mirror.diameterM / 2 : mirror.radiusM;
}

/**
 * Tilt (radians down from horizontal) at which a dome portion sits in its usual mount, so
 * that its flat faces lie on the ceiling and walls: full π/2 (axis straight down), half π/4
 * (bisecting ceiling and wall), quarter atan(1/√2) ≈ 35.26° (the corner's diagonal).
 */
export function domeMountTiltRad(portion: 'full' | 'half' | 'quarter'): number {
  if (portion === 'full') return Math.PI / 2;
  if (portion === 'half') return Math.PI / 4;
  return Math.atan(1 / Math.SQRT2);
}

/**
 * Unit normals n of the planes through the sphere's centre that bound a dome portion; the
 * portion is { C + R·m : m·n ≥ 0 for every n }. In the pose frame (u, v, w):
 * - full: [w] — a hemisphere around the axis;
 * - half: (w ± v)/√2 — a quarter sphere; mounted at tilt π/4 these are "out of the wall" and
 *   "down from the ceiling";
 * - quarter: (w + √2(cos β·u + sin β·v))/√3 for β = −90°, 30°, 150° — three mutually
 *   perpendicular planes whose corner diagonal is the axis (an eighth sphere); mounted at
 *   tilt atan(1/√2) the β = −90° plane is the ceiling.
 */
export function domePortionNormals(portion: 'full' | 'half' | 'quarter', f: Frame): Vec3[] {
  const { u, v, w } = f;
  if (portion === 'full') return [w];
  if (portion === 'half') {
    const s = Math.SQRT1_2;
    return [
      [(w[0] + v[0]) * s, (w[1] + v[1]) * s, (w[2] + v[2]) * s],
      [(w[0] - v[0]) * s, (w[1] - v[1]) * s, (w[2] - v[2]) * s],
    ];
  }
  const out: Vec3[] = [];
  for (const deg of [-90, 30, 150]) {
    const b = (deg * Math.PI) / 180;
    const cu = Math.SQRT2 * Math.cos(b);
    const cv = Math.SQRT2 * Math.sin(b);
    out.push([
      (w[0] + cu * u[0] + cv * v[0]) / Math.sqrt(3),
      (w[1] + cu * u[1] + cv * v[1]) / Math.sqrt(3),
      (w[2] + cu * u[2] + cv * v[2]) / Math.sqrt(3),
    ]);
  }
  return out;
}

/** A half-space constraint on unit sphere directions m: m·k ≥ c. */
export type Constraint = { k: Vec3; c: number };

/**
 * A mirror placed in the world, ready for tracing: sphere centre C, radius R, pose frame, and
 * the constraints on unit directions m (point = C + R·m) that describe its reflecting part.
 */
export type PlacedMirror = {
  mirror: Mirror;
  pose: Pose;
  R: number;
  C: Vec3;
  frame: Frame;
  portion: Constraint[];
  isDome: boolean;
};

/** Sphere centre C = vertex − R·axis. */
export function placeMirror(mirror: Mirror, pose: Pose): PlacedMirror {
  const m = checkMirror(mirror);
  const p = checkPose(pose);
  const R = sphereRadiusM(m);
  const frame = frameOf(p.axis);
  const C = sub(p.vertexM, scale(frame.w, R));
  let portion: Constraint[];
  if (m.shape === 'round') {
    const a = m.diameterM / 2;
    portion = [{ k: frame.w, c: Math.sqrt(1 - (a / R) * (a / R)) }];
  } else if (m.shape === 'rect') {
    const hw = m.widthM / (2 * R);
    const hh = m.heightM / (2 * R);
    const { u, v, w } = frame;
    portion = [
      { k: w, c: 0 },
      { k: u, c: -hw },
      { k: [-u[0], -u[1], -u[2]], c: -hw },
      { k: v, c: -hh },
      { k: [-v[0], -v[1], -v[2]], c: -hh },
    ];
  } else {
    portion = domePortionNormals(m.portion, frame).map((k) => ({ k, c: 0 }));
  }
  return { mirror: m, pose: p, R, C, frame, portion, isDome: m.shape === 'dome' };
}

/** True when unit direction m (from the centre) lies on the reflecting part, within `eps`. */
export function onPortion(pm: PlacedMirror, m: Vec3, eps = REL_EPS): boolean {
  for (const { k, c } of pm.portion) if (dot(m, k) < c - eps) return false;
  return true;
}

/**
 * Checks that the eye can see the mirror's face and returns the unit direction from C of a
 * point the eye surely sees on it. Panels: the eye must be in front of the plane tangent at
 * the vertex ((E − V)·w > 0), which also puts it outside the sphere and lets it see the
 * vertex. Domes: the eye must be outside the sphere and inside every bounding half-space, so
 * the point of the sphere facing the eye is on the dome.
 */
export function checkEye(pm: PlacedMirror, eyeM: Vec3, field = 'eyeM'): Vec3 {
  const e = sub(eyeM, pm.C);
  const dist = norm(e);
  if (dist <= pm.R * (1 + EYE_MARGIN)) {
    throw new OpticsInputError(field, 'The eye is inside the mirror’s sphere; move the viewer in front of the mirror.');
  }
  if (!pm.isDome) {
    if (dot(sub(eyeM, pm.pose.vertexM), pm.frame.w) <= EYE_MARGIN) {
      throw new OpticsInputError(
        field,
        'The eye is behind the mirror; aim the mirror toward the viewer or move the viewer in front of it.',
      );
    }
    return pm.frame.w;
  }
  const m = scale(e, 1 / dist);
  for (const { k } of pm.portion) {
    if (dot(m, k) <= EYE_MARGIN) {
      throw new OpticsInputError(field, 'The eye is behind the dome’s mounting surface; the viewer must be on the open side of the dome.');
    }
  }
  return m;
}
