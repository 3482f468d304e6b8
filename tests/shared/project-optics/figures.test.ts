/**
 * Figures read off the seen floor region. Check values are elementary plane geometry (the angle a
 * segment subtends from a point, distances to a square's sides), worked out by hand here.
 */
import { eyeOffAxisRad, floorSeenFigures } from '../../../shared/project-optics';
import * as fc from 'fast-check';
import { poseFromAim, type MultiPolygon, type Pair } from '../../../shared/optics';

const deg = (d: number) => (d * Math.PI) / 180;
const square = (x0: number, y0: number, x1: number, y1: number): MultiPolygon => [
  [
    [
      [x0, y0],
      [x1, y0],
      [x1, y1],
      [x0, y1],
      [x0, y0],
    ],
  ],
];
/** An annular sector about the origin from angle a0 to a1 (radians), radii r0 < r1, one vertex per degree. */
function sector(a0: number, a1: number, r0: number, r1: number): MultiPolygon {
  const steps = Math.round(((a1 - a0) * 180) / Math.PI);
  const at = (r: number, k: number): Pair => [r * Math.cos(a0 + ((a1 - a0) * k) / steps), r * Math.sin(a0 + ((a1 - a0) * k) / steps)];
  const outer = Array.from({ length: steps + 1 }, (_, k) => at(r1, k));
  const inner = Array.from({ length: steps + 1 }, (_, k) => at(r0, steps - k));
  return [[[...outer, ...inner, outer[0]]]];
}

describe('the floor seen, as figures around the mirror', () => {
  it('gives a 1 m square 1 m ahead a spread of 2·atan(½) ≈ 53.13°, nearest 1 m and farthest √4.25 m', () => {
    const f = floorSeenFigures(square(1, -0.5, 2, 0.5), [0, 0])!;
    expect(f.spreadRad).toBeCloseTo(2 * Math.atan(0.5), 12);
    expect((f.spreadRad * 180) / Math.PI).toBeCloseTo(53.13, 2);
    expect(f.nearestM).toBeCloseTo(1, 12);
    expect(f.farthestM).toBeCloseTo(Math.sqrt(4.25), 12);
  });

  it('measures from the point under the mirror, wherever that is on the plan', () => {
    const f = floorSeenFigures(square(11, 4.5, 12, 5.5), [10, 5])!;
    expect(f.spreadRad).toBeCloseTo(2 * Math.atan(0.5), 12);
    expect(f.nearestM).toBeCloseTo(1, 12);
  });

  it('is a full turn with nothing nearer than 0 m when the floor seen lies all round the mirror', () => {
    const f = floorSeenFigures(square(-3, -2, 4, 5), [0, 0])!;
    expect(f.spreadRad).toBeCloseTo(2 * Math.PI, 12);
    expect(f.nearestM).toBe(0);
    expect(f.farthestM).toBeCloseTo(Math.hypot(4, 5), 12);
  });

  it('spans 270° for a three-quarter ring round the mirror, though the mirror is outside the floor seen', () => {
    const f = floorSeenFigures(sector(0, deg(270), 1, 3), [0, 0])!;
    expect((f.spreadRad * 180) / Math.PI).toBeCloseTo(270, 9);
    expect(f.nearestM).toBeCloseTo(1, 3);
  });

  it('spans from the leftmost to the rightmost part when a shadow splits the floor seen in two', () => {
    const lobes: MultiPolygon = [...sector(0, deg(30), 2, 5), ...sector(deg(90), deg(120), 2, 5)];
    expect((floorSeenFigures(lobes, [0, 0])!.spreadRad * 180) / Math.PI).toBeCloseTo(120, 9);
  });

  it('gives a thin triangle the angle its near side subtends, 2·atan(10) ≈ 168.58° for a side from (1, −10) to (1, 10)', () => {
    const f = floorSeenFigures(
      [
        [
          [
            [1, -10],
            [1, 10],
            [1.5, 0],
            [1, -10],
          ],
        ],
      ],
      [0, 0],
    )!;
    expect((f.spreadRad * 180) / Math.PI).toBeCloseTo(168.58, 2);
    expect(f.nearestM).toBeCloseTo(1, 12);
  });

  it('has no figures when no floor is seen', () => {
    expect(floorSeenFigures([], [0, 0])).toBeNull();
  });
});

describe('how far the eye is off the mirror’s axis', () => {
  it('is 0 for an eye on the axis and 45° for one as far across as out, level with the mirror', () => {
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0 });
    expect(eyeOffAxisRad(pose, [5, 0, 3])).toBeCloseTo(0, 7);
    expect(eyeOffAxisRad(pose, [2, 2, 3])).toBeCloseTo(Math.PI / 4, 12);
  });

  it('counts the mirror’s tilt: a mirror tilted 30° down and an eye level with it are 30° apart', () => {
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: deg(30) });
    expect(eyeOffAxisRad(pose, [4, 0, 3])).toBeCloseTo(deg(30), 12);
  });
});

describe('the floor-seen figures over any region', () => {
  /** A convex polygon: k points on a circle of radius r about c, at sorted angles. */
  const convex = fc
    .record({
      cx: fc.double({ min: -1500, max: 1500, noNaN: true }),
      cy: fc.double({ min: -1500, max: 1500, noNaN: true }),
      r: fc.double({ min: 0.05, max: 200, noNaN: true }),
      angles: fc.uniqueArray(fc.double({ min: 0, max: 2 * Math.PI - 1e-6, noNaN: true }), {
        minLength: 3,
        maxLength: 24,
        comparator: (a, b) => Math.abs(a - b) < 1e-3,
      }),
    })
    .map(({ cx, cy, r, angles }) => {
      const ring: Pair[] = [...angles].sort((a, b) => a - b).map((t) => [cx + r * Math.cos(t), cy + r * Math.sin(t)]);
      return { cx, cy, r, ring: [...ring, ring[0]] };
    });
  const foot = fc.tuple(fc.double({ min: -1500, max: 1500, noNaN: true }), fc.double({ min: -1500, max: 1500, noNaN: true }));

  it('spans, for a convex region the mirror is outside, the widest angle between two of its corners', () => {
    fc.assert(
      fc.property(convex, foot, ({ cx, cy, r, ring }, [fx, fy]) => {
        fc.pre(Math.hypot(cx - fx, cy - fy) > r * 1.01 + 1e-3);
        const f = floorSeenFigures([[ring]], [fx, fy])!;
        // Widest angle between two corner directions, by dot products (no atan2, no arcs).
        let widest = 0;
        for (const a of ring) {
          for (const b of ring) {
            const u = [a[0] - fx, a[1] - fy];
            const v = [b[0] - fx, b[1] - fy];
            const c = (u[0] * v[0] + u[1] * v[1]) / (Math.hypot(u[0], u[1]) * Math.hypot(v[0], v[1]));
            widest = Math.max(widest, Math.acos(Math.max(-1, Math.min(1, c))));
          }
        }
        expect(f.spreadRad).toBeCloseTo(widest, 6);
        const dists = ring.map((p) => Math.hypot(p[0] - fx, p[1] - fy));
        expect(f.farthestM).toBeCloseTo(Math.max(...dists), 6);
        expect(f.nearestM).toBeLessThanOrEqual(Math.min(...dists) + 1e-9);
        expect(f.nearestM).toBeGreaterThan(0);
      }),
      { numRuns: 300 },
    );
  });

  it('is a full turn at 0 m whenever the point under the mirror lies inside the floor seen', () => {
    // Corners spread round the whole circle: k corners, each within 0.4 of a k-th of a turn past
    // its even place, so no gap between corners reaches half a turn and the inscribed circle has
    // radius r·cos(largest gap / 2) > 0.
    const spread = fc
      .record({
        cx: fc.double({ min: -1500, max: 1500, noNaN: true }),
        cy: fc.double({ min: -1500, max: 1500, noNaN: true }),
        r: fc.double({ min: 0.05, max: 200, noNaN: true }),
        jitter: fc.array(fc.double({ min: 0, max: 0.4, noNaN: true }), { minLength: 3, maxLength: 24 }),
      })
      .map(({ cx, cy, r, jitter }) => {
        const k = jitter.length;
        const angles = jitter.map((j, i) => ((i + j) * 2 * Math.PI) / k);
        const gaps = angles.map((a, i) => (i + 1 < k ? angles[i + 1] - a : 2 * Math.PI - a + angles[0]));
        const ring: Pair[] = angles.map((t) => [cx + r * Math.cos(t), cy + r * Math.sin(t)]);
        return { cx, cy, inradius: r * Math.cos(Math.max(...gaps) / 2), ring: [...ring, ring[0]] };
      });
    fc.assert(
      fc.property(
        spread,
        fc.double({ min: 0, max: 0.9, noNaN: true }),
        fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
        ({ cx, cy, inradius, ring }, s, t) => {
          const p: Pair = [cx + s * inradius * Math.cos(t), cy + s * inradius * Math.sin(t)];
          const f = floorSeenFigures([[ring]], p)!;
          expect(f.spreadRad).toBeCloseTo(2 * Math.PI, 12);
          expect(f.nearestM).toBe(0);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('does not change when the plan is turned about the point under the mirror', () => {
    fc.assert(
      fc.property(convex, foot, fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), ({ ring }, [fx, fy], turn) => {
        const c = Math.cos(turn);
        const s = Math.sin(turn);
        const turned = ring.map(([x, y]): Pair => [fx + c * (x - fx) - s * (y - fy), fy + s * (x - fx) + c * (y - fy)]);
        const a = floorSeenFigures([[ring]], [fx, fy])!;
        const b = floorSeenFigures([[turned]], [fx, fy])!;
        expect(b.spreadRad).toBeCloseTo(a.spreadRad, 6);
        expect(b.nearestM).toBeCloseTo(a.nearestM, 6);
        expect(b.farthestM).toBeCloseTo(a.farthestM, 6);
      }),
      { numRuns: 200 },
    );
  });
});
