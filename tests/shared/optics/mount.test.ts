import * as fc from 'fast-check';
import { poseFromAim, type Mirror, type Vec3, type Wall } from '../../../shared/optics';
import { maxLinearOverBody, moveOutOfWalls, wallsThroughMirror, MOUNT_TOLERANCE_M } from '../../../shared/optics/mount';
import { rng } from './helpers';

const deg = Math.PI / 180;
const halfDome: Mirror = { shape: 'dome', portion: 'half', diameterM: 0.61 };
const fullDome: Mirror = { shape: 'dome', portion: 'full', diameterM: 0.6 };
const round600: Mirror = { shape: 'round', diameterM: 0.6, radiusM: 1.2 };
// A wall along the x axis, 6 m high; its plane is y = 0.
const wallAlongX: Wall = { aM: [-5, 0], bM: [5, 0], heightM: 6 };

describe('walls through a mirror body', () => {
  it('measures how deep a wall cuts a full dome whose centre is 0.1 m behind its plane (R − 0.1 m, by hand)', () => {
    // Full dome, axis straight down: its body is the lower half ball of radius 0.3 m about the
    // centre. The plane y = 0 cuts it 0.1 m from the centre: 0.4 m of it on one side, 0.2 m on the other.
    const pose = poseFromAim({ vertexM: [0, -0.1, 2.7], azimuthRad: 0, tiltDownRad: 90 * deg });
    const hits = wallsThroughMirror({ mirror: fullDome, pose, walls: [wallAlongX] });
    expect(hits).toHaveLength(1);
    expect(hits[0].depthM).toBeCloseTo(0.2, 9);
    expect(hits[0].movesM[0][1]).toBeCloseTo(-0.2, 9); // the nearer way out: back 0.2 m toward −y
    expect(hits[0].movesM[1][1]).toBeCloseTo(0.4, 9);
  });

  it('accepts a half dome whose flat back lies on the wall (sphere centre on the face)', () => {
    // Mounted at 45°, the centre is R·sin 45° behind the vertex; R = 0.305 m.
    const pose = poseFromAim({ vertexM: [0, 0.305 * Math.SQRT1_2, 2.9], azimuthRad: 90 * deg, tiltDownRad: 45 * deg });
    expect(wallsThroughMirror({ mirror: halfDome, pose, walls: [wallAlongX] })).toEqual([]);
  });

  it('refuses a half dome whose sphere centre is 0.17 m inside a column (the demo’s first junction dome)', () => {
    const column: Wall[] = [
      { aM: [19.2, 9.5], bM: [20.3, 9.5], heightM: 8 },
      { aM: [20.3, 9.5], bM: [20.3, 10], heightM: 8 },
      { aM: [20.3, 10], bM: [19.2, 10], heightM: 8 },
      { aM: [19.2, 10], bM: [19.2, 9.5], heightM: 8 },
    ];
    const pose = poseFromAim({ vertexM: [19.75, 10.05, 2.9], azimuthRad: 90 * deg, tiltDownRad: 45 * deg });
    const hits = wallsThroughMirror({ mirror: halfDome, pose, walls: column });
    expect(hits.map((h) => h.wallIndex)).toEqual([2]);
    // Out toward the viewer in the aisle to the north: the centre must come up to y = 10.
    const move = moveOutOfWalls({ mirror: halfDome, pose, walls: column, eyeM: [19.75, 17, 2.1] }) as [number, number];
    expect(move[0]).toBeCloseTo(0, 9);
    expect(move[1]).toBeCloseTo(10 - (10.05 - 0.305 * Math.SQRT1_2), 5);
  });

  it('refuses a round mirror with part of its face inside a rack corner and moves it onto the end face', () => {
    // The demo's first dock mirror: aimed 25° south of east at the rack's north-east corner (16, 10).
    const rack: Wall[] = [
      { aM: [16, 3], bM: [16, 10], heightM: 6 },
      { aM: [16, 10], bM: [4, 10], heightM: 6 },
    ];
    const pose = poseFromAim({ vertexM: [16.05, 10.05, 3], azimuthRad: -25 * deg, tiltDownRad: 25 * deg });
    expect(
      wallsThroughMirror({ mirror: round600, pose, walls: rack })
        .map((h) => h.wallIndex)
        .sort(),
    ).toEqual([0, 1]);
    const move = moveOutOfWalls({ mirror: round600, pose, walls: rack, eyeM: [26, 6.5, 2.1] }) as [number, number];
    expect(move[0]).toBeGreaterThan(0.1);
    expect(move[1]).toBeCloseTo(0, 9);
    const moved = poseFromAim({ vertexM: [16.05 + move[0], 10.05 + move[1], 3], azimuthRad: -25 * deg, tiltDownRad: 25 * deg });
    expect(wallsThroughMirror({ mirror: round600, pose: moved, walls: rack })).toEqual([]);
  });

  // Aimed along +y and level, the 600 mm / R 1.2 m body spans the sagitta 1.2 − √(1.2² − 0.3²) ≈ 0.038 m
  // behind its vertex (by hand). At y = 0.02 it would straddle the face y = 0 by about 2 cm each way.
  it.each([
    ['whose rim lies on the wall face', [0, 1.2 - Math.sqrt(1.2 * 1.2 - 0.3 * 0.3), 3] as Vec3, wallAlongX],
    ['that straddles the wall’s line beyond its end', [5.4, 0.02, 3] as Vec3, wallAlongX],
    ['that straddles the wall’s line above its top', [0, 0.02, 3] as Vec3, { aM: [-5, 0], bM: [5, 0], heightM: 2.5 }],
  ] as [string, Vec3, Wall][])('accepts a round mirror %s', (_what, vertexM, wall) => {
    const pose = poseFromAim({ vertexM, azimuthRad: 90 * deg, tiltDownRad: 0 });
    expect(wallsThroughMirror({ mirror: round600, pose, walls: [wall] })).toEqual([]);
  });

  it('refuses the same mirror straddling the wall’s face within its length', () => {
    const pose = poseFromAim({ vertexM: [0, 0.02, 3], azimuthRad: 90 * deg, tiltDownRad: 0 });
    expect(wallsThroughMirror({ mirror: round600, pose, walls: [wallAlongX] })).toHaveLength(1);
  });

  it('allows a body to reach the stated mounting tolerance past a face, and no more', () => {
    // Full dome, axis down, its ball reaching d past the plane y = 0 on the far side.
    const at = (d: number) => poseFromAim({ vertexM: [0, 0.3 - d, 2.7], azimuthRad: 0, tiltDownRad: 90 * deg });
    expect(wallsThroughMirror({ mirror: fullDome, pose: at(MOUNT_TOLERANCE_M * 0.9), walls: [wallAlongX] })).toEqual([]);
    expect(wallsThroughMirror({ mirror: fullDome, pose: at(MOUNT_TOLERANCE_M * 1.1), walls: [wallAlongX] })).toHaveLength(1);
  });
});

describe('largest linear value over a ball cut by planes', () => {
  it('is reached at a point of the body and is never below the best of 20,000 random points of it', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), (seed) => {
        const r = rng(seed);
        const C: Vec3 = [r() * 4 - 2, r() * 4 - 2, r() * 4];
        const R = 0.1 + r() * 2;
        const planes = Array.from({ length: Math.floor(r() * 5) }, () => {
          const k: Vec3 = [r() * 2 - 1, r() * 2 - 1, r() * 2 - 1];
          const l = Math.hypot(k[0], k[1], k[2]) || 1;
          const ku: Vec3 = [k[0] / l, k[1] / l, k[2] / l];
          return { k: ku, d: ku[0] * C[0] + ku[1] * C[1] + ku[2] * C[2] + (r() * 1.6 - 0.8) * R };
        });
        const g: Vec3 = [r() * 2 - 1, r() * 2 - 1, r() * 2 - 1];
        const exact = maxLinearOverBody(C, R, planes, g);
        let sampled = -Infinity;
        for (let i = 0; i < 20000; i++) {
          // Uniform in the ball by rejection.
          const x: Vec3 = [r() * 2 - 1, r() * 2 - 1, r() * 2 - 1];
          if (x[0] * x[0] + x[1] * x[1] + x[2] * x[2] > 1) continue;
          const p: Vec3 = [C[0] + R * x[0], C[1] + R * x[1], C[2] + R * x[2]];
          if (planes.every((q) => q.k[0] * p[0] + q.k[1] * p[1] + q.k[2] * p[2] >= q.d))
            sampled = Math.max(sampled, g[0] * p[0] + g[1] * p[1] + g[2] * p[2]);
        }
        if (exact) {
          const p = exact.pointM;
          expect(Math.hypot(p[0] - C[0], p[1] - C[1], p[2] - C[2])).toBeLessThanOrEqual(R * (1 + 1e-8));
          for (const q of planes) expect(q.k[0] * p[0] + q.k[1] * p[1] + q.k[2] * p[2]).toBeGreaterThanOrEqual(q.d - 1e-8);
          expect(exact.value).toBeCloseTo(g[0] * p[0] + g[1] * p[1] + g[2] * p[2], 12);
        }
        if (sampled === -Infinity) return; // empty or too thin to sample
        expect(exact).not.toBeNull();
        expect((exact as { value: number }).value).toBeGreaterThanOrEqual(sampled - 1e-9);
      }),
      { numRuns: 60 },
    );
  });
});
