import polygonClipping from 'polygon-clipping';
import { pointInPolygon, type Pair, type Polygon } from '../../../shared/geometry/polygon';
import type { Vec3 } from '../../../shared/geometry/vec3';
import { OpticsInputError, visibleInMirror, type Wall } from '../../../shared/optics';
import type { VehicleMirror } from '../../../shared/vehicle';

export { rng } from '../optics/helpers';

/** Uniform random points inside a polygon (rejection from its box), deterministic per seed. */
export function pointsIn(polygon: Polygon, n: number, r: () => number): Pair[] {
  const xs = polygon[0].map((p) => p[0]);
  const ys = polygon[0].map((p) => p[1]);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const out: Pair[] = [];
  while (out.length < n) {
    const p: Pair = [x0 + (x1 - x0) * r(), y0 + (y1 - y0) * r()];
    if (pointInPolygon(polygon, p)) out.push(p);
  }
  return out;
}

/** The exact point test: is ground point p seen in any of the mirrors from any of the eyes, past the walls? */
export function seenExactly(p: Pair, mirrors: readonly VehicleMirror[], eyes: readonly Vec3[], walls: readonly Wall[]): boolean {
  return mirrors.some((m) =>
    eyes.some((e) => {
      try {
        return visibleInMirror({ mirror: m.mirror, pose: m.pose, eyeM: e, pointM: [p[0], p[1], 0], walls: [...walls] }).visible;
      } catch (err) {
        if (err instanceof OpticsInputError && err.field === 'eyeM') return false;
        throw err;
      }
    }),
  );
}

/** Area of a polygon set by polygon-clipping's own boolean output and the shoelace formula (independent of the engine's helpers). */
export function shoelaceArea(mp: polygonClipping.MultiPolygon): number {
  let a = 0;
  for (const poly of mp) {
    poly.forEach((ring, i) => {
      let s = 0;
      // Every edge including the closing one (a repeated first point adds nothing).
      for (let k = 0; k < ring.length; k++) {
        const q = ring[(k + 1) % ring.length];
        s += ring[k][0] * q[1] - q[0] * ring[k][1];
      }
      a += (i === 0 ? 1 : -1) * Math.abs(s / 2);
    });
  }
  return a;
}
