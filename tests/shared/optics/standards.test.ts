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
import { parseLength } from '../../../shared/units';

// Human factors (docs/sources.md, "Human factors"): 20/20 acuity resolves 1 minute of arc; a
// Snellen 20/20 letter subtends 5 minutes of arc. Common practice in vision testing.
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
  // S9.4 school-bus mirrors (docs/sources.md, "US FMVSS No. 111"; published, checked: 70 FR 73383):
  // each test cylinder's image lies at least 3′ inside the edge of the mirror surface, and the
  // image of cylinder P is at least 3′ in its shortest dimension and at least 9′ in its longest.
  // Cylinder P: 0.3048 m in diameter, 0.9144 m high (from memory).
  const P_DIAMETER_M = 0.3048;
  it("puts cylinder P's 3′ limit on its diameter where an exact ray trace puts it, on the axis", () => {
    const mirror: Mirror = { shape: 'round', diameterM: 0.25, radiusM: 0.4 };
    const pose = poseFromAim({ vertexM: [0, 0, 2], azimuthRad: 0, tiltDownRad: 0 });
    const D = 2.2;
    const eyeM: Vec3 = [D, 0, 2];
    // The diameter, centred on the axis, seen across through the exact reflection points.
    const exactAngle = (d: number) =>
      apparentAngle({ mirror, pose, eyeM, pointM: [d, -P_DIAMETER_M / 2, 2], targetSizeM: P_DIAMETER_M, directionM: [0, 1, 0] }) as number;
    let lo = D + 0.1;
    let hi = 200;
    expect(exactAngle(lo)).toBeGreaterThan(3 * ARCMIN_RAD);
    expect(exactAngle(hi)).toBeLessThan(3 * ARCMIN_RAD);
    for (let k = 0; k < 60; k++) {
      const mid = (lo + hi) / 2;
      if (exactAngle(mid) > 3 * ARCMIN_RAD) lo = mid;
      else hi = mid;
    }
    const traced = lo;
    const closedForm = recognisableRange({ radiusM: 0.4, eyeDistanceM: D, targetSizeM: P_DIAMETER_M, minAngleRad: 3 * ARCMIN_RAD }).rangeM;
    expect(Math.abs(closedForm - traced) / traced).toBeLessThan(0.01);
  });

  it("finds where cylinder P's diameter falls below S9.4's 3′ along a reflected sightline", () => {
    const mirror: Mirror = { shape: 'round', diameterM: 0.25, radiusM: 0.4 };
    const pose = poseFromAim({ vertexM: [1.2, 1.3, 2.2], azimuthRad: Math.PI + 0.6, tiltDownRad: 0.7 });
    const eyeM: Vec3 = [-0.5, 0.4, 1.3];
    // The ray from the eye through the vertex reflects about the axis; cylinders placed along it
    // keep the same orientation to the sightline, so only distance changes their angle.
    const V = pose.vertexM;
    const r = reflect(normalize([V[0] - eyeM[0], V[1] - eyeM[1], V[2] - eyeM[2]]), pose.axis);
    const across = normalize([r[1], -r[0], 0]);
    const angleAt = (t: number) =>
      apparentAngle({
        mirror,
        pose,
        eyeM,
        pointM: [V[0] + t * r[0], V[1] + t * r[1], V[2] + t * r[2]],
        targetSizeM: 0.3048,
        directionM: across,
      });
    const ts = [0.5, 1, 2, 4, 8, 16, 32];
    const angles = ts.map((t) => angleAt(t) as number);
    angles.forEach((a, k) => {
      expect(a).not.toBeNull();
      if (k > 0) expect(a).toBeLessThan(angles[k - 1]);
    });
    expect(angles[0]).toBeGreaterThan(3 * ARCMIN_RAD);
    expect(angles[angles.length - 1]).toBeLessThan(3 * ARCMIN_RAD);
  });

  // S5.4.1 passenger-car convex mirror: average radius of curvature 35–65 in (docs/sources.md,
  // "US FMVSS No. 111": the inches published, checked). The inch is 25.4 mm exactly (international
  // yard and pound agreement, 1959: common practice), so 35 in is 889 mm and 65 in is 1,651 mm.
  it.each([
    ['35 in', 0.889],
    ['65 in', 1.651],
  ])('reads the rule’s radius %s as %s m when an installer types it', (text, metres) => {
    const parsed = parseLength(text, 'imperial', 'size');
    expect(parsed.ok).toBe(true);
    if (parsed.ok) expect(parsed.m).toBeCloseTo(metres, 12);
  });

  it.each([0.889, 1.651])('makes objects look farther than they are with R = %s m, hence the S5.4.2 warning (published, checked)', (R) => {
    const p = perceivedDistance({ radiusM: R, eyeDistanceM: 1, objectDistanceM: 10 });
    expect(p.ratio).toBeGreaterThan(1);
  });

  it('shows a 35-inch mirror shrinking more than a 65-inch one', () => {
    const tight = perceivedDistance({ radiusM: 0.889, eyeDistanceM: 1, objectDistanceM: 10 }).ratio;
    const gentle = perceivedDistance({ radiusM: 1.651, eyeDistanceM: 1, objectDistanceM: 10 }).ratio;
    expect(tight).toBeGreaterThan(gentle);
  });
});
