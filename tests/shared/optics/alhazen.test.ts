import * as fc from 'fast-check';
import { reflect, sphereReflectionPoint, type Vec3 } from '../../../shared/optics';

const sub = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const norm = (a: Vec3) => Math.hypot(a[0], a[1], a[2]);
const unit = (a: Vec3): Vec3 => {
  const n = norm(a);
  return [a[0] / n, a[1] / n, a[2] / n];
};
const vec = fc.tuple(fc.double({ min: -10, max: 10, noNaN: true }), fc.double({ min: -10, max: 10, noNaN: true }), fc.double({ min: -10, max: 10, noNaN: true }));

describe('reflection point on a sphere (Alhazen’s problem)', () => {
  it('sends the eye’s ray through the target after reflection (law of reflection, r = i − 2(i·n)n)', () => {
    let solved = 0;
    fc.assert(
      fc.property(vec, vec, fc.double({ min: 0.1, max: 2, noNaN: true }), (E, Q, R) => {
        const C: Vec3 = [0, 0, 0];
        if (norm(E) < R * 1.05 || norm(Q) < R * 1.05) return;
        const m = sphereReflectionPoint(C, R, E as Vec3, Q as Vec3);
        if (!m) return;
        solved++;
        const P: Vec3 = [R * m[0], R * m[1], R * m[2]];
        const r = reflect(unit(sub(P, E as Vec3)), m);
        const toQ = unit(sub(Q as Vec3, P));
        // Angle between the reflected ray and the direction to Q.
        const cx = r[1] * toQ[2] - r[2] * toQ[1];
        const cy = r[2] * toQ[0] - r[0] * toQ[2];
        const cz = r[0] * toQ[1] - r[1] * toQ[0];
        expect(Math.atan2(Math.hypot(cx, cy, cz), r[0] * toQ[0] + r[1] * toQ[1] + r[2] * toQ[2])).toBeLessThan(1e-9);
      }),
      { numRuns: 2000, seed: 42 },
    );
    expect(solved).toBeGreaterThan(50);
  });

  it('finds no reflection when the sphere stands between the eye and the target', () => {
    expect(sphereReflectionPoint([0, 0, 0], 1, [5, 0, 0], [-5, 0.1, 0])).toBeNull();
  });

  it('reflects straight back at the point facing an eye on the line through the centre', () => {
    expect(sphereReflectionPoint([0, 0, 0], 1, [3, 0, 0], [6, 0, 0])).toEqual([1, 0, 0]);
  });
});
