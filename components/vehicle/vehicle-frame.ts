/**
 * The vehicle's top view on screen, pure. The vehicle's plan frame is x forward, y left; on screen
 * the vehicle points up (a phone is taller than wide, and so is a vehicle with its fields). The
 * drawing frame turns the plan a quarter turn counter-clockwise: display (dx, dy) = (−y, x), so
 * forward is up and the driver's left is the screen's left. The plan's viewport and gesture hooks
 * work in that display frame; positions and aims cross back with {@link fromDisplay}.
 */
import type { Polygon, Ring } from '@/shared/geometry/polygon';
import { boundsOfPoints, type Bounds } from '@/shared/geometry/bounds';
import type { PlacementDto } from '@/shared/schemas';
import type { VehicleField, VehicleGeometry } from '@/shared/vehicle';

export type Pair = [number, number];

export const toDisplay = (p: readonly [number, number]): Pair => [-p[1], p[0]];
export const fromDisplay = (d: readonly [number, number]): Pair => [d[1], -d[0]];
/** A plan azimuth (from +x toward +y) as seen in the display frame, and back. */
export const azimuthToDisplay = (a: number): number => a + Math.PI / 2;
export const azimuthFromDisplay = (a: number): number => normaliseAngle(a - Math.PI / 2);

/** An angle in (−π, π]. */
export function normaliseAngle(a: number): number {
  const t = a - 2 * Math.PI * Math.floor((a + Math.PI) / (2 * Math.PI));
  return t === -Math.PI ? Math.PI : t;
}

export const ringToDisplay = (r: Ring): Ring => r.map((p) => toDisplay(p));
export const polygonToDisplay = (p: Polygon): Polygon => p.map(ringToDisplay);

/** The placements as the gesture machine sees them: positions and aims in the display frame. */
export function displayPlacements<P extends Pick<PlacementDto, 'positionM' | 'azimuthRad'>>(placements: readonly P[]): P[] {
  return placements.map((p) => ({ ...p, positionM: toDisplay(p.positionM), azimuthRad: azimuthToDisplay(p.azimuthRad) }));
}

/**
 * What the view fits on opening, in the display frame: the vehicle, its mirrors and the fields
 * that end near it (mirrors hang on the body, so they are inside). Fields the rule runs to the horizon are drawn but left out of the fit, or a
 * 60 m strip would shrink the vehicle to a few pixels.
 */
export function fitBounds(
  g: VehicleGeometry,
  fields: readonly VehicleField[],
  targets: readonly { positionM: readonly [number, number]; diameterM: number }[] = [],
): Bounds | null {
  const pts: Pair[] = [];
  // Test cylinders with their size and a little ground around them, so one ahead of the bumper is not cut off.
  targets.forEach((t) => {
    const r = t.diameterM / 2 + 0.3;
    pts.push(toDisplay([t.positionM[0] + r, t.positionM[1] + r]), toDisplay([t.positionM[0] - r, t.positionM[1] - r]));
  });
  g.outline.forEach((p) => pts.push(toDisplay(p)));
  fields.filter((f) => f.scoredToNote === null).forEach((f) => f.polygonM[0].forEach((p) => pts.push(toDisplay(p))));
  return boundsOfPoints(pts);
}

/** The centre of a ring's area (shoelace), for a field's label. */
export function ringCentroid(r: Ring): Pair {
  let a = 0;
  let cx = 0;
  let cy = 0;
  for (let i = 0; i < r.length; i++) {
    const [x0, y0] = r[i];
    const [x1, y1] = r[(i + 1) % r.length];
    const k = x0 * y1 - x1 * y0;
    a += k;
    cx += (x0 + x1) * k;
    cy += (y0 + y1) * k;
  }
  if (Math.abs(a) < 1e-12) return r[0] ? [r[0][0], r[0][1]] : [0, 0];
  return [cx / (3 * a), cy / (3 * a)];
}
