import {
  ARCMIN_RAD,
  apparentAngle,
  paraxialAngle,
  perceivedDistance,
  poseFromAim,
  recognisableRange,
  reflect,
  type Mirror,
  type Vec3,
} from '../../../shared/optics';

// Human factors (SOURCES.md): 20/20 acuity resolves 1 minute of arc; a Snellen 20/20 letter
// subtends 5 minutes of arc. Common practice in vision testing (recorded as confirmed in the project's outside-facts list).
const normalize = (a: Vec3): Vec3 => {
  const n = Math.hypot(a[0], a[1], a[2]);
  return [a[0] / n, a[1] / n, a[2] / n];
};
const ACUITY = 1 * ARCMIN_RAD;
const SNELLEN_LETTER = 5 * ARCMIN_RAD;

describe('recognisable range with acuity figures from common practice', () => {
  it('puts the target at exactly the chosen angle at the computed range', () => {
    const input = { radiusM: 1.2, eyeDistanceM: 4, targetSizeM: 1.7 };
    const { rangeM } = recognisableRange({ ...input, minAngleRad: SNELLEN_LETTER });
    expect(paraxialAngle({ ...input, objectDistanceM: rangeM })).toBeCloseTo(SNELLEN_LETTER, 15);
    // A detail at the acuity limit (1′) is seen five times farther in angle terms than a letter (5′).
    expect(recognisableRange({ ...input, minAngleRad: ACUITY }).rangeM).toBeGreaterThan(4.9 * rangeM);
  });

  it('agrees with the exact angle through the reflection point for a small target on the axis', () => {
    const mirror: Mirror = { shape: 'round', diameterM: 0.6, radiusM: 1.2 };
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0 });
    const D = 3;
    const d = 10;
    const exact = apparentAngle({ mirror, pose, eyeM: [D, 0, 3], pointM: [d, 0, 3], targetSizeM: 0.01, directionM: [0, 1, 0] });
    const parax = paraxialAngle({ radiusM: 1.2, eyeDistanceM: D, objectDistanceM: d - 0, targetSizeM: 0.01 });
    expect(exact).not.toBeNull();
    expect(Math.abs((exact as number) - parax) / parax).toBeLessThan(2e-3);
  });
});

describe('US FMVSS No. 111 figures as check values', () => {
  // S9.4 school-bus mirrors: each test cylinder's image at least 3′ in its shortest dimension,
  // one larger cylinder at least 9′ in its longest (confirmed, 70 FR 73383). Cylinders 0.3048 m
  // in diameter and 0.3048 m high, the larger 0.9144 m high (from memory).
  it('gives the same range for a 0.3048 m cylinder at 3′ and a 0.9144 m one at 9′, since only size/angle matters', () => {
    const common = { radiusM: 0.4, eyeDistanceM: 2.2 };
    const small = recognisableRange({ ...common, targetSizeM: 0.3048, minAngleRad: 3 * ARCMIN_RAD }).rangeM;
    const large = recognisableRange({ ...common, targetSizeM: 0.9144, minAngleRad: 9 * ARCMIN_RAD }).rangeM;
    expect(small).toBeGreaterThan(0);
    expect(large).toBeCloseTo(small, 9);
  });

  it('finds where a school-bus test cylinder falls below the 3′ threshold along a reflected sightline', () => {
    const mirror: Mirror = { shape: 'round', diameterM: 0.25, radiusM: 0.4 };
    const pose = poseFromAim({ vertexM: [1.2, 1.3, 2.2], azimuthRad: Math.PI + 0.6, tiltDownRad: 0.7 });
    const eyeM: Vec3 = [-0.5, 0.4, 1.3];
    // The ray from the eye through the vertex reflects about the axis; cylinders placed along it
    // keep the same orientation to the sightline, so only distance changes their angle.
    const V = pose.vertexM;
    const r = reflect(normalize([V[0] - eyeM[0], V[1] - eyeM[1], V[2] - eyeM[2]]), pose.axis);
    const across = normalize([r[1], -r[0], 0]);
    const angleAt = (t: number) =>
      apparentAngle({ mirror, pose, eyeM, pointM: [V[0] + t * r[0], V[1] + t * r[1], V[2] + t * r[2]], targetSizeM: 0.3048, directionM: across });
    const ts = [0.5, 1, 2, 4, 8, 16, 32];
    const angles = ts.map((t) => angleAt(t) as number);
    angles.forEach((a, k) => {
      expect(a).not.toBeNull();
      if (k > 0) expect(a).toBeLessThan(angles[k - 1]);
    });
    expect(angles[0]).toBeGreaterThan(3 * ARCMIN_RAD);
    expect(angles[angles.length - 1]).toBeLessThan(3 * ARCMIN_RAD);
  });

  // S5.4.1 passenger-car convex mirror: average radius of curvature 889–1,651 mm (35–65 in;
  // inches confirmed by an official interpretation, mm and paragraph number from memory).
  it.each([0.889, 1.651])('makes objects look farther than they are with R = %s m, hence the S5.4.2 warning (confirmed)', (R) => {
    expect(R / 0.0254).toBeCloseTo(R === 0.889 ? 35 : 65, 9);
    const p = perceivedDistance({ radiusM: R, eyeDistanceM: 1, objectDistanceM: 10 });
    expect(p.ratio).toBeGreaterThan(1);
  });

  it('shows a 35-inch mirror shrinking more than a 65-inch one', () => {
    const tight = perceivedDistance({ radiusM: 0.889, eyeDistanceM: 1, objectDistanceM: 10 }).ratio;
    const gentle = perceivedDistance({ radiusM: 1.651, eyeDistanceM: 1, objectDistanceM: 10 }).ratio;
    expect(tight).toBeGreaterThan(gentle);
  });
});
