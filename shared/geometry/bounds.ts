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
