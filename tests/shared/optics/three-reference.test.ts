import { execFileSync } from 'child_process';
import * as path from 'path';
import * as fc from 'fast-check';
import { fanRays, poseFromAim, sphereRadiusM, domeMountTiltRad, type Mirror, type Vec3 } from '../../../shared/optics';

/**
 * three.js (Ray.intersectSphere, Vector3.reflect, Ray.intersectPlane) serves as an independent
 * ray tracer. It is given only the sphere (centre, radius), the eye, a point to aim at on the
 * engine's rim, and the plane; it must land on the same reflection points, reflected rays and
 * floor points. three.js ships as ES modules only, so it runs in a child Node process
 * (three-reference.mjs beside this file).
 */
const mirrorArb: fc.Arbitrary<Mirror> = fc.oneof(
  fc.record({ shape: fc.constant('round' as const), diameterM: fc.double({ min: 0.2, max: 1.2, noNaN: true }), radiusM: fc.double({ min: 0.7, max: 6, noNaN: true }) }),
  fc.record({ shape: fc.constant('rect' as const), widthM: fc.double({ min: 0.2, max: 1, noNaN: true }), heightM: fc.double({ min: 0.15, max: 0.8, noNaN: true }), radiusM: fc.double({ min: 0.8, max: 6, noNaN: true }) }),
  fc.record({ shape: fc.constant('dome' as const), portion: fc.constantFrom('full' as const, 'half' as const, 'quarter' as const), diameterM: fc.double({ min: 0.3, max: 1.5, noNaN: true }) }),
);

type Case = { centre: Vec3; radius: number; eye: Vec3; toward: Vec3; planeHeight: number };
type Ours = { from: Vec3; dir: Vec3; to: Vec3; meets: boolean; cosIncidence: number };
type Ref = { hit: Vec3; cosIncidence: number; reflected: Vec3; floor: Vec3 | null } | null;

const GRAZING = 0.05;
const dist = (a: Vec3, b: Vec3) => Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
const angle = (a: Vec3, b: Vec3) => {
  const cx = a[1] * b[2] - a[2] * b[1];
  const cy = a[2] * b[0] - a[0] * b[2];
  const cz = a[0] * b[1] - a[1] * b[0];
  return Math.atan2(Math.hypot(cx, cy, cz), a[0] * b[0] + a[1] * b[1] + a[2] * b[2]);
};

describe('ray tracing agrees with three.js as an independent reference', () => {
  const cases: Case[] = [];
  const ours: Ours[] = [];
  let placements = 0;
  fc.assert(
    fc.property(
      mirrorArb,
      fc.double({ min: 1.5, max: 6, noNaN: true }),
      fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
      fc.double({ min: 0, max: 0.8, noNaN: true }),
      fc.double({ min: 2, max: 12, noNaN: true }),
      fc.double({ min: -0.8, max: 0.8, noNaN: true }),
      fc.double({ min: 0.8, max: 2.2, noNaN: true }),
      fc.double({ min: 0, max: 1.2, noNaN: true }),
      (mirror, mountZ, az, tilt0, eyeDist, eyeOff, eyeZ, planeHeight) => {
        const dome = mirror.shape === 'dome';
        const tilt = dome ? domeMountTiltRad(mirror.portion) : tilt0;
        const pose = poseFromAim({ vertexM: [0, 0, mountZ + (dome ? 1.5 : 0.5)], azimuthRad: az, tiltDownRad: tilt });
        const a = az + eyeOff;
        const eyeM: Vec3 = [eyeDist * Math.cos(a), eyeDist * Math.sin(a), eyeZ];
        let rays;
        try {
          rays = fanRays({ mirror, pose, eyeM, planeHeightM: planeHeight, maxRangeM: 40, samples: 64 });
        } catch {
          return; // this random eye is behind the mirror or the plane too high: nothing to compare
        }
        placements++;
        const R = sphereRadiusM(mirror);
        const w = pose.axis;
        const centre: Vec3 = [pose.vertexM[0] - R * w[0], pose.vertexM[1] - R * w[1], pose.vertexM[2] - R * w[2]];
        for (const r of rays) {
          cases.push({ centre, radius: R, eye: eyeM, toward: r.fromM, planeHeight });
          const i = [r.fromM[0] - eyeM[0], r.fromM[1] - eyeM[1], r.fromM[2] - eyeM[2]];
          const n = [(r.fromM[0] - centre[0]) / R, (r.fromM[1] - centre[1]) / R, (r.fromM[2] - centre[2]) / R];
          const cosIncidence = (i[0] * n[0] + i[1] * n[1] + i[2] * n[2]) / Math.hypot(i[0], i[1], i[2]);
          ours.push({ from: r.fromM, dir: r.directionM, to: r.toM, meets: r.meetsPlane, cosIncidence });
        }
      },
    ),
    { numRuns: 260, seed: 20240611 },
  );
  const refs = JSON.parse(
    execFileSync(process.execPath, [path.join(__dirname, 'three-reference.mjs')], { input: JSON.stringify(cases), maxBuffer: 1 << 28 }).toString('utf8'),
  ) as Ref[];

  it('covers at least 200 random placements of round, rectangular and dome mirrors', () => {
    expect(placements).toBeGreaterThanOrEqual(200);
    expect(refs).toHaveLength(cases.length);
  });

  it('finds the same reflection points (1e-9 m) and reflected directions (1e-9 rad)', () => {
    let compared = 0;
    refs.forEach((ref, i) => {
      // Grazing rays at a dome's silhouette make any ray–sphere intersection ill-conditioned:
      // an error ε in the aim moves the hit by about ε/cos(incidence).
      if (Math.abs(ours[i].cosIncidence) < GRAZING) return;
      expect(ref).not.toBeNull();
      if (!ref) return;
      expect(dist(ref.hit, ours[i].from)).toBeLessThan(1e-9);
      expect(angle(ref.reflected, ours[i].dir)).toBeLessThan(1e-9);
      compared++;
    });
    expect(compared).toBeGreaterThan(10000);
  });

  it('finds the same floor points (1e-9 m) for every ray that meets the plane in range', () => {
    let compared = 0;
    refs.forEach((ref, i) => {
      if (!ref || Math.abs(ours[i].cosIncidence) < GRAZING || !ours[i].meets) return;
      expect(ref.floor).not.toBeNull();
      expect(dist(ref.floor as Vec3, ours[i].to)).toBeLessThan(1e-9);
      compared++;
    });
    expect(compared).toBeGreaterThan(3000);
  });
});
