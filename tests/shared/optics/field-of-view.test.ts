import { fanRays, fieldOfView, poseFromAim, reflectedRimAngle, rimSqueeze, sagitta, type Mirror, type Vec3 } from '../../../shared/optics';

const angleFromAxis = (d: Vec3, w: Vec3) => Math.acos(Math.max(-1, Math.min(1, d[0] * w[0] + d[1] * w[1] + d[2] * w[2])));

describe('field of view for an eye on the axis', () => {
  it('equals 2·asin(a/R) + atan(a/(D + s)) per side, as every traced rim ray confirms (docs/sources.md, "Geometry of a spherical mirror")', () => {
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

  it('tends to the flat mirror’s 2·atan(a/D) as R grows (docs/sources.md, "Geometry of a spherical mirror")', () => {
    const fov = fieldOfView({ mirror: { shape: 'round', diameterM: 0.5, radiusM: 1e7 }, eyeDistanceM: 2 });
    expect(fov.horizontalRad).toBeCloseTo(2 * Math.atan(0.25 / 2), 6);
  });

  it('is close to the paraxial a(2/R + 1/D) for a small mirror (docs/sources.md, "Geometry of a spherical mirror")', () => {
    const half = fieldOfView({ mirror: { shape: 'round', diameterM: 0.02, radiusM: 2 }, eyeDistanceM: 5 }).horizontalRad / 2;
    const parax = 0.01 * (2 / 2 + 1 / 5);
    expect(Math.abs(half - parax) / parax).toBeLessThan(1e-4);
  });

  // A dome is a sphere of radius R; an eye on its axis D from the pole sees it out to its
  // silhouette, where rays graze the surface and leave undeviated. So the edge of the field is the
  // eye's tangent line to the sphere, continued past it: π − asin(R/(R + D)) from the axis
  // (elementary geometry of a tangent to a circle; docs/sources.md, "Geometry of a spherical mirror").
  it('ends, for a full dome, on the eye’s tangent line to the sphere: π − asin(R/(R + D)) from the axis', () => {
    const R = 0.5;
    const D = 2;
    const mirror: Mirror = { shape: 'dome', portion: 'full', diameterM: 2 * R };
    const edge = Math.PI - Math.asin(R / (R + D));
    expect(fieldOfView({ mirror, eyeDistanceM: D }).horizontalRad / 2).toBeCloseTo(edge, 12);
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0 });
    const rays = fanRays({ mirror, pose, eyeM: [D, 0, 3], maxRangeM: 50, samples: 64 });
    for (const r of rays) expect(angleFromAxis(r.directionM, pose.axis)).toBeCloseTo(edge, 9);
  });

  it('gives a half dome, up and down, the angle the law of reflection gives at its traced top rim', () => {
    const R = 0.5;
    const D = 3;
    const mirror: Mirror = { shape: 'dome', portion: 'half', diameterM: 2 * R };
    const fov = fieldOfView({ mirror, eyeDistanceM: D });
    expect(fov.verticalRad).toBeLessThan(fov.horizontalRad);
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0 });
    const eye: Vec3 = [D, 0, 3];
    const top = fanRays({ mirror, pose, eyeM: eye, maxRangeM: 50, samples: 64 })
      .filter((r) => Math.abs(r.fromM[1]) < 1e-9 && r.fromM[2] > 3)
      .sort((p, q) => q.fromM[2] - p.fromM[2])[0];
    expect(top).toBeDefined();
    // Law of reflection r = i − 2(i·n)n (docs/sources.md, "Geometry of a spherical mirror"), by hand in the
    // vertical plane through the axis; the sphere's centre is R behind the pole.
    const c: Vec3 = [-R, 0, 3];
    const n = [(top.fromM[0] - c[0]) / R, (top.fromM[2] - c[2]) / R];
    const len = Math.hypot(top.fromM[0] - eye[0], top.fromM[2] - eye[2]);
    const i = [(top.fromM[0] - eye[0]) / len, (top.fromM[2] - eye[2]) / len];
    const dot = i[0] * n[0] + i[1] * n[1];
    const r = [i[0] - 2 * dot * n[0], i[1] - 2 * dot * n[1]];
    const byHand = Math.acos(r[0] / Math.hypot(r[0], r[1]));
    expect(fov.verticalRad / 2).toBeCloseTo(byHand, 9);
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
