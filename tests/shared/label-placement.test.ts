/**
 * Side-view labels (shared/label-placement.ts): beside their symbol, clear of the sightlines. The
 * drawings below are small enough to check by eye; coordinates are page points, y down.
 */
import * as fc from 'fast-check';
import { LABEL_RINGS, boxMeetsSegment, placeLabel, type LabelBox, type Segment } from '../../shared/label-placement';

const bounds: LabelBox = { x: 0, y: 0, w: 400, h: 200 };
const size = { w: 60, h: 10 };

describe('placeLabel', () => {
  it('puts a label above and to the right of its symbol when nothing is there', () => {
    expect(placeLabel([100, 100], size, { segments: [], boxes: [] }, bounds)).toEqual({ x: 104, y: 86, w: 60, h: 10 });
  });

  it('moves off a sightline that runs up and to the right from the symbol', () => {
    // The eye at (100, 100) looks up to a mirror at (300, 40): the line crosses the above-right spot.
    const sightline: Segment = [
      [100, 100],
      [300, 40],
    ];
    const box = placeLabel([100, 100], size, { segments: [sightline], boxes: [] }, bounds);
    expect(boxMeetsSegment(box, sightline)).toBe(false);
    // Above left: still next to the eye.
    expect(box).toEqual({ x: 36, y: 86, w: 60, h: 10 });
  });

  it('stays inside the drawing even when the first spot would leave it', () => {
    const box = placeLabel([395, 5], size, { segments: [], boxes: [] }, bounds);
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.w).toBeLessThanOrEqual(400);
    expect(box.y).toBeGreaterThanOrEqual(0);
  });

  it('keeps off a label already placed', () => {
    const taken: LabelBox = { x: 100, y: 80, w: 80, h: 14 };
    const box = placeLabel([100, 100], size, { segments: [], boxes: [taken] }, bounds);
    expect(box.x + box.w <= taken.x || box.x >= taken.x + taken.w || box.y + box.h <= taken.y || box.y >= taken.y + taken.h).toBe(true);
  });
});

describe('placeLabel over any drawing', () => {
  const pt = fc.tuple(fc.double({ min: 0, max: 400, noNaN: true }), fc.double({ min: 0, max: 200, noNaN: true }));
  const seg = fc.tuple(pt, pt) as fc.Arbitrary<Segment>;

  it('always leaves the label next to its symbol: within the outer ring of spots', () => {
    fc.assert(
      fc.property(pt, fc.array(seg, { maxLength: 12 }), (anchor, segments) => {
        const b = placeLabel(anchor, size, { segments, boxes: [] }, bounds);
        // Nearest point of the box to the anchor.
        const dx = Math.max(b.x - anchor[0], 0, anchor[0] - (b.x + b.w));
        const dy = Math.max(b.y - anchor[1], 0, anchor[1] - (b.y + b.h));
        expect(Math.hypot(dx, dy)).toBeLessThanOrEqual(Math.SQRT2 * (4 + (LABEL_RINGS - 1) * size.h) + 1e-9);
      }),
    );
  });

  it('always clears a single line, wherever it runs: no straight line meets all eight spots of the first ring', () => {
    fc.assert(
      fc.property(pt, seg, (anchor, line) => {
        const b = placeLabel(anchor, size, { segments: [line], boxes: [] }, { x: -1e4, y: -1e4, w: 2e4, h: 2e4 });
        expect(boxMeetsSegment(b, line)).toBe(false);
      }),
    );
  });
});
