import { poseFromAim, sphereReflectionPoint, type Mirror, type Vec3, type Wall } from '../../../shared/optics';
import { placeMirror } from '../../../shared/optics/mirror';
import { wallBlocks, wallShadowRing } from '../../../shared/optics/walls';
import { pointSegmentDistance, type Pair } from '../../../shared/geometry/polygon';

const round: Mirror = { shape: 'round', diameterM: 0.8, radiusM: 1.6 };
const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0.3, tiltDownRad: 0.35 });
const eyeM: Vec3 = [5, 3, 1.6];
const pm = placeMirror(round, pose);

/** Exact floor point behind top-edge point T: the reflected ray through T continued to z = 0. */
function exactBehind(T: Vec3): Pair {
  const m = sphereReflectionPoint(pm.C, pm.R, eyeM, T) as Vec3;
  const P = [pm.C[0] + pm.R * m[0], pm.C[1] + pm.R * m[1], pm.C[2] + pm.R * m[2]];
  const dl = Math.hypot(T[0] - P[0], T[1] - P[1]);
  const run = (dl * T[2]) / (P[2] - T[2]);
  return [T[0] + ((T[0] - P[0]) / dl) * run, T[1] + ((T[1] - P[1]) / dl) * run];
}

describe('wall shadows on the mirror → floor leg', () => {
  it.each([
    ['a low rack', { aM: [4, -3], bM: [6, -4], heightM: 2.0 }],
    ['a wall nearly as high as the mirror (long, curved shadow edge)', { aM: [5, -9], bM: [12, -3], heightM: 2.6 }],
    ['a wall close under the mirror', { aM: [1, -3], bM: [3, -3], heightM: 2.5 }],
  ] as [string, Wall][])('follow the exact image of the top edge within 5 mm for %s', (_label, wall) => {
    const ring = wallShadowRing(pm, eyeM, wall, 0, 200, 0.005) as Pair[];
    const edge = ring.slice(2, ring.length - 1);
    for (let k = 0; k <= 100; k++) {
      const f = k / 100;
      const Q = exactBehind([wall.aM[0] + f * (wall.bM[0] - wall.aM[0]), wall.aM[1] + f * (wall.bM[1] - wall.aM[1]), wall.heightM]);
      let d = Infinity;
      for (let j = 0; j + 1 < edge.length; j++) d = Math.min(d, pointSegmentDistance(Q, edge[j], edge[j + 1]));
      expect(d).toBeLessThan(0.005 * 1.5);
    }
  });

  it('blocks a sightline only below the wall’s top', () => {
    const wall: Wall = { aM: [0, -1], bM: [0, 1], heightM: 2 };
    expect(wallBlocks(wall, [-1, 0, 1], [1, 0, 1])).toBe(true);
    expect(wallBlocks(wall, [-1, 0, 3], [1, 0, 2.5])).toBe(false);
    expect(wallBlocks(wall, [-1, 0, 3], [1, 0, 0])).toBe(true); // crosses at 1.5 m
    expect(wallBlocks(wall, [-1, 2, 1], [1, 2, 1])).toBe(false); // passes beside its end
  });
});
