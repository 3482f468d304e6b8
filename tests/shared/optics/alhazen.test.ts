import * as fc from 'fast-check';
import { reflect, sphereReflectionPoint, type Vec3 } from '../../../shared/optics';

const sub = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const norm = (a: Vec3) => Math.hypot(a[0], a[1], a[2]);
const unit = (a: Vec3): Vec3 => {
  const n = norm(a);
  return [a[0] / n, a[1] / n, a[2] / n];
};
const vec = fc.tuple(
  fc.double({ min: -10, max: 10, noNaN: true }),
  fc.double({ min: -10, max: 10, noNaN: true }),
  fc.double({ min: -10, max: 10, noNaN: true }),
);

/**
 * Cases built forward so that a reflection certainly exists: an eye E outside the sphere, a
 * point P of the sphere that E sees (the eye on the outer side of the tangent plane at P), the
 * ray E → P reflected there (r = i − 2(i·n)n), and a target Q on the reflected ray. The
 * reflection point of a convex sphere is unique, so the solver must return P itself. The ranges
 * include the hard cases: grazing incidence (P near the eye's silhouette), targets almost on
 * the mirror and 10,000 radii away, eyes 1 cm off the surface.
 */
const forwardCase = fc
  .record({
    // Catalogue radii (shared/schemas/catalogue.ts: 0.05–50 m).
    R: fc.double({ min: 0.05, max: 50, noNaN: true }),
    // How far the eye is from the surface: 1 cm (closer than any viewer stands) to 1 km.
    eyeGapM: fc.oneof(fc.double({ min: 0.01, max: 0.05, noNaN: true }), fc.double({ min: 0.05, max: 1000, noNaN: true })),
    eyeDir: vec.filter((v) => norm(v as Vec3) > 1e-3),
    // Where P sits within the cap the eye sees: 0 = facing the eye, 1 = on its silhouette (the
    // silhouette itself is excluded: there the eye lies in the tangent plane).
    capU: fc.oneof(fc.double({ min: 0, max: 0.999, noNaN: true }), fc.double({ min: 0.999, max: 0.999999, noNaN: true })),
    turn: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
    // Distance from P to Q along the reflected ray, in sphere radii.
    along: fc.oneof(fc.double({ min: 1e-3, max: 1, noNaN: true }), fc.double({ min: 1, max: 1e4, noNaN: true })),
  })
  .map(({ R, eyeGapM, eyeDir, capU, turn, along }) => {
    const C: Vec3 = [0.3, -1.2, 2.5];
    const eyeDist = 1 + eyeGapM / R;
    const e = unit(eyeDir as Vec3);
    const E: Vec3 = [C[0] + R * eyeDist * e[0], C[1] + R * eyeDist * e[1], C[2] + R * eyeDist * e[2]];
    // The eye sees the cap m·e > 1/eyeDist; tilt m away from e by a fraction of that cap's angle.
    const cap = Math.acos(1 / eyeDist);
    const a = capU * cap;
    const helper: Vec3 = Math.abs(e[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
    const t1 = unit([e[1] * helper[2] - e[2] * helper[1], e[2] * helper[0] - e[0] * helper[2], e[0] * helper[1] - e[1] * helper[0]]);
    const t2: Vec3 = [e[1] * t1[2] - e[2] * t1[1], e[2] * t1[0] - e[0] * t1[2], e[0] * t1[1] - e[1] * t1[0]];
    const g: Vec3 = [
      Math.cos(turn) * t1[0] + Math.sin(turn) * t2[0],
      Math.cos(turn) * t1[1] + Math.sin(turn) * t2[1],
      Math.cos(turn) * t1[2] + Math.sin(turn) * t2[2],
    ];
    const m: Vec3 = [
      Math.cos(a) * e[0] + Math.sin(a) * g[0],
      Math.cos(a) * e[1] + Math.sin(a) * g[1],
      Math.cos(a) * e[2] + Math.sin(a) * g[2],
    ];
    const P: Vec3 = [C[0] + R * m[0], C[1] + R * m[1], C[2] + R * m[2]];
    const r = reflect(unit(sub(P, E)), m);
    const Q: Vec3 = [P[0] + along * R * r[0], P[1] + along * R * r[1], P[2] + along * R * r[2]];
    return { C, R, E, Q, m };
  });

describe('reflection point on a sphere (Alhazen’s problem)', () => {
  it('finds the reflection point whenever one exists, including grazing, near and far targets', () => {
    fc.assert(
      fc.property(forwardCase, ({ C, R, E, Q, m }) => {
        const found = sphereReflectionPoint(C, R, E, Q);
        // A solver that gives up on a case with a reflection fails here.
        expect(found).not.toBeNull();
        const f = found as Vec3;
        // The same point of the sphere (angle between the directions from the centre), within
        // 1e-7 rad: at grazing incidence a tiny error in the law of reflection moves P along
        // the sphere by much more, so the comparison is looser than the solver's own 1e-15.
        const cx = f[1] * m[2] - f[2] * m[1];
        const cy = f[2] * m[0] - f[0] * m[2];
        const cz = f[0] * m[1] - f[1] * m[0];
        expect(Math.atan2(Math.hypot(cx, cy, cz), f[0] * m[0] + f[1] * m[1] + f[2] * m[2])).toBeLessThan(1e-7);
      }),
      { numRuns: 1500, seed: 7 },
    );
  });

  it('sends the eye’s ray through the target after reflection (law of reflection, r = i − 2(i·n)n)', () => {
    fc.assert(
      fc.property(forwardCase, ({ C, R, E, Q }) => {
        const m = sphereReflectionPoint(C, R, E, Q);
        expect(m).not.toBeNull();
        const mm = m as Vec3;
        const P: Vec3 = [C[0] + R * mm[0], C[1] + R * mm[1], C[2] + R * mm[2]];
        const r = reflect(unit(sub(P, E)), mm);
        const toQ = unit(sub(Q, P));
        // Angle between the reflected ray and the direction to Q. Near grazing incidence the
        // rounding of g(φ) (a difference of nearly equal unit vectors) is amplified: measured up
        // to 1.1e-9 rad over these cases, so 1e-8 rad (1 µm per 100 m) is the bound.
        const cx = r[1] * toQ[2] - r[2] * toQ[1];
        const cy = r[2] * toQ[0] - r[0] * toQ[2];
        const cz = r[0] * toQ[1] - r[1] * toQ[0];
        expect(Math.atan2(Math.hypot(cx, cy, cz), r[0] * toQ[0] + r[1] * toQ[1] + r[2] * toQ[2])).toBeLessThan(1e-8);
      }),
      { numRuns: 1500, seed: 42 },
    );
  });

  it('finds no reflection when the sphere stands between the eye and the target', () => {
    expect(sphereReflectionPoint([0, 0, 0], 1, [5, 0, 0], [-5, 0.1, 0])).toBeNull();
  });

  it('reflects straight back at the point facing an eye on the line through the centre', () => {
    expect(sphereReflectionPoint([0, 0, 0], 1, [3, 0, 0], [6, 0, 0])).toEqual([1, 0, 0]);
  });
});
