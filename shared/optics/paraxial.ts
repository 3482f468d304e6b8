import { requirePositive, OpticsInputError } from './errors';

/**
 * Closed forms of the paraxial (small-angle) theory of a convex spherical mirror. Sign
 * convention: real side positive, so a convex mirror has a negative focal length and forms a
 * virtual image (negative image distance). Source: the mirror equation and magnification as
 * given in OpenStax University Physics Vol. 3 §2.2 and OpenStax College Physics §25.7.
 */

/** Focal length of a convex mirror of radius of curvature R (m): f = −R/2 (metres, < 0). */
export function focalLength(radiusM: number): number {
  const R = requirePositive('radiusM', radiusM, 'radius of curvature');
  return -R / 2;
}

/**
 * Sagitta of a spherical cap: the depth of a rim of half-width a (m) below the vertex plane on
 * a sphere of radius R (m): s = R − √(R² − a²), computed as a²/(R + √(R² − a²)) to keep
 * accuracy when a ≪ R. Requires a ≤ R.
 */
export function sagitta(radiusM: number, halfWidthM: number): number {
  const R = requirePositive('radiusM', radiusM, 'radius of curvature');
  if (typeof halfWidthM !== 'number' || !Number.isFinite(halfWidthM) || halfWidthM < 0) {
    throw new OpticsInputError('halfWidthM', 'The half-width must be a number at least zero.');
  }
  if (halfWidthM > R) {
    throw new OpticsInputError('halfWidthM', 'The half-width cannot exceed the radius of curvature.');
  }
  return (halfWidthM * halfWidthM) / (R + Math.sqrt((R - halfWidthM) * (R + halfWidthM)));
}

export type ConvexImage = {
  /** f = −R/2, metres (negative). */
  focalLengthM: number;
  /** dᵢ = f·dₒ/(dₒ − f), metres; negative: a virtual image behind the mirror. */
  imageDistanceM: number;
  /** m = −dᵢ/dₒ = |f|/(dₒ + |f|), between 0 and 1: the image is upright and smaller. */
  magnification: number;
  /** hᵢ = m·hₒ, metres, when an object height was given. */
  imageHeightM?: number;
};

/**
 * Image formed by a convex mirror. Mirror equation 1/dₒ + 1/dᵢ = 1/f with f = −R/2, so
 * dᵢ = f·dₒ/(dₒ − f) and m = −dᵢ/dₒ (OpenStax University Physics Vol. 3 §2.2).
 * Inputs in metres: radius of curvature R > 0, object distance dₒ > 0, optional object height.
 */
export function convexImage(input: { radiusM: number; objectDistanceM: number; objectHeightM?: number }): ConvexImage {
  const R = requirePositive('radiusM', input.radiusM, 'radius of curvature');
  const d = requirePositive('objectDistanceM', input.objectDistanceM, 'object distance');
  const F = R / 2;
  // dᵢ = f·dₒ/(dₒ − f) with f = −F; written without cancellation.
  const imageDistanceM = -(F * d) / (d + F);
  const magnification = F / (d + F);
  const out: ConvexImage = { focalLengthM: -F, imageDistanceM, magnification };
  if (input.objectHeightM !== undefined) {
    const h = requirePositive('objectHeightM', input.objectHeightM, 'object height');
    out.imageHeightM = magnification * h;
  }
  return out;
}

export type PerceivedDistance = {
  /** True path length eye → mirror → object, D + dₒ, metres. */
  trueDistanceM: number;
  /** Distance from the eye to the virtual image, D + |dᵢ|, metres. */
  imageFromEyeM: number;
  /** Distance at which the object, seen directly, would look as big: (D + |dᵢ|)/m, metres. */
  sizeCueDistanceM: number;
  /** sizeCue / true: how many times farther away the object looks than it is (≥ 1). */
  ratio: number;
};

/**
 * How far away an object looks in a convex mirror, judged by its size. The image is m times
 * the object's size at D + |dᵢ| from the eye, so it subtends the same angle as the object
 * itself at (D + |dᵢ|)/m. Derivation from the mirror equation (docs/sources.md, "Perceived distance and the angle through the mirror"); a
 * pure minification model: drivers judge less far than this (UMTRI-97-32).
 */
export function perceivedDistance(input: { radiusM: number; eyeDistanceM: number; objectDistanceM: number }): PerceivedDistance {
  const D = requirePositive('eyeDistanceM', input.eyeDistanceM, 'eye-to-mirror distance');
  const img = convexImage({ radiusM: input.radiusM, objectDistanceM: input.objectDistanceM });
  const d = input.objectDistanceM;
  const trueDistanceM = D + d;
  const imageFromEyeM = D + Math.abs(img.imageDistanceM);
  const sizeCueDistanceM = imageFromEyeM / img.magnification;
  return { trueDistanceM, imageFromEyeM, sizeCueDistanceM, ratio: sizeCueDistanceM / trueDistanceM };
}

/**
 * Angle (rad) an object of height h subtends at the eye through the mirror, paraxially:
 * θ = h·|f| / (dₒ(D + |f|) + D·|f|). Derivation: hᵢ = h·|f|/(dₒ + |f|) seen at D + |dᵢ|,
 * |dᵢ| = |f|·dₒ/(dₒ + |f|), small-angle θ ≈ hᵢ/(D + |dᵢ|) (docs/sources.md, "Perceived distance and the angle through the mirror").
 */
export function paraxialAngle(input: { radiusM: number; eyeDistanceM: number; objectDistanceM: number; targetSizeM: number }): number {
  const F = requirePositive('radiusM', input.radiusM, 'radius of curvature') / 2;
  const D = requirePositive('eyeDistanceM', input.eyeDistanceM, 'eye-to-mirror distance');
  const d = requirePositive('objectDistanceM', input.objectDistanceM, 'object distance');
  const h = requirePositive('targetSizeM', input.targetSizeM, 'target size');
  return (h * F) / (d * (D + F) + D * F);
}

/**
 * Farthest object distance (m, mirror to object) at which a target of size h still subtends
 * `minAngleRad` at the eye through the mirror, paraxially: the detect or the recognise range,
 * depending on which criterion's angle is passed (docs/sources.md, "Detect and recognise").
 * Solving θ = h·F/(dₒ(D + F) + D·F) (F = |f| = R/2) for dₒ gives dₒ = (h·F/θ − D·F)/(D + F).
 * When even an object at the mirror is too small (h·F/θ ≤ D·F) the range is 0.
 */
export function recognisableRange(input: { radiusM: number; eyeDistanceM: number; targetSizeM: number; minAngleRad: number }): {
  rangeM: number;
} {
  const F = requirePositive('radiusM', input.radiusM, 'radius of curvature') / 2;
  const D = requirePositive('eyeDistanceM', input.eyeDistanceM, 'eye-to-mirror distance');
  const h = requirePositive('targetSizeM', input.targetSizeM, 'target size');
  const theta = requirePositive('minAngleRad', input.minAngleRad, 'smallest angle the target must subtend');
  if (theta >= Math.PI) {
    throw new OpticsInputError('minAngleRad', 'The smallest angle the target must subtend must be less than 180°.');
  }
  const rangeM = ((h * F) / theta - D * F) / (D + F);
  return { rangeM: Math.max(0, rangeM) };
}

/** One minute of arc in radians (π/10 800). */
export const ARCMIN_RAD = Math.PI / 10800;
