import * as fc from 'fast-check';
import { intersection } from 'polygon-clipping';
import { boundsOfPoints, boxesMeet, packedPoints, segmentBounds, type Bounds } from '../../../shared/geometry/bounds';
import { clipRingToBox, clipRingToConvex, clipToSlab } from '../../../shared/geometry/clip';
import { multiPolygonArea, signedRingArea, type MultiPolygon, type Pair, type Ring } from '../../../shared/geometry/polygon';
import { chooseScaleBar, SCALE_BAR_COUNTS } from '../../../shared/units';

/**
 * Star-shaped rings (vertices at increasing angles around a centre, any radius) are simple, so
 * polygon-clipping (a general-purpose reference library) gives the true intersection to compare with.
 */
const coord = fc.double({ min: -50, max: 50, noNaN: true });
const starRing = fc
  .tuple(
    coord,
    coord,
    fc.array(fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0.05, max: 40, noNaN: true })), {
      minLength: 3,
      maxLength: 40,
    }),
  )
  .map(([cx, cy, spokes]): Ring => {
    const angles = spokes.map(([a], i) => ((i + a) / spokes.length) * 2 * Math.PI);
    return spokes.map(([, r], i): Pair => [cx + r * Math.cos(angles[i]), cy + r * Math.sin(angles[i])]);
  })
  .filter((ring) => Math.abs(signedRingArea(ring)) > 1e-6);
/** polygon-clipping's area, or the case is skipped when the reference itself gives up (it can throw on nearly degenerate input). */
function referenceArea(op: () => MultiPolygon): number {
  try {
    return multiPolygonArea(op());
  } catch {
    fc.pre(false);
    return Number.NaN;
  }
}
const box = fc.tuple(coord, coord, fc.double({ min: 0.01, max: 80, noNaN: true }), fc.double({ min: 0.01, max: 80, noNaN: true }));

describe('Sutherland–Hodgman clipping (the one implementation)', () => {
  it('cuts any simple star-shaped ring to a box with the same area polygon-clipping finds', () => {
    fc.assert(
      fc.property(starRing, box, (ring, [x0, y0, w, h]) => {
        const ours = Math.abs(signedRingArea(clipRingToBox(ring, x0, y0, x0 + w, y0 + h)));
        const reference = referenceArea(() =>
          intersection(
            [ring],
            [
              [
                [x0, y0],
                [x0 + w, y0],
                [x0 + w, y0 + h],
                [x0, y0 + h],
              ],
            ],
          ),
        );
        expect(ours).toBeCloseTo(reference, 6);
      }),
      { numRuns: 400 },
    );
  });

  it('cuts any simple star-shaped ring to a convex triangle with the same area polygon-clipping finds', () => {
    const triangle = fc
      .tuple(coord, coord, coord, coord, coord, coord)
      .map(([a, b, c, d, e, f]): Ring => {
        const t: Ring = [
          [a, b],
          [c, d],
          [e, f],
        ];
        return signedRingArea(t) < 0 ? [t[0], t[2], t[1]] : t;
      })
      // The clip polygon must be a real (counter-clockwise, non-degenerate) convex polygon.
      .filter((t) => signedRingArea(t) > 1e-6);
    fc.assert(
      fc.property(starRing, triangle, (ring, tri) => {
        const ours = Math.abs(signedRingArea(clipRingToConvex(ring, tri)));
        const reference = referenceArea(() => intersection([ring], [tri]));
        expect(ours).toBeCloseTo(reference, 6);
      }),
      { numRuns: 400 },
    );
  });

  it('keeps every point of a 3-D polygon inside the slab and drops none that were inside', () => {
    const p3 = fc.tuple(coord, coord, coord);
    fc.assert(
      fc.property(fc.array(p3, { minLength: 3, maxLength: 12 }), coord, fc.double({ min: 0, max: 60, noNaN: true }), (poly, lo, span) => {
        const z = (p: readonly number[]) => p[2];
        const out = clipToSlab(poly, z, lo, lo + span);
        for (const p of out) {
          expect(p[2]).toBeGreaterThanOrEqual(lo - 1e-9 * (1 + Math.abs(lo)));
          expect(p[2]).toBeLessThanOrEqual(lo + span + 1e-9 * (1 + Math.abs(lo + span)));
        }
        for (const p of poly) if (p[2] >= lo && p[2] <= lo + span) expect(out).toContainEqual(p);
      }),
    );
  });
});

describe('bounds of points', () => {
  it('hold every point and touch the extreme ones, for any set of points', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(coord, coord), { minLength: 1, maxLength: 50 }), (pts) => {
        const b = boundsOfPoints(pts)!;
        for (const [x, y] of pts) expect(x >= b.minX && x <= b.maxX && y >= b.minY && y <= b.maxY).toBe(true);
        expect(
          pts.some(([x]) => x === b.minX) &&
            pts.some(([x]) => x === b.maxX) &&
            pts.some(([, y]) => y === b.minY) &&
            pts.some(([, y]) => y === b.maxY),
        ).toBe(true);
      }),
    );
  });

  it('are null for no points', () => {
    expect(boundsOfPoints([])).toBeNull();
  });

  const anyCoord = fc.double({ noNaN: true, noDefaultInfinity: true });
  const box = fc
    .tuple(anyCoord, anyCoord, anyCoord, anyCoord)
    .map(([a, b, c, d]): Bounds => ({ minX: Math.min(a, b), maxX: Math.max(a, b), minY: Math.min(c, d), maxY: Math.max(c, d) }));
  const inside = (p: Pair, b: Bounds) => p[0] >= b.minX && p[0] <= b.maxX && p[1] >= b.minY && p[1] <= b.maxY;

  it('of a segment hold both ends whichever way round the segment runs', () => {
    fc.assert(
      fc.property(fc.tuple(anyCoord, anyCoord), fc.tuple(anyCoord, anyCoord), (a, b) => {
        expect(segmentBounds(a, b)).toEqual(segmentBounds(b, a));
        expect(inside(a, segmentBounds(a, b)) && inside(b, segmentBounds(a, b))).toBe(true);
      }),
    );
  });

  it('of two boxes meet exactly when some point lies in both (corners and edges touching count)', () => {
    fc.assert(
      fc.property(box, box, fc.array(fc.tuple(anyCoord, anyCoord), { maxLength: 20 }), (a, b, probes) => {
        expect(boxesMeet(a, b)).toBe(boxesMeet(b, a));
        // A point in both proves they meet; when they meet, the corner of the overlap nearest the origin is such a point.
        for (const p of probes) if (inside(p, a) && inside(p, b)) expect(boxesMeet(a, b)).toBe(true);
        const corner: Pair = [Math.max(a.minX, b.minX), Math.max(a.minY, b.minY)];
        expect(boxesMeet(a, b)).toBe(inside(corner, a) && inside(corner, b));
      }),
    );
    expect(boxesMeet({ minX: 0, minY: 0, maxX: 1, maxY: 1 }, { minX: 1, minY: 1, maxX: 2, maxY: 2 })).toBe(true);
    expect(boxesMeet({ minX: 0, minY: 0, maxX: 1, maxY: 1 }, { minX: 1.000001, minY: 0, maxX: 2, maxY: 1 })).toBe(false);
  });

  it('read from a packed coordinate array give back each point, whatever the stride', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(coord, coord), { maxLength: 30 }), fc.integer({ min: 2, max: 5 }), (pts, stride) => {
        const packed = new Float64Array(pts.length * stride);
        pts.forEach(([x, y], j) => {
          packed[stride * j] = x;
          packed[stride * j + 1] = y;
          for (let k = 2; k < stride; k++) packed[stride * j + k] = Number.NaN;
        });
        expect([...packedPoints(packed, pts.length, stride)]).toEqual(pts);
      }),
    );
  });
});

describe('the scale bar length', () => {
  const perM = fc.double({ min: 0.01, max: 10_000, noNaN: true });
  const units = fc.constantFrom('metric' as const, 'imperial' as const);
  const unitM = (u: 'metric' | 'imperial') => (u === 'metric' ? 1 : 0.3048);

  it('is the shortest round length at least the wanted length, when one is long enough', () => {
    fc.assert(
      fc.property(units, perM, fc.double({ min: 1, max: 500, noNaN: true }), (u, s, atLeast) => {
        const bar = chooseScaleBar(u, s, { atLeast });
        const count = bar.lengthM / unitM(u);
        const i = SCALE_BAR_COUNTS.findIndex((n) => Math.abs(n - count) < 1e-9);
        expect(i).toBeGreaterThanOrEqual(0);
        if (bar.lengthM * s >= atLeast && i > 0) expect(SCALE_BAR_COUNTS[i - 1] * unitM(u) * s).toBeLessThan(atLeast);
        if (bar.lengthM * s < atLeast) expect(i).toBe(SCALE_BAR_COUNTS.length - 1);
      }),
    );
  });

  it('is the longest round length that fits, when one fits', () => {
    fc.assert(
      fc.property(units, perM, fc.double({ min: 1, max: 500, noNaN: true }), (u, s, atMost) => {
        const bar = chooseScaleBar(u, s, { atMost });
        const i = SCALE_BAR_COUNTS.findIndex((n) => Math.abs(n * unitM(u) - bar.lengthM) < 1e-9);
        if (bar.lengthM * s <= atMost && i < SCALE_BAR_COUNTS.length - 1)
          expect(SCALE_BAR_COUNTS[i + 1] * unitM(u) * s).toBeGreaterThan(atMost);
        if (bar.lengthM * s > atMost) expect(i).toBe(0);
      }),
    );
  });
});
