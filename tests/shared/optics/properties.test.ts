import * as fc from 'fast-check';
import {
  convexImage,
  coverage,
  fieldOfView,
  perceivedDistance,
  poseFromAim,
  recognisableRange,
  rimSqueeze,
  visibleInMirror,
  type Mirror,
  type Vec3,
} from '../../../shared/optics';
import { agreement } from './helpers';

const pos = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

describe('properties of the paraxial closed forms', () => {
  it('keeps 0 < m < 1 and |dᵢ| < |f| for every convex mirror and real object', () => {
    fc.assert(
      fc.property(pos(1e-3, 1e3), pos(1e-3, 1e4), (R, d) => {
        const img = convexImage({ radiusM: R, objectDistanceM: d });
        expect(img.magnification).toBeGreaterThan(0);
        expect(img.magnification).toBeLessThan(1);
        expect(img.imageDistanceM).toBeLessThan(0);
        expect(Math.abs(img.imageDistanceM)).toBeLessThan(Math.abs(img.focalLengthM));
      }),
    );
  });

  it('tends to a flat mirror as R → ∞: m → 1 and the image as far behind as the object is in front', () => {
    fc.assert(
      fc.property(pos(0.1, 100), (d) => {
        const img = convexImage({ radiusM: 1e12, objectDistanceM: d });
        expect(img.magnification).toBeCloseTo(1, 8);
        expect(img.imageDistanceM / -d).toBeCloseTo(1, 8);
        expect(perceivedDistance({ radiusM: 1e12, eyeDistanceM: 1, objectDistanceM: d }).ratio).toBeCloseTo(1, 8);
      }),
    );
  });

  it('returns no NaN or Infinity for any input in range', () => {
    fc.assert(
      fc.property(pos(1e-3, 1e3), pos(1e-3, 1e3), pos(1e-3, 1e3), pos(1e-6, 3), pos(1e-3, 0.99), (R, D, h, theta, frac) => {
        const values = [
          ...Object.values(convexImage({ radiusM: R, objectDistanceM: D, objectHeightM: h })),
          ...Object.values(perceivedDistance({ radiusM: R, eyeDistanceM: D, objectDistanceM: h })),
          recognisableRange({ radiusM: R, eyeDistanceM: D, targetSizeM: h, minAngleRad: theta }).rangeM,
          ...Object.values(fieldOfView({ mirror: { shape: 'round', diameterM: 2 * R * frac, radiusM: R }, eyeDistanceM: D })),
          rimSqueeze({ mirror: { shape: 'round', diameterM: 2 * R * frac, radiusM: R }, eyeDistanceM: D }),
          ...Object.values(fieldOfView({ mirror: { shape: 'dome', portion: 'quarter', diameterM: R }, eyeDistanceM: D })),
        ];
        for (const v of values) expect(Number.isFinite(v)).toBe(true);
      }),
    );
  });
});

describe('properties of the field of view', () => {
  it('grows as the radius of curvature shrinks and as the diameter grows', () => {
    fc.assert(
      fc.property(pos(0.05, 1), pos(0.2, 10), pos(0.5, 20), pos(1.01, 3), (d, R0, D, k) => {
        const R = Math.max(R0, d); // keep the diameter below 2R
        const base = fieldOfView({ mirror: { shape: 'round', diameterM: d, radiusM: R }, eyeDistanceM: D }).horizontalRad;
        const tighter = fieldOfView({
          mirror: { shape: 'round', diameterM: d, radiusM: Math.max(R / k, d / 1.99) },
          eyeDistanceM: D,
        }).horizontalRad;
        const wider = fieldOfView({
          mirror: { shape: 'round', diameterM: Math.min(d * k, 1.99 * R), radiusM: R },
          eyeDistanceM: D,
        }).horizontalRad;
        expect(tighter).toBeGreaterThanOrEqual(base - 1e-12);
        expect(wider).toBeGreaterThanOrEqual(base - 1e-12);
      }),
    );
  });
});

const placement = fc.record({
  d: pos(0.3, 1),
  R: pos(1.1, 4),
  az: pos(-Math.PI, Math.PI),
  tilt: pos(0.15, 0.7),
  z: pos(2.2, 4),
  eyeDist: pos(2, 8),
  eyeOff: pos(-0.7, 0.7),
  eyeZ: pos(1, 2),
});

describe('properties of the traced coverage', () => {
  it('grows with the diameter', () => {
    fc.assert(
      fc.property(placement, pos(0.05, 0.5), (p, extra) => {
        const pose = poseFromAim({ vertexM: [0, 0, p.z], azimuthRad: p.az, tiltDownRad: p.tilt });
        const a = p.az + p.eyeOff;
        const eyeM: Vec3 = [p.eyeDist * Math.cos(a), p.eyeDist * Math.sin(a), p.eyeZ];
        const small: Mirror = { shape: 'round', diameterM: p.d, radiusM: p.R };
        const big: Mirror = { shape: 'round', diameterM: Math.min(p.d + extra, 1.9 * p.R), radiusM: p.R };
        const A = coverage({ mirror: small, pose, eyeM, maxRangeM: 15 }).areaM2;
        const B = coverage({ mirror: big, pose, eyeM, maxRangeM: 15 }).areaM2;
        expect(B).toBeGreaterThanOrEqual(A * (1 - 1e-4));
      }),
      { numRuns: 60 },
    );
  });

  it('gives a mirror-symmetric region when mirror and eye are symmetric about a vertical plane', () => {
    fc.assert(
      fc.property(placement, (p) => {
        const pose = poseFromAim({ vertexM: [0, 0, p.z], azimuthRad: 0, tiltDownRad: p.tilt });
        const eyeM: Vec3 = [p.eyeDist, 0, p.eyeZ];
        const mirror: Mirror = { shape: 'round', diameterM: p.d, radiusM: p.R };
        const { region } = coverage({ mirror, pose, eyeM, maxRangeM: 15 });
        const flipped = region.map((poly) => poly.map((ring) => ring.map(([x, y]) => [x, -y] as [number, number])));
        const a = agreement({
          region: flipped,
          mirror,
          pose,
          eyeM,
          maxRangeM: 15,
          halfBoxM: 16,
          n: 300,
          marginM: 0.02,
          seed: Math.round(p.z * 1000),
        });
        expect(a.disagree).toBe(0);
      }),
      { numRuns: 25 },
    );
  });

  it('agrees with the point test on random points away from its edge, for random placements', () => {
    fc.assert(
      fc.property(placement, fc.constantFrom('round', 'rect'), (p, shape) => {
        const pose = poseFromAim({ vertexM: [0, 0, p.z], azimuthRad: p.az, tiltDownRad: p.tilt });
        const a = p.az + p.eyeOff;
        const eyeM: Vec3 = [p.eyeDist * Math.cos(a), p.eyeDist * Math.sin(a), p.eyeZ];
        const mirror: Mirror =
          shape === 'round' ? { shape, diameterM: p.d, radiusM: p.R } : { shape, widthM: p.d, heightM: 0.6 * p.d, radiusM: p.R };
        const { region } = coverage({ mirror, pose, eyeM, maxRangeM: 15 });
        const res = agreement({
          region,
          mirror,
          pose,
          eyeM,
          maxRangeM: 15,
          halfBoxM: 16,
          n: 300,
          marginM: 0.02,
          seed: Math.round(p.eyeDist * 1000),
        });
        expect(res.disagree).toBe(0);
      }),
      { numRuns: 40 },
    );
  });

  it('never reports a reflection point that is not finite', () => {
    fc.assert(
      fc.property(placement, pos(-20, 20), pos(-20, 20), (p, x, y) => {
        const pose = poseFromAim({ vertexM: [0, 0, p.z], azimuthRad: p.az, tiltDownRad: p.tilt });
        const a = p.az + p.eyeOff;
        const v = visibleInMirror({
          mirror: { shape: 'round', diameterM: p.d, radiusM: p.R },
          pose,
          eyeM: [p.eyeDist * Math.cos(a), p.eyeDist * Math.sin(a), p.eyeZ],
          pointM: [x, y, 0],
        });
        if (v.reflectionPointM) for (const c of v.reflectionPointM) expect(Number.isFinite(c)).toBe(true);
      }),
    );
  });
});
