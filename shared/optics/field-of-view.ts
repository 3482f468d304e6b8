import { OpticsInputError, requirePositive } from './errors';
import { checkMirror, sphereRadiusM, type Mirror } from './mirror';

/**
 * Angle (rad) from the axis of the ray reflected at a rim point α (angle of the rim's normal
 * from the axis) on a sphere of radius R, for an eye on the axis D from the vertex:
 * θ = 2α + atan(a/(D + s)), a = R·sin α, s = R(1 − cos α). The incident ray makes
 * atan(a/(D + s)) with the axis, the normal makes α, so the reflected ray leaves at
 * 2α + atan(…). Source: docs/sources.md, "Geometry of a spherical mirror" (θ = 2·asin(a/R) + atan(a/(D + s))); R → ∞
 * gives the flat mirror's atan(a/D). When the rim is beyond the sphere's silhouette as seen
 * from the eye (cos α < R/(R + D)), the silhouette bounds the field instead: there the ray
 * grazes and θ = π/2 + α_s.
 */
export function reflectedRimAngle(R: number, D: number, alpha: number): number {
  const alphaSil = Math.acos(R / (R + D));
  const a0 = Math.min(alpha, alphaSil);
  const a = R * Math.sin(a0);
  // s = R(1 − cos α) = 2R·sin²(α/2), without cancellation.
  const s = 2 * R * Math.sin(a0 / 2) ** 2;
  return 2 * a0 + Math.atan2(a, D + s);
}

/**
 * Rim angles (angle of the rim normal from the axis) of a mirror in its horizontal section
 * (through the axis along the frame's u) and vertical section (along v), on both sides.
 * Panels: round asin(a/R); rect asin((w/2)/R) and asin((h/2)/R). Domes (see domePortionNormals):
 * full π/2 all round; half π/2 across and π/4 up and down; quarter atan(√(2/3)) ≈ 39.2° to
 * either side, atan(1/√2) ≈ 35.3° up and atan(√2) ≈ 54.7° down, from its three corner planes.
 */
export function sectionRimAngles(mirror: Mirror): { left: number; right: number; up: number; down: number } {
  if (mirror.shape === 'round') {
    const a = Math.asin(mirror.diameterM / 2 / mirror.radiusM);
    return { left: a, right: a, up: a, down: a };
  }
  if (mirror.shape === 'rect') {
    const a = Math.asin(mirror.widthM / 2 / mirror.radiusM);
    const b = Math.asin(mirror.heightM / 2 / mirror.radiusM);
    return { left: a, right: a, up: b, down: b };
  }
  if (mirror.portion === 'full') return { left: Math.PI / 2, right: Math.PI / 2, up: Math.PI / 2, down: Math.PI / 2 };
  if (mirror.portion === 'half') return { left: Math.PI / 2, right: Math.PI / 2, up: Math.PI / 4, down: Math.PI / 4 };
  // Quarter dome, planes n = (w + √2(cos β u + sin β v))/√3, β = −90°, 30°, 150°.
  // Horizontal section m = cos φ w + sin φ u: binding planes β = 30°, 150° give
  // tan φ ≤ 1/(√2·cos 30°) = √(2/3). Vertical section m = cos φ w + sin φ v: β = −90° gives
  // φ ≤ atan(1/√2) upward; β = 30°, 150° give φ ≥ −atan(√2) downward.
  const h = Math.atan(Math.sqrt(2 / 3));
  return { left: h, right: h, up: Math.atan(Math.SQRT1_2), down: Math.atan(Math.SQRT2) };
}

/**
 * Angular field of view (rad) of a convex mirror for an eye on its axis, `eyeDistanceM` from
 * the vertex: the full angle between the reflected rays from opposite ends of the horizontal
 * (and vertical) section, each θ = 2α + atan(a/(D + s)) (see {@link reflectedRimAngle});
 * exact, with the sagitta s, not paraxial. Values above π mean the mirror shows behind the
 * viewer's plane (domes).
 */
export function fieldOfView(input: { mirror: Mirror; eyeDistanceM: number }): { horizontalRad: number; verticalRad: number } {
  const mirror = checkMirror(input.mirror);
  const D = requirePositive('eyeDistanceM', input.eyeDistanceM, 'eye-to-mirror distance');
  const R = sphereRadiusM(mirror);
  const r = sectionRimAngles(mirror);
  return {
    horizontalRad: reflectedRimAngle(R, D, r.left) + reflectedRimAngle(R, D, r.right),
    verticalRad: reflectedRimAngle(R, D, r.up) + reflectedRimAngle(R, D, r.down),
  };
}

/**
 * How much the image is squeezed at the rim compared with the centre, for an eye on the axis D
 * from the vertex: the angular magnification dθ_eye/dθ_world in the meridional section (the
 * plane through the axis), at the rim divided by at the centre. With a the height of a mirror
 * point from the axis, θ_eye = atan(a/(D + s)), θ_world = 2·asin(a/R) + θ_eye, so
 * M(a) = θ_eye′/(2/√(R² − a²) + θ_eye′), θ_eye′ = ((D + s) − a·s′)/((D + s)² + a²),
 * s′ = a/√(R² − a²); M(0) = R/(R + 2D). Rim: the farthest point (a round panel's edge, a
 * rectangle's corner); for domes the rim is the silhouette, where the squeeze is total (0).
 * Result 1 = no extra squeeze, < 1 = objects near the rim look smaller than at the centre.
 */
export function rimSqueeze(input: { mirror: Mirror; eyeDistanceM: number }): number {
  const mirror = checkMirror(input.mirror);
  const D = requirePositive('eyeDistanceM', input.eyeDistanceM, 'eye-to-mirror distance');
  const R = sphereRadiusM(mirror);
  let a: number;
  if (mirror.shape === 'round') a = mirror.diameterM / 2;
  else if (mirror.shape === 'rect') a = Math.hypot(mirror.widthM, mirror.heightM) / 2;
  else a = R;
  // Beyond the silhouette the eye cannot see; the silhouette height is R·sin α_s.
  const aSil = R * Math.sqrt(1 - (R / (R + D)) ** 2);
  if (a >= aSil) return 0;
  const root = Math.sqrt((R - a) * (R + a));
  const s = (a * a) / (R + root);
  const sp = a / root;
  const te = (D + s - a * sp) / ((D + s) ** 2 + a * a);
  const M = te / (2 / root + te);
  const M0 = R / (R + 2 * D);
  const out = M / M0;
  if (!Number.isFinite(out)) throw new OpticsInputError('mirror', 'The rim squeeze could not be computed for this mirror.');
  return out;
}
