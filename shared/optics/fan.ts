import type { Vec3 } from '../geometry/vec3';
import { prepareCoverage } from './coverage';
import type { Mirror } from './mirror';
import type { Pose } from './pose';

export type FanRay = {
  /** Reflection point on the mirror, metres. */
  fromM: Vec3;
  /** Unit reflected direction. */
  directionM: Vec3;
  /** Where the ray meets the plane, or where it is `maxRangeM` away horizontally if it does not meet it sooner. */
  toM: Vec3;
  meetsPlane: boolean;
};

/**
 * The traced outline rays of the fan for drawing (plan or elevation): `samples` rays around the
 * visible outline of the mirror, exactly as used by `coverage`.
 */
export function fanRays(input: {
  mirror: Mirror;
  pose: Pose;
  eyeM: Vec3;
  planeHeightM?: number;
  maxRangeM: number;
  samples?: number;
}): FanRay[] {
  const p = prepareCoverage({ ...input, rimSamples: input.samples ?? 32 });
  const f = p.fan;
  const out: FanRay[] = [];
  for (let j = 0; j < f.count; j++) {
    const from: Vec3 = [f.point[3 * j], f.point[3 * j + 1], f.point[3 * j + 2]];
    const dir: Vec3 = [f.dir[3 * j], f.dir[3 * j + 1], f.dir[3 * j + 2]];
    const hRun = Math.hypot(dir[0], dir[1]);
    const tPlane = dir[2] < 0 ? (p.h0 - from[2]) / dir[2] : Infinity;
    const tRange = hRun > 0 ? p.maxRangeM / hRun : Infinity;
    const meets = tPlane <= tRange && Number.isFinite(tPlane);
    let t = Math.min(tPlane, tRange);
    if (!Number.isFinite(t)) t = p.maxRangeM;
    out.push({
      fromM: from,
      directionM: dir,
      toM: [from[0] + t * dir[0], from[1] + t * dir[1], from[2] + t * dir[2]],
      meetsPlane: meets,
    });
  }
  return out;
}
