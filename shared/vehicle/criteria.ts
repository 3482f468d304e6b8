/**
 * Detect / recognise criteria over a ground field: where in the field a person (an upright
 * target of a given height) standing on the ground would be seen in some chosen mirror at an
 * image height of at least the detect angle, and at least the recognise angle. The angles come
 * in as plain parameters (radians): the project's criteria decide them.
 *
 * Estimated, not traced: the field is sampled on a regular grid (about `samples` points inside
 * it) and each point is judged exactly through the engine — the foot must be seen past the body
 * (visibleInMirror) and the image's height is the exact angle (apparentAngle) in the mirror and
 * from the eye point that show it largest. The shares are fractions of the grid points, so they
 * carry a sampling error of about one grid cell's share along the field's edges.
 */
import type { Pair } from '../geometry/polygon';
import { bbox, pointInPolygon, polygonArea } from '../geometry/polygon';
import type { Vec3 } from '../geometry/vec3';
import { apparentAngle, OpticsInputError, visibleInMirror, type Mirror, type Pose, type Wall } from '../optics';
import type { VehicleField } from './fields';

export type FieldCriteria = {
  /** Grid points that fell inside the field. */
  sampled: number;
  /** Share of them whose foot is seen in some chosen mirror. */
  seenShare: number;
  detectShare: number;
  recogniseShare: number;
};

/** Regular grid points inside the field, spaced so that about `samples` land inside it. */
export function fieldGrid(field: VehicleField, samples: number): Pair[] {
  const [x0, y0, x1, y1] = bbox([field.polygonM]);
  const step = Math.sqrt(polygonArea(field.polygonM) / samples);
  const pts: Pair[] = [];
  for (let x = x0 + step / 2; x < x1; x += step) {
    for (let y = y0 + step / 2; y < y1; y += step) if (pointInPolygon(field.polygonM, [x, y])) pts.push([x, y]);
  }
  return pts;
}

export function fieldCriteria(args: {
  field: VehicleField;
  mirrors: readonly { mirror: Mirror; pose: Pose }[];
  eyes: readonly Vec3[];
  walls: readonly Wall[];
  targetHeightM: number;
  detectAngleRad: number;
  recogniseAngleRad: number;
  samples?: number;
}): FieldCriteria {
  if (!(args.detectAngleRad >= 0) || !(args.recogniseAngleRad >= 0)) {
    throw new OpticsInputError('criteria', 'The detect and recognise angles must be zero or more.');
  }
  const pts = fieldGrid(args.field, args.samples ?? 100);
  let seen = 0;
  let detected = 0;
  let recognised = 0;
  for (const [x, y] of pts) {
    const foot: Vec3 = [x, y, 0];
    let best = -1;
    for (const m of args.mirrors) {
      for (const e of args.eyes) {
        let visible = false;
        try {
          visible = visibleInMirror({ mirror: m.mirror, pose: m.pose, eyeM: e, pointM: foot, walls: [...args.walls] }).visible;
        } catch (err) {
          if (!(err instanceof OpticsInputError && err.field === 'eyeM')) throw err;
        }
        if (!visible) continue;
        const a = apparentAngle({ mirror: m.mirror, pose: m.pose, eyeM: e, pointM: foot, targetSizeM: args.targetHeightM });
        best = Math.max(best, a ?? 0);
      }
    }
    if (best >= 0) seen++;
    if (best >= args.detectAngleRad) detected++;
    if (best >= args.recogniseAngleRad) recognised++;
  }
  const n = pts.length;
  return { sampled: n, seenShare: n ? seen / n : 0, detectShare: n ? detected / n : 0, recogniseShare: n ? recognised / n : 0 };
}
