/**
 * Three-component vectors in metres (positions) or unitless (directions).
 * The world frame is right-handed with z up; the floor is z = 0.
 */
export type Vec3 = [number, number, number];

/** a + b */
export function add(a: Vec3, b: Vec3): Vec3 {
  return [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
}

/** a − b */
export function sub(a: Vec3, b: Vec3): Vec3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}

/** k·a */
export function scale(a: Vec3, k: number): Vec3 {
  return [a[0] * k, a[1] * k, a[2] * k];
}

/** Dot product a·b. */
export function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

/** Cross product a × b. */
export function cross(a: Vec3, b: Vec3): Vec3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

/** Euclidean length |a|. */
export function norm(a: Vec3): number {
  return Math.hypot(a[0], a[1], a[2]);
}

/** Distance |a − b|. */
export function distance(a: Vec3, b: Vec3): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

/** a / |a|; the zero vector is returned unchanged (callers check lengths first). */
export function normalize(a: Vec3): Vec3 {
  const n = norm(a);
  return n > 0 ? [a[0] / n, a[1] / n, a[2] / n] : [0, 0, 0];
}

/**
 * Law of reflection for a direction i at a surface of unit normal n: r = i − 2(i·n)n.
 * Source: the vector form of the law of reflection (angle of incidence equals angle of
 * reflection, incident ray, normal and reflected ray coplanar). n must be a unit vector.
 */
export function reflect(i: Vec3, n: Vec3): Vec3 {
  const k = 2 * dot(i, n);
  return [i[0] - k * n[0], i[1] - k * n[1], i[2] - k * n[2]];
}

/** Angle between two non-zero vectors in radians, accurate also for nearly parallel vectors. */
export function angleBetween(a: Vec3, b: Vec3): number {
  return Math.atan2(norm(cross(a, b)), dot(a, b));
}
