import { coverage, domeMountTiltRad, poseFromAim, visibleInMirror, type Mirror, type Pose, type Vec3 } from '../../../shared/optics';
import { regionAgreement } from './region-agreement';

/**
 * Placements where part of the mirror reflects the eye's sightlines upward, through the
 * vertical or past the horizon. The exact point test (`visibleInMirror`, Alhazen's problem) is
 * the reference; the region must agree with it away from its edge.
 */
type Case = { mirror: Mirror; pose: Pose; eyeM: Vec3; maxRangeM: number };

const cases: [string, Case][] = [
  [
    'a 600 mm round mirror (R 1.2 m) mounted level at 3 m, eye at 1.7 m and 0.5 m in front (every ray goes up)',
    {
      mirror: { shape: 'round', diameterM: 0.6, radiusM: 1.2 },
      pose: poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0 }),
      eyeM: [0.5, 0, 1.7],
      maxRangeM: 10,
    },
  ],
  [
    'a full dome turned to face sideways (tilt 0) at 3 m',
    {
      mirror: { shape: 'dome', portion: 'full', diameterM: 0.8 },
      pose: poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0.4, tiltDownRad: 0 }),
      eyeM: [4, 2.5, 1.6],
      maxRangeM: 12,
    },
  ],
  [
    'a half dome mounted steeper than its mount tilt',
    {
      mirror: { shape: 'dome', portion: 'half', diameterM: 1 },
      pose: poseFromAim({ vertexM: [0, 0, 3.5], azimuthRad: -1, tiltDownRad: 1.2 }),
      eyeM: [2.5, -3, 1.7],
      maxRangeM: 12,
    },
  ],
  [
    'a half dome tilted up',
    {
      mirror: { shape: 'dome', portion: 'half', diameterM: 0.9 },
      pose: poseFromAim({ vertexM: [0, 0, 2.5], azimuthRad: 0, tiltDownRad: -0.3 }),
      eyeM: [3, 0.5, 1.6],
      maxRangeM: 10,
    },
  ],
  [
    'a round panel aimed 30° upward',
    {
      mirror: { shape: 'round', diameterM: 0.8, radiusM: 1 },
      pose: poseFromAim({ vertexM: [0, 0, 2.2], azimuthRad: 2, tiltDownRad: -Math.PI / 6 }),
      eyeM: [-2, 3.5, 1.7],
      maxRangeM: 10,
    },
  ],
  [
    'a deep cap (diameter 98 % of 2R) aimed level',
    {
      mirror: { shape: 'round', diameterM: 0.98, radiusM: 0.5 },
      pose: poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0.1 }),
      eyeM: [3, 1, 1.6],
      maxRangeM: 12,
    },
  ],
  [
    'a rectangular panel seen from far off its axis',
    {
      mirror: { shape: 'rect', widthM: 0.8, heightM: 0.6, radiusM: 0.6 },
      pose: poseFromAim({ vertexM: [0, 0, 2.8], azimuthRad: 0, tiltDownRad: 0.2 }),
      eyeM: [0.4, 5, 1.7],
      maxRangeM: 12,
    },
  ],
  [
    'a full dome facing up like a ball on a post, eye above its centre (outline rays go down, the middle goes up)',
    {
      mirror: { shape: 'dome', portion: 'full', diameterM: 1 },
      pose: poseFromAim({ vertexM: [0, 0, 1.5], azimuthRad: 0, tiltDownRad: -Math.PI / 2 }),
      eyeM: [1.5, 0.3, 1.7],
      maxRangeM: 8,
    },
  ],
  [
    'a quarter dome at a level tilt',
    {
      mirror: { shape: 'dome', portion: 'quarter', diameterM: 0.8 },
      pose: poseFromAim({ vertexM: [0, 0, 3], azimuthRad: Math.PI / 4, tiltDownRad: 0 }),
      eyeM: [3, 2.5, 1.6],
      maxRangeM: 12,
    },
  ],
];

describe('coverage region where sightlines reflect past straight up', () => {
  it('is empty for the level 600 mm mirror whose every reflected ray rises, as the point test says', () => {
    const c = cases[0][1];
    const { region, areaM2 } = coverage(c);
    // Sanity of the example itself: the point straight below and one 3 m out are not seen.
    expect(visibleInMirror({ ...c, pointM: [0, 0, 0] }).visible).toBe(false);
    expect(visibleInMirror({ ...c, pointM: [3, 0, 0] }).visible).toBe(false);
    expect(areaM2).toBe(0);
    expect(region).toEqual([]);
  });

  it.each(cases)('agrees with the exact point test for %s', (_label, c) => {
    const { region } = coverage(c);
    const a = regionAgreement({ region, ...c, n: 2500, marginM: 0.02, seed: 17 });
    expect(a.checked).toBeGreaterThan(2000);
    expect(a.disagreements).toEqual([]);
  });

  it.each([
    ['part of it', 2.4],
    ['all of it, including the part that reflects upward', 3.395],
  ])('removes the floor a wall between the eye and a half dome hides when it hides %s', (_label, heightM) => {
    // The wall stands 0.9–1.9 m in front of the dome, between it and the eye; the dome's upper
    // part reflects the eye's sightlines upward.
    const c: Case = {
      mirror: { shape: 'dome', portion: 'half', diameterM: 1.24 },
      pose: { vertexM: [0, 0, 3.785], axis: [0.9631, 0, -0.2691] },
      eyeM: [3.146, -1.111, 1.03],
      maxRangeM: 12,
    };
    const walls = [{ aM: [1.775, -0.872] as [number, number], bM: [0.929, -0.083] as [number, number], heightM }];
    expect(coverage(c).areaM2).toBeGreaterThan(100);
    const { region } = coverage({ ...c, walls });
    const a = regionAgreement({ region, ...c, walls, n: 2500, marginM: 0.02, seed: 1 });
    expect(a.disagreements).toEqual([]);
  });

  it('keeps the floor around a ball-shaped dome whose middle reflects upward', () => {
    const c = cases[7][1];
    const { areaM2 } = coverage(c);
    // Most of the 8 m disc is seen (the outline's image is a small hole around the post).
    expect(areaM2).toBeGreaterThan(0.5 * Math.PI * 64);
    expect(areaM2).toBeLessThan(Math.PI * 64);
  });

  it('throws a sentence when the middle of a dome reaches below the measured plane', () => {
    const mirror: Mirror = { shape: 'dome', portion: 'full', diameterM: 1 };
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: domeMountTiltRad('full') });
    // The dome's pole hangs at 3 m and its rim is at 3.5 m, so a plane at 3.2 m cuts through it.
    // Seen from nearly below, the visible outline is the sphere's silhouette for this eye, 75°
    // from the pole, about 3.37 m high: only the middle of the dome is below the plane.
    expect(() => coverage({ mirror, pose, eyeM: [0.2, 0, 1.6], maxRangeM: 8, planeHeightM: 3.2 })).toThrow(/reaches down to the plane/);
  });
});
