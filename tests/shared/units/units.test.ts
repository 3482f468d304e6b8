/**
 * Unit conversion at the edges. Reference factors are exact by definition (international yard and
 * pound agreement, 1959): 1 in = 25.4 mm, 1 ft = 0.3048 m. Expected values below are computed
 * from those definitions, not from the code under test.
 */
import * as fc from 'fast-check';
import {
  formatAngle,
  formatArea,
  formatLength,
  formatMoney,
  formatPercent,
  parseAngle,
  parseMoney,
  minorToText,
  parseLength,
  resolveUnits,
  type LengthKind,
  type UnitSystem,
} from '../../../shared/units';

const INCH_MM = 25.4;
const FOOT_M = 0.3048;

function metresOf(text: string, units: UnitSystem, kind: LengthKind = 'distance'): number {
  const r = parseLength(text, units, kind);
  if (!r.ok) throw new Error(`expected "${text}" to parse, got: ${r.message}`);
  return r.m;
}

describe('parseLength', () => {
  it.each([
    ['24 in', (24 * INCH_MM) / 1000],
    ['24"', (24 * INCH_MM) / 1000],
    ['24 inches', (24 * INCH_MM) / 1000],
    ['2 ft 3 in', 2 * FOOT_M + (3 * INCH_MM) / 1000],
    ['2\'3"', 2 * FOOT_M + (3 * INCH_MM) / 1000],
    ["2' 3", 2 * FOOT_M + (3 * INCH_MM) / 1000],
    ['2′ 3″', 2 * FOOT_M + (3 * INCH_MM) / 1000],
    ['23 1/2 in', (23.5 * INCH_MM) / 1000],
    ['10 ft', 10 * FOOT_M],
    ['600 mm', 0.6],
    ['60 cm', 0.6],
    ['3.2 m', 3.2],
    ['3,2 m', 3.2],
    ['1 m 20 cm', 1.2],
    ['−1.5 m', -1.5],
  ])('reads "%s" as %f m whatever the current system', (text, expected) => {
    expect(metresOf(text, 'metric')).toBeCloseTo(expected, 12);
    expect(metresOf(text, 'imperial')).toBeCloseTo(expected, 12);
  });

  it.each<[UnitSystem, LengthKind, number]>([
    ['metric', 'distance', 3],
    ['metric', 'size', 0.003],
    ['imperial', 'distance', 3 * FOOT_M],
    ['imperial', 'size', (3 * INCH_MM) / 1000],
  ])('reads a bare "3" in %s for a %s in that system’s default unit', (units, kind, expected) => {
    expect(metresOf('3', units, kind)).toBeCloseTo(expected, 12);
  });

  it.each(['', 'abc', '3 apples', '2 ft 3 mm', '3 in 2 ft', '1 2 3', '1,200 mm', '3 4', '1/0 in'])(
    'refuses "%s" with a sentence',
    (text) => {
      const r = parseLength(text, 'metric');
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.message).toMatch(/^[A-Z"].*[.]$/);
    },
  );
});

describe('formatLength', () => {
  it.each<[number, UnitSystem, LengthKind, string]>([
    [3.2, 'metric', 'distance', '3.20 m'],
    [0.6, 'metric', 'size', '600 mm'],
    [10 * FOOT_M + (6 * INCH_MM) / 1000, 'imperial', 'distance', '10 ft 6 in'],
    [(24 * INCH_MM) / 1000, 'imperial', 'size', '24 in'],
    [10 * FOOT_M, 'imperial', 'distance', '10 ft'],
    [(6 * INCH_MM) / 1000, 'imperial', 'distance', '6 in'],
    // 11.8 in rounds to a whole foot, never "0 ft 12 in".
    [(11.8 * INCH_MM) / 1000, 'imperial', 'distance', '1 ft'],
    [0.6, 'imperial', 'size', '23.6 in'],
    [-1.5, 'metric', 'distance', '−1.50 m'],
  ])('writes %f m in %s as a %s "%s"', (m, units, kind, text) => {
    expect(formatLength(m, units, { kind })).toBe(text);
  });

  it('honours a requested precision', () => {
    expect(formatLength(3.14159, 'metric', { precision: 3 })).toBe('3.142 m');
  });
});

describe('format then parse gives the length back within the displayed rounding', () => {
  const cases: [UnitSystem, LengthKind, number][] = [
    ['metric', 'distance', 0.005],
    ['metric', 'size', 0.0005],
    ['imperial', 'distance', (0.5 * INCH_MM) / 1000],
    ['imperial', 'size', (0.05 * INCH_MM) / 1000],
  ];
  it.each(cases)('%s %s', (units, kind, tolerance) => {
    fc.assert(
      fc.property(fc.double({ min: -500, max: 500, noNaN: true }), (m) => {
        const text = formatLength(m, units, { kind });
        const back = metresOf(text, units, kind);
        return Math.abs(back - m) <= tolerance + 1e-9;
      }),
    );
  });

  it('an imperial distance parses back exactly when it is whole inches', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 5000 }), (inches) => {
        const m = (inches * INCH_MM) / 1000;
        return Math.abs(metresOf(formatLength(m, 'imperial'), 'imperial') - m) < 1e-12;
      }),
    );
  });
});

describe('angles', () => {
  it('writes radians as whole degrees', () => {
    expect(formatAngle((18 * Math.PI) / 180)).toBe('18°');
    expect(formatAngle((-12.5 * Math.PI) / 180, { precision: 1 })).toBe('−12.5°');
  });

  it.each([
    ['18', 18],
    ['18°', 18],
    ['18 deg', 18],
    ['-5', -5],
    ['12,5', 12.5],
  ])('reads "%s" as %f degrees', (text, deg) => {
    const r = parseAngle(text);
    expect(r.ok && r.rad).toBeCloseTo((deg * Math.PI) / 180, 12);
  });

  it('reads radians only when told', () => {
    const r = parseAngle('0.5 rad');
    expect(r.ok && r.rad).toBeCloseTo(0.5, 12);
  });

  it('refuses text that is not an angle', () => {
    expect(parseAngle('north').ok).toBe(false);
    expect(parseAngle('').ok).toBe(false);
  });

  it('degrees survive format then parse', () => {
    fc.assert(
      fc.property(fc.integer({ min: -360, max: 360 }), (deg) => {
        const r = parseAngle(formatAngle((deg * Math.PI) / 180));
        return r.ok && Math.abs(r.rad - (deg * Math.PI) / 180) < 1e-12;
      }),
    );
  });
});

describe('areas, money and percentages', () => {
  it('writes an area in square metres or square feet (1 ft² = 0.3048² m²)', () => {
    expect(formatArea(12.5, 'metric')).toBe('12.5 m²');
    expect(formatArea(100 * FOOT_M * FOOT_M, 'imperial')).toBe('100 ft²');
  });

  it('writes minor units with the currency’s own number of decimals', () => {
    expect(formatMoney(12345, 'EUR')).toBe('€123.45');
    expect(formatMoney(12345, 'USD')).toBe('$123.45');
    // The yen has no minor unit (ISO 4217), so 500 minor units are ¥500.
    expect(formatMoney(500, 'JPY')).toBe('¥500');
  });

  it('writes a fraction as a percentage', () => {
    expect(formatPercent(0.734)).toBe('73 %');
  });

  it("lets the project's units override the person's", () => {
    expect(resolveUnits('imperial', 'metric')).toBe('imperial');
    expect(resolveUnits(null, 'imperial')).toBe('imperial');
    expect(resolveUnits(undefined, undefined)).toBe('metric');
  });
});

describe('prices typed by a person', () => {
  it.each([
    ['129.00', 'EUR', 12900],
    ['129,5', 'EUR', 12950],
    ['1,299.99', 'USD', 129999],
    ['€ 99', 'EUR', 9900],
    ['500', 'JPY', 500],
  ])('reads "%s" %s as %i minor units', (text, currency, minor) => {
    const r = parseMoney(text, currency);
    expect(r.ok && r.minor).toBe(minor);
  });

  it('refuses cents on a currency that has none, and text that is not a price', () => {
    expect(parseMoney('5.50', 'JPY').ok).toBe(false);
    expect(parseMoney('cheap', 'EUR').ok).toBe(false);
    expect(parseMoney('1.234', 'EUR').ok).toBe(false);
  });

  it('writes minor units back as the text the field starts from', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), (minor) => {
        const r = parseMoney(minorToText(minor, 'EUR'), 'EUR');
        return r.ok && r.minor === minor;
      }),
    );
  });
});
