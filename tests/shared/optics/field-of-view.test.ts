import { fanRays, fieldOfView, poseFromAim, reflectedRimAngle, rimSqueeze, sagitta, type Mirror, type Vec3 } from '../../../shared/optics';

const angleFromAxis = (d: Vec3, w: Vec3) => Math.acos(Math.max(-1, Math.min(1, d[0] * w[0] + d[1] * w[1] + d[2] * w[2])));

describe('on-axis field of view', () => {
  it('equals 2·asin(a/R) + atan(a/(D + s)) per side, as every traced rim ray confirms (SOURCES.md "Geometry")', () => {
    const mirror: Mirror = { shape: 'round', diameterM: 0.6, radiusM: 0.9 };
    const D = 2.5;
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0 });
    const fov = fieldOfView({ mirror, eyeDistanceM: D });
    const a = 0.3;
    const expected = 2 * Math.asin(a / 0.9) + Math.atan(a / (D + sagitta(0.9, a)));
    expect(fov.horizontalRad / 2).toBeCloseTo(expected, 14);
    for (const r of fanRays({ mirror, pose, eyeM: [D, 0, 3], maxRangeM: 50, samples: 64 })) {
      expect(angleFromAxis(r.directionM, pose.axis)).toBeCloseTo(expected, 10);
    }
  });

  it('uses the width across and the height up and down for a rectangle, checked by tracing', () => {
    const mirror: Mirror = { shape: 'rect', widthM: 0.8, heightM: 0.4, radiusM: 1.5 };
    const D = 3;
    const fov = fieldOfView({ mirror, eyeDistanceM: D });
    expect(fov.horizontalRad).toBeGreaterThan(fov.verticalRad);
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0 });
    const rays = fanRays({ mirror, pose, eyeM: [D, 0, 3], maxRangeM: 50, samples: 8 });
    // Samples every 45° about the vertex, plus the corners; those at 0° and 180° hit the middles of the side edges.
    const across = rays.filter((r) => Math.abs(r.fromM[2] - 3) < 1e-9).map((r) => Math.atan2(r.directionM[1], r.directionM[0]));
    expect(across).toHaveLength(2);
    expect(Math.abs(across[0] - across[1])).toBeCloseTo(fov.horizontalRad, 10);
  });

  it('tends to the flat mirror’s 2·atan(a/D) as R grows (SOURCES.md "Geometry")', () => {
    const fov = fieldOfView({ mirror: { shape: 'round', diameterM: 0.5, radiusM: 1e7 }, eyeDistanceM: 2 });
    expect(fov.horizontalRad).toBeCloseTo(2 * Math.atan(0.25 / 2), 6);
  });

  it('is close to the paraxial a(2/R + 1/D) for a small mirror (SOURCES.md "Geometry")', () => {
    const half = fieldOfView({ mirror: { shape: 'round', diameterM: 0.02, radiusM: 2 }, eyeDistanceM: 5 }).horizontalRad / 2;
    const parax = 0.01 * (2 / 2 + 1 / 5);
    expect(Math.abs(half - parax) / parax).toBeLessThan(1e-4);
  });

  it('is bounded by the silhouette for a full dome: grazing rays leave at π/2 + acos(R/(R + D))', () => {
    const fov = fieldOfView({ mirror: { shape: 'dome', portion: 'full', diameterM: 1 }, eyeDistanceM: 2 });
    expect(fov.horizontalRad / 2).toBeCloseTo(Math.PI / 2 + Math.acos(0.5 / 2.5), 12);
    expect(reflectedRimAngle(0.5, 2, Math.PI / 2)).toBeCloseTo(Math.PI / 2 + Math.acos(0.5 / 2.5), 12);
  });

  it('shows a half dome narrower vertically than across', () => {
    const fov = fieldOfView({ mirror: { shape: 'dome', portion: 'half', diameterM: 1 }, eyeDistanceM: 3 });
    expect(fov.verticalRad).toBeLessThan(fov.horizontalRad);
    expect(fov.verticalRad / 2).toBeCloseTo(reflectedRimAngle(0.5, 3, Math.PI / 4), 12);
  });
});

describe('rim squeeze', () => {
  it('matches a numerical derivative of the traced angles', () => {
    const R = 1.2;
    const D = 2;
    const a = 0.4;
    const eye = (x: number) => Math.atan(x / (D + sagitta(R, Math.abs(x))));
    const world = (x: number) => reflectedRimAngle(R, D, Math.asin(x / R));
    const h = 1e-5;
    const M = (eye(a + h) - eye(a - h)) / (world(a + h) - world(a - h));
    const M0 = (eye(h) - eye(-h)) / (world(h) - world(-h));
    expect(rimSqueeze({ mirror: { shape: 'round', diameterM: 2 * a, radiusM: R }, eyeDistanceM: D })).toBeCloseTo(M / M0, 7);
  });

  it('is 1 for a nearly flat mirror and below 1 for a strongly curved one', () => {
    expect(rimSqueeze({ mirror: { shape: 'round', diameterM: 0.5, radiusM: 1e6 }, eyeDistanceM: 2 })).toBeCloseTo(1, 6);
    expect(rimSqueeze({ mirror: { shape: 'round', diameterM: 0.9, radiusM: 0.6 }, eyeDistanceM: 2 })).toBeLessThan(0.9);
  });
});
