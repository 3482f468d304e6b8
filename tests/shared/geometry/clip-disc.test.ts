import { clipOrientedCurvesToDisc, type OrientedCurve } from '../../../shared/geometry/clip-disc';
import { multiPolygonArea, pointInMultiPolygon } from '../../../shared/geometry/polygon';

/** A closed square curve of half-side h about (x, y), counter-clockwise or clockwise. */
function square(x: number, y: number, h: number, ccw: boolean): OrientedCurve {
  const xs = [x - h, x + h, x + h, x - h];
  const ys = [y - h, y - h, y + h, y + h];
  if (!ccw) {
    xs.reverse();
    ys.reverse();
  }
  return { xs, ys, closed: true };
}

const step = 0.001; // chord angle: the disc's polygon is within r(1 − cos(step/2)) ≈ 1.3e-7 r of the circle
const never = (): boolean => {
  throw new Error('the disc test must not be asked when a curve lies inside the disc');
};

describe('clipping oriented boundary curves to a disc', () => {
  it('keeps a counter-clockwise ring inside the disc as an island (area of the square, 4 m²)', () => {
    const out = clipOrientedCurvesToDisc([square(0, 0, 1, true)], 0, 0, 5, step, never);
    expect(multiPolygonArea(out)).toBeCloseTo(4, 9);
    expect(pointInMultiPolygon(out, [3, 0])).toBe(false);
  });

  it('turns a clockwise ring inside the disc into a hole: the disc minus the square (25π − 4 m²)', () => {
    const out = clipOrientedCurvesToDisc([square(0, 0, 1, false)], 0, 0, 5, step, never);
    expect(multiPolygonArea(out)).toBeCloseTo(25 * Math.PI - 4, 4);
    expect(pointInMultiPolygon(out, [0, 0])).toBe(false);
    expect(pointInMultiPolygon(out, [3, 0])).toBe(true);
  });

  it('asks whether the disc is inside when no curve reaches it, and follows the answer', () => {
    const far = [square(100, 0, 1, true)];
    expect(clipOrientedCurvesToDisc(far, 0, 0, 5, step, () => false)).toEqual([]);
    expect(multiPolygonArea(clipOrientedCurvesToDisc(far, 0, 0, 5, step, () => true))).toBeCloseTo(25 * Math.PI, 4);
    expect(multiPolygonArea(clipOrientedCurvesToDisc([], 0, 0, 5, step, () => true))).toBeCloseTo(25 * Math.PI, 4);
  });

  it('closes an open curve crossing the disc along the circle on the region’s side (a half disc, 12.5π m²)', () => {
    // Straight down the y axis from far above to far below: the region on its left is x > 0.
    const line: OrientedCurve = { xs: [0, 0], ys: [50, -50], closed: false };
    const out = clipOrientedCurvesToDisc([line], 0, 0, 5, step, never);
    expect(multiPolygonArea(out)).toBeCloseTo(12.5 * Math.PI, 4);
    expect(pointInMultiPolygon(out, [2, 0])).toBe(true);
    expect(pointInMultiPolygon(out, [-2, 0])).toBe(false);
  });

  it('joins pieces of two open curves into one ring (a band between two chords, x in 0…3)', () => {
    const down: OrientedCurve = { xs: [0, 0], ys: [50, -50], closed: false };
    const up: OrientedCurve = { xs: [3, 3], ys: [-50, 50], closed: false };
    const out = clipOrientedCurvesToDisc([down, up], 0, 0, 5, step, never);
    // Area of the disc between x = 0 and x = 3: ∫₀³ 2√(25 − x²) dx = 3·4 + 25·asin(3/5).
    expect(multiPolygonArea(out)).toBeCloseTo(12 + 25 * Math.asin(0.6), 4);
    expect(out).toHaveLength(1);
  });
});
