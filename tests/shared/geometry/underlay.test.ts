import * as fc from 'fast-check';
import { metresPerPixel, planToUnderlay, underlayToPlan } from '../../../shared/geometry/underlay';
import { underlay, type Underlay } from '../../../shared/schemas/files';

const base = (over: Partial<Underlay> = {}): Underlay =>
  underlay.parse({ fileId: 'f1', calibration: { aPx: [100, 200], bPx: [400, 600], distanceM: 10 }, ...over });

describe('plan underlay placement', () => {
  it('takes the scale from two points 500 px apart and a 10 m distance as 0.02 m per pixel (3-4-5 triangle)', () => {
    expect(metresPerPixel(base())).toBeCloseTo(0.02, 12);
  });

  it('puts the calibration points the stated distance apart on the plan, however it is turned and shifted', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -6, max: 6, noNaN: true }),
        fc.tuple(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true })),
        fc.double({ min: 0.01, max: 2000, noNaN: true }),
        (rotationRad, originM, distanceM) => {
          const u = base({ rotationRad, originM, calibration: { aPx: [12, 30], bPx: [812, 630], distanceM } });
          const a = underlayToPlan(u, u.calibration.aPx);
          const b = underlayToPlan(u, u.calibration.bPx);
          expect(Math.hypot(b[0] - a[0], b[1] - a[1])).toBeCloseTo(distanceM, 6);
        },
      ),
    );
  });

  it('maps image down (pixel y growing) to plan south when not turned', () => {
    const u = base();
    const top = underlayToPlan(u, [0, 0]);
    const below = underlayToPlan(u, [0, 100]);
    expect(below[1]).toBeLessThan(top[1]);
    expect(below[0]).toBeCloseTo(top[0], 12);
  });

  it('turns the image anticlockwise: a quarter turn sends image right to plan north', () => {
    const u = base({ rotationRad: Math.PI / 2 });
    const p = underlayToPlan(u, [50, 0]);
    expect(p[0]).toBeCloseTo(0, 9);
    expect(p[1]).toBeCloseTo(1, 9);
  });

  it('inverts exactly: plan → image → plan returns the point', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -6, max: 6, noNaN: true }),
        fc.tuple(fc.double({ min: -500, max: 500, noNaN: true }), fc.double({ min: -500, max: 500, noNaN: true })),
        (rotationRad, m) => {
          const u = base({ rotationRad, originM: [3, -7] });
          const back = underlayToPlan(u, planToUnderlay(u, m));
          expect(back[0]).toBeCloseTo(m[0], 6);
          expect(back[1]).toBeCloseTo(m[1], 6);
        },
      ),
    );
  });

  it('refuses two calibration points on top of each other with a sentence', () => {
    const r = underlay.safeParse({ fileId: 'f', calibration: { aPx: [5, 5], bPx: [6, 5], distanceM: 1 } });
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues[0].message).toMatch(/two points/);
  });
});
