/** Axis-aligned bounds of plane points, in whatever units the points are in (metres, pixels, points). */
export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** The smallest axis-aligned box holding every point, or null when there are none. */
export function boundsOfPoints(points: Iterable<readonly [number, number] | readonly number[]>): Bounds | null {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const p of points) {
    if (p[0] < minX) minX = p[0];
    if (p[1] < minY) minY = p[1];
    if (p[0] > maxX) maxX = p[0];
    if (p[1] > maxY) maxY = p[1];
  }
  return minX <= maxX ? { minX, minY, maxX, maxY } : null;
}

/** The plan (x, y) of `count` points packed `stride` numbers apart in a flat array (x and y first). */
export function* packedPoints(coords: ArrayLike<number>, count: number, stride: number): Generator<[number, number]> {
  for (let j = 0; j < count; j++) yield [coords[stride * j], coords[stride * j + 1]];
}

/** The bounds of segment ab. */
export function segmentBounds(a: readonly number[], b: readonly number[]): Bounds {
  return { minX: Math.min(a[0], b[0]), minY: Math.min(a[1], b[1]), maxX: Math.max(a[0], b[0]), maxY: Math.max(a[1], b[1]) };
}

/** True when two closed boxes share at least a point (touching counts). */
export function boxesMeet(a: Bounds, b: Bounds): boolean {
  return a.maxX >= b.minX && a.minX <= b.maxX && a.maxY >= b.minY && a.minY <= b.maxY;
}
