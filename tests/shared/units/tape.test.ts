/**
 * The tape-measure rule for ranges (shared/units/tape.ts): metric 5 cm below 10 m and 0.1 m from
 * there; imperial 1 in below 30 ft and 6 in from there; always rounded down. The rule is a product
 * choice (common practice for site measurement); expected texts below are worked by hand from the
 * exact definitions 1 in = 25.4 mm and 1 ft = 0.3048 m (international yard and pound agreement, 1959).
 */
import * as fc from 'fast-check';
import { formatRange, rangeStepM, roundRangeDown, type UnitSystem } from '../../../shared/units';

const FOOT_M = 0.3048;
const INCH_M = 0.0254;

describe('formatRange', () => {
  it.each([
    // The example: 48.08 m is not a tape reading; 48.0 m is.
    ['48.08 m', 'metric', '48.0 m', 48.08],
    ['4.37 m', 'metric', '4.35 m', 4.37],
    ['9.99 m', 'metric', '9.95 m', 9.99],
    ['10 m', 'metric', '10.0 m', 10],
    ['4 cm', 'metric', '0.00 m', 0.04],
    // 48.08 m = 157.74 ft: down to the half foot.
    ['48.08 m', 'imperial', '157 ft 6 in', 48.08],
    // 3 ft 7.9 in is shown as 3 ft 7 in, not rounded up to 3 ft 8 in.
    ['3 ft 7.9 in', 'imperial', '3 ft 7 in', 3 * FOOT_M + 7.9 * INCH_M],
    // 29 ft 11.5 in still counts in inches; 30 ft 5 in falls to 30 ft.
    ['29 ft 11.5 in', 'imperial', '29 ft 11 in', 29 * FOOT_M + 11.5 * INCH_M],
    ['30 ft 5 in', 'imperial', '30 ft', 30 * FOOT_M + 5 * INCH_M],
  ] as const)('prints %s in %s as "%s"', (_label, units, text, m) => {
    expect(formatRange(m, units)).toBe(text);
  });

  it('says "—" for a range that could not be computed instead of NaN', () => {
    expect(formatRange(Number.NaN, 'metric')).toBe('—');
    expect(formatRange(Number.POSITIVE_INFINITY, 'imperial')).toBe('—');
  });
});

describe('roundRangeDown over every finite range the engine can give', () => {
  const units = fc.constantFrom<UnitSystem>('metric', 'imperial');
  const range = fc.double({ min: 0, max: 1e6, noNaN: true });

  it('never prints more than the engine found, and never loses a whole step', () => {
    fc.assert(
      fc.property(range, units, (m, u) => {
        const r = roundRangeDown(m, u);
        // Floating-point room of a millionth of a step, the rule's own allowance.
        const step = rangeStepM(m, u);
        expect(r).toBeLessThanOrEqual(m + step * 1e-6);
        expect(m - r).toBeLessThan(step);
      }),
    );
  });

  it('lands on a whole number of steps', () => {
    fc.assert(
      fc.property(range, units, (m, u) => {
        const steps = roundRangeDown(m, u) / rangeStepM(m, u);
        expect(Math.abs(steps - Math.round(steps))).toBeLessThan(1e-6 * Math.max(1, steps));
      }),
    );
  });

  it('prints a text with no more digits than its step means', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e4, noNaN: true }), (m) => {
        const text = formatRange(m, 'metric');
        const decimals = /\.(\d+) m$/.exec(text)?.[1].length;
        expect(decimals).toBe(m < 10 ? 2 : 1);
      }),
    );
  });
});
