import * as fc from 'fast-check';
import { coverage, OpticsInputError, poseFromAim, sphereReflectionPoint, type Mirror, type Vec3, type Wall } from '../../../shared/optics';
import { wallsThroughMirror } from '../../../shared/optics/mount';
import { agreement, rng } from './helpers';
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

describe('coverage with many walls agrees with the exact point test', () => {
  // Random sites: a mirror 2.2–4.5 m up, aimed 10°–60° down, the eye in front of it, and 20–300
  // walls and racks 0.3–8 m high scattered within 25 m (none through the mirror body: such a
  // placement is refused). Floor points closer to the region's edge than the polygon tolerance
  // are not judged; any other disagreement fails.
  it('on random floor points, except within 5 cm of the region’s edge', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2 ** 31 - 1 }),
        fc.integer({ min: 20, max: 300 }),
        fc.constantFrom('round', 'rect', 'dome') as fc.Arbitrary<'round' | 'rect' | 'dome'>,
        (seed, nWalls, shape) => {
          const r = rng(seed);
          const mirror: Mirror =
            shape === 'round'
              ? { shape: 'round', diameterM: 0.3 + 0.7 * r(), radiusM: 1 + 2 * r() }
              : shape === 'rect'
                ? { shape: 'rect', widthM: 0.4 + 0.5 * r(), heightM: 0.3 + 0.3 * r(), radiusM: 1.2 + 2 * r() }
                : { shape: 'dome', portion: 'half', diameterM: 0.45 + 0.5 * r() };
          const az = 2 * Math.PI * r();
          const tilt = shape === 'dome' ? Math.PI / 4 : (10 + 50 * r()) * (Math.PI / 180);
          const pose = poseFromAim({ vertexM: [0, 0, 2.2 + 2.3 * r()], azimuthRad: az, tiltDownRad: tilt });
          const side = az + (r() - 0.5) * 1.4;
          const eyeDist = 3 + 12 * r();
          const eyeM: Vec3 = [eyeDist * Math.cos(side), eyeDist * Math.sin(side), 1.2 + 1.2 * r()];
          const candidates: Wall[] = [];
          for (let i = 0; i < nWalls; i++) {
            const x = -25 + 50 * r();
            const y = -25 + 50 * r();
            const a = Math.PI * r();
            const len = 0.5 + 4 * r();
            candidates.push({ aM: [x, y], bM: [x + len * Math.cos(a), y + len * Math.sin(a)], heightM: 0.3 + 7.7 * r() });
          }
          const through = new Set(wallsThroughMirror({ mirror, pose, walls: candidates }).map((h) => h.wallIndex));
          const walls = candidates.filter((_, i) => !through.has(i));
          const maxRangeM = 8 + 12 * r();
          let region;
          try {
            region = coverage({ mirror, pose, eyeM, maxRangeM, walls }).region;
          } catch (e) {
            if (e instanceof OpticsInputError) return; // eye behind the mirror: not an accepted input
            throw e;
          }
          const res = agreement({ region, mirror, pose, eyeM, maxRangeM, walls, halfBoxM: maxRangeM, n: 300, marginM: 0.05, seed });
          expect(res.disagree).toBe(0);
        },
      ),
      // Two cases found by random seeds: a wide dome beside a wall taller than the mirror, whose
      // shadow's side was drawn from the reflection point of the wall's top instead of the grazing one.
      {
        numRuns: 40,
        examples: [
          [4, 23, 'dome'],
          [260890945, 25, 'dome'],
        ],
      },
    );
  });
});
