/**
 * The plan underlay's edits: calibration reproduces the typed distance and keeps the first point,
 * turning keeps its pivot, "square to the grid" lays the calibrated line along an axis, the SVG
 * matrix puts every pixel where the shared placement says, and nothing drawn in metres moves.
 */
import * as fc from 'fast-check';
import {
  calibrateUnderlay,
  newUnderlay,
  setUnderlay,
  shiftUnderlay,
  squareToGrid,
  turnUnderlayTo,
  underlayMatrix,
} from '@/components/plan/underlay-edits';
import { calibrationFrom } from '@/components/plan/use-underlay-calibration';
import { isUncalibrated } from '@/components/plan/underlay-panel';
import { planToUnderlay, underlayToPlan } from '@/shared/geometry/underlay';
import { FILE_LIMITS, underlay as underlaySchema, type Underlay } from '@/shared/schemas/files';
import type { Scene } from '@/shared/schemas';
import { toScreen } from '@/components/plan/plan-view';

type Pt = [number, number];
const side = FILE_LIMITS.storedSidePx;
/** A pixel anywhere on a stored plan image (its longest side is at most storedSidePx). */
const pixel = fc.tuple(fc.double({ min: 0, max: side, noNaN: true }), fc.double({ min: 0, max: side, noNaN: true }));
/** Any distance the schema accepts: more than zero, at most 2 km. */
const distance = fc.double({ min: 0.001, max: 2000, noNaN: true });
/** Any underlay the schema accepts over a stored image. */
const anyUnderlay: fc.Arbitrary<Underlay> = fc
  .record({
    a: pixel,
    b: pixel,
    d: distance,
    origin: fc.tuple(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true })),
    rot: fc.double({ min: -2 * Math.PI, max: 2 * Math.PI, noNaN: true }),
    opacity: fc.double({ min: 0.1, max: 1, noNaN: true }),
  })
  .filter(({ a, b }) => Math.hypot(b[0] - a[0], b[1] - a[1]) >= 4)
  .map(({ a, b, d, origin, rot, opacity }) => ({
    fileId: 'plan-1',
    calibration: { aPx: a as Pt, bPx: b as Pt, distanceM: d },
    originM: origin as Pt,
    rotationRad: rot,
    opacity,
  }));
const twoPoints = fc.tuple(pixel, pixel).filter(([a, b]) => Math.hypot(b[0] - a[0], b[1] - a[1]) >= 4);

const dist = (p: readonly number[], q: readonly number[]) => Math.hypot(q[0] - p[0], q[1] - p[1]);
/** Relative closeness for values that may be large (plan metres far from the origin). */
const close = (a: number, b: number, rel = 1e-9, abs = 1e-6) => Math.abs(a - b) <= abs + rel * Math.max(Math.abs(a), Math.abs(b));

describe('calibrating the plan underlay', () => {
  it('makes the two tapped pixels lie the typed distance apart on the plan, for any underlay, points and distance', () => {
    fc.assert(
      fc.property(anyUnderlay, twoPoints, distance, (u, [a, b], d) => {
        const next = calibrateUnderlay(u, a, b, d);
        const m = dist(underlayToPlan(next, a), underlayToPlan(next, b));
        expect(close(m, d, 1e-9, 1e-9)).toBe(true);
      }),
    );
  });

  it('keeps the first tapped point where it was on the plan and keeps the turn', () => {
    fc.assert(
      fc.property(anyUnderlay, twoPoints, distance, (u, [a, b], d) => {
        const before = underlayToPlan(u, a);
        const next = calibrateUnderlay(u, a, b, d);
        const after = underlayToPlan(next, a);
        expect(close(after[0], before[0], 1e-9, 1e-6) && close(after[1], before[1], 1e-9, 1e-6)).toBe(true);
        expect(next.rotationRad).toBe(u.rotationRad);
      }),
    );
  });

  it('reads "12 ft 6 in" as 3.81 m between the points (1 ft = 0.3048 m exactly, docs/sources.md)', () => {
    const u = newUnderlay({ id: 'plan-1', widthPx: 1000, heightPx: 600 });
    const outcome = calibrationFrom(
      u,
      [
        [100, 100],
        [600, 100],
      ],
      '12 ft 6 in',
      'metric',
    );
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    expect(dist(underlayToPlan(outcome.underlay, [100, 100]), underlayToPlan(outcome.underlay, [600, 100]))).toBeCloseTo(3.81, 9);
  });

  it('reads "3.8 m" typed by someone working in feet and inches', () => {
    const u = newUnderlay({ id: 'plan-1', widthPx: 1000, heightPx: 600 });
    const outcome = calibrationFrom(
      u,
      [
        [0, 0],
        [0, 380],
      ],
      '3.8 m',
      'imperial',
    );
    expect(outcome.ok && outcome.underlay.calibration.distanceM).toBe(3.8);
  });

  it('says why it cannot calibrate: one point, points too close, no distance, a distance over 2 km', () => {
    const u = newUnderlay({ id: 'plan-1', widthPx: 1000, heightPx: 600 });
    const said = (pts: Pt[], text: string) => {
      const o = calibrationFrom(u, pts, text, 'metric');
      return o.ok ? null : o.message;
    };
    expect(said([[5, 5]], '3 m')).toMatch(/Tap two points/);
    expect(
      said(
        [
          [5, 5],
          [6, 7],
        ],
        '3 m',
      ),
    ).toMatch(/too close/);
    expect(
      said(
        [
          [5, 5],
          [500, 5],
        ],
        '',
      ),
    ).toMatch(/Enter a length/);
    expect(
      said(
        [
          [5, 5],
          [500, 5],
        ],
        '3 km',
      ),
    ).not.toBeNull();
    expect(
      said(
        [
          [5, 5],
          [500, 5],
        ],
        '2500 m',
      ),
    ).toMatch(/2 km/);
  });

  it('gives a calibrated underlay the schema accepts, or a sentence, never a number that is not finite', () => {
    fc.assert(
      fc.property(anyUnderlay, twoPoints, distance, (u, [a, b], d) => {
        const next = calibrateUnderlay(u, a, b, d);
        const nums = [...next.originM, next.rotationRad, next.calibration.distanceM, ...next.calibration.aPx, ...next.calibration.bPx];
        expect(nums.every(Number.isFinite)).toBe(true);
        const parsed = underlaySchema.safeParse(next);
        if (!parsed.success) expect(parsed.error.issues[0].message.length).toBeGreaterThan(0);
      }),
    );
  });
});

describe('placing the underlay on the grid', () => {
  const pivot = fc.tuple(fc.double({ min: -500, max: 500, noNaN: true }), fc.double({ min: -500, max: 500, noNaN: true }));

  it('turns about the pivot: the pivot stays, the scale stays, the turn stays within the schema', () => {
    fc.assert(
      fc.property(anyUnderlay, fc.double({ min: -20, max: 20, noNaN: true }), pivot, (u, rot, p) => {
        const next = turnUnderlayTo(u, rot, p);
        expect(Math.abs(next.rotationRad)).toBeLessThanOrEqual(Math.PI);
        const { aPx, bPx, distanceM } = next.calibration;
        expect(close(dist(underlayToPlan(next, aPx), underlayToPlan(next, bPx)), distanceM, 1e-9, 1e-9)).toBe(true);
        // The pixel under the pivot before the turn is still under it.
        const under = underlayToPlan(next, planToUnderlay(u, p));
        expect(close(under[0], p[0], 1e-9, 1e-6) && close(under[1], p[1], 1e-9, 1e-6)).toBe(true);
      }),
    );
  });

  it('lays the calibrated line along the nearest grid axis and leaves its first point where it was', () => {
    fc.assert(
      fc.property(anyUnderlay, (u) => {
        const next = squareToGrid(u);
        const a0 = underlayToPlan(u, u.calibration.aPx);
        const a = underlayToPlan(next, next.calibration.aPx);
        const b = underlayToPlan(next, next.calibration.bPx);
        expect(close(a[0], a0[0], 1e-9, 1e-6) && close(a[1], a0[1], 1e-9, 1e-6)).toBe(true);
        const off = Math.min(Math.abs(b[0] - a[0]), Math.abs(b[1] - a[1])) / dist(a, b);
        expect(off).toBeLessThan(1e-9);
      }),
    );
  });

  it('moves by exactly the nudge and nothing else', () => {
    const u = newUnderlay({ id: 'plan-1', widthPx: 800, heightPx: 400 });
    const moved = shiftUnderlay(u, 0.1, -0.1);
    const p = underlayToPlan(u, [123, 45]);
    const q = underlayToPlan(moved, [123, 45]);
    expect(q[0] - p[0]).toBeCloseTo(0.1, 12);
    expect(q[1] - p[1]).toBeCloseTo(-0.1, 12);
    expect(moved.calibration).toEqual(u.calibration);
  });
});

describe('drawing the underlay', () => {
  it('maps every pixel to the screen point the shared placement gives, for any underlay and view', () => {
    const view = fc.record({
      scale: fc.double({ min: 2, max: 400, noNaN: true }),
      offsetX: fc.double({ min: -5000, max: 5000, noNaN: true }),
      offsetY: fc.double({ min: -5000, max: 5000, noNaN: true }),
    });
    fc.assert(
      fc.property(anyUnderlay, view, pixel, (u, v, p) => {
        const [a, b, c, d, e, f] = underlayMatrix(u, v);
        const want = toScreen(v, underlayToPlan(u, p));
        const got = [a * p[0] + c * p[1] + e, b * p[0] + d * p[1] + f];
        expect(close(got[0], want[0], 1e-7, 1e-4) && close(got[1], want[1], 1e-7, 1e-4)).toBe(true);
      }),
    );
  });

  it('starts a new plan as not calibrated, square to the grid, above and right of the origin, as the schema accepts', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: side }), fc.integer({ min: 1, max: side }), (w, h) => {
        const u = newUnderlay({ id: 'p', widthPx: w, heightPx: h });
        if (w >= 4) expect(underlaySchema.safeParse(u).success).toBe(true);
        expect(isUncalibrated(u, { widthPx: w })).toBe(true);
        const bottomLeft = underlayToPlan(u, [0, h]);
        expect(bottomLeft[0]).toBeCloseTo(0, 6);
        expect(bottomLeft[1]).toBeCloseTo(0, 5);
      }),
    );
  });
});

describe('the scene around the underlay', () => {
  const scene: Scene = {
    walls: [{ id: 'w1', aM: [0, 0], bM: [5, 0], heightM: 3, kind: 'wall' }],
    zones: [],
    viewers: [],
  } as unknown as Scene;

  it('changes only the underlay: walls, zones and viewers are the same objects before and after', () => {
    const u = newUnderlay({ id: 'plan-1', widthPx: 1000, heightPx: 500 });
    const withIt = setUnderlay(scene, u);
    const recalibrated = setUnderlay(withIt, calibrateUnderlay(u, [0, 0], [100, 0], 2));
    expect(recalibrated.walls).toBe(scene.walls);
    expect(recalibrated.zones).toBe(scene.zones);
    expect(recalibrated.viewers).toBe(scene.viewers);
    expect(recalibrated.underlay?.calibration.distanceM).toBe(2);
    const removed = setUnderlay(recalibrated, undefined);
    expect('underlay' in removed).toBe(false);
    expect(removed.walls).toBe(scene.walls);
  });
});
