/**
 * Units at the edges. The engine, the API and the database work in SI (metres, radians); people
 * read and type metric or imperial. Everything that turns a number into text for a person, or
 * text typed by a person into a number, goes through here.
 *
 * Conversion factors are exact by definition (international yard and pound agreement, 1959):
 * 1 in = 25.4 mm, 1 ft = 12 in = 0.3048 m.
 */
import { M2_PER_FT2, M_PER_FT, M_PER_IN } from './factors';

export type UnitSystem = 'metric' | 'imperial';

/**
 * What a length is, which picks the unit people expect: `size` for mirror dimensions and radii
 * (mm / in), `distance` for mounting heights and distances across a site (m / ft + in).
 */
export type LengthKind = 'size' | 'distance';

export { M2_PER_FT2, M_PER_FT, M_PER_IN };
const IN_PER_FT = 12;

/** The project's own choice wins; otherwise the person's preference; metric if neither is known. */
export function resolveUnits(projectUnits: UnitSystem | null | undefined, userUnits: UnitSystem | null | undefined): UnitSystem {
  return projectUnits ?? userUnits ?? 'metric';
}

/** The unit a bare number is read in, and the one shown beside a field. */
export function defaultLengthUnit(units: UnitSystem, kind: LengthKind): 'm' | 'mm' | 'ft' | 'in' {
  if (units === 'metric') return kind === 'size' ? 'mm' : 'm';
  return kind === 'size' ? 'in' : 'ft';
}

// U+2212 is the typographic minus; people paste it from documents and from our own output.
const MINUS = '\u2212';

function fixed(n: number, digits: number): string {
  const s = n.toFixed(digits);
  // "-0.00" reads as a bug to a person.
  return Number(s) === 0 ? (0).toFixed(digits) : s.replace('-', MINUS);
}

/** Fixed digits with trailing zeros (and a bare point) dropped: 24 in, 23.6 in. */
function trimmed(n: number, digits: number): string {
  let s = fixed(n, digits);
  if (s.includes('.')) s = s.replace(/0+$/, '').replace(/\.$/, '');
  return s;
}

export interface LengthFormatOptions {
  /** Decimal places: metres default 2, millimetres 0, inches 0 within feet and up to 1 for sizes. */
  precision?: number;
  kind?: LengthKind;
}

/**
 * A length for a person: metric distance "3.20 m", metric size "600 mm", imperial distance
 * "10 ft 6 in" (to the inch), imperial size "24 in" / "23.6 in".
 */
export function formatLength(m: number, units: UnitSystem, opts: LengthFormatOptions = {}): string {
  if (!Number.isFinite(m)) return '—';
  const kind = opts.kind ?? 'distance';
  if (units === 'metric') {
    if (kind === 'size') return `${fixed(m * 1000, opts.precision ?? 0)} mm`;
    return `${fixed(m, opts.precision ?? 2)} m`;
  }
  const inches = m / M_PER_IN;
  if (kind === 'size') return `${trimmed(inches, opts.precision ?? 1)} in`;
  const digits = opts.precision ?? 0;
  const sign = inches < 0 ? MINUS : '';
  // Round the total first so 11.6 in never shows as "0 ft 12 in".
  const scale = 10 ** digits;
  const total = Math.round(Math.abs(inches) * scale) / scale;
  const ft = Math.floor((total + 1e-9) / IN_PER_FT);
  const rest = total - ft * IN_PER_FT;
  if (total === 0) return '0 in';
  if (ft === 0) return `${sign}${trimmed(rest, digits)} in`;
  if (rest < 0.5 / scale) return `${sign}${ft} ft`;
  return `${sign}${ft} ft ${trimmed(rest, digits)} in`;
}

export type ParseResult<K extends string> = ({ ok: true } & Record<K, number>) | { ok: false; message: string };
export type LengthParse = ParseResult<'m'>;
export type AngleParse = ParseResult<'rad'>;

type LengthUnit = 'mm' | 'cm' | 'm' | 'in' | 'ft';
const METRES_PER: Record<LengthUnit, number> = { mm: 0.001, cm: 0.01, m: 1, in: M_PER_IN, ft: M_PER_FT };
const UNIT_WORDS: Record<string, LengthUnit> = {
  mm: 'mm',
  millimetre: 'mm',
  millimetres: 'mm',
  millimeter: 'mm',
  millimeters: 'mm',
  cm: 'cm',
  centimetre: 'cm',
  centimetres: 'cm',
  centimeter: 'cm',
  centimeters: 'cm',
  m: 'm',
  metre: 'm',
  metres: 'm',
  meter: 'm',
  meters: 'm',
  in: 'in',
  inch: 'in',
  inches: 'in',
  '"': 'in',
  ft: 'ft',
  foot: 'ft',
  feet: 'ft',
  "'": 'ft',
};
const isImperial = (u: LengthUnit) => u === 'in' || u === 'ft';

/** Typographic quotes, primes, the minus sign and non-breaking spaces become plain ASCII. */
function normalise(text: string): string {
  return text
    .replace(/[\u2033\u201c\u201d]|''/g, '"')
    .replace(/[\u2032\u2018\u2019\u00b4`]/g, "'")
    .replace(/[\u2212\u2013]/g, '-')
    .replace(/[\u00a0\u202f]/g, ' ')
    .trim()
    .toLowerCase();
}

interface Quantity {
  value: number;
  unit: LengthUnit | null;
}

/** Reads "3", "3.2", ".5", "1/2" or "23 1/2" at the start of `s`; returns the value and the rest. */
function readNumber(s: string): { value: number; rest: string } | null {
  const mixed = /^(\d+)\s+(\d+)\s*\/\s*(\d+)/.exec(s);
  if (mixed) {
    const den = Number(mixed[3]);
    if (den === 0) return null;
    return { value: Number(mixed[1]) + Number(mixed[2]) / den, rest: s.slice(mixed[0].length) };
  }
  const frac = /^(\d+)\s*\/\s*(\d+)/.exec(s);
  if (frac) {
    const den = Number(frac[2]);
    if (den === 0) return null;
    return { value: Number(frac[1]) / den, rest: s.slice(frac[0].length) };
  }
  const dec = /^(\d+(?:\.\d*)?|\.\d+)/.exec(s);
  if (dec) return { value: Number(dec[1]), rest: s.slice(dec[0].length) };
  return null;
}

function readUnit(s: string): { unit: LengthUnit | null; rest: string } | null {
  const t = s.replace(/^\s+/, '');
  if (t.startsWith('"') || t.startsWith("'")) return { unit: UNIT_WORDS[t[0]], rest: t.slice(1) };
  const word = /^[a-z]+\.?/.exec(t);
  if (!word) return { unit: null, rest: t };
  const unit = UNIT_WORDS[word[0].replace(/\.$/, '')];
  return unit ? { unit, rest: t.slice(word[0].length) } : null;
}

const lengthExample = (units: UnitSystem) => (units === 'metric' ? 'like "3.2 m" or "600 mm"' : 'like "10 ft 6 in" or "24 in"');

/**
 * Reads a length typed by a person, in either system whatever the current one: "24 in", '24"',
 * "2 ft 3 in", "2'3\"", "23 1/2 in", "600 mm", "60 cm", "3.2 m", "3,2 m". A bare number is read in
 * the current system's unit for `kind` (metres or millimetres; feet or inches).
 */
export function parseLength(text: string, units: UnitSystem, kind: LengthKind = 'distance'): LengthParse {
  let s = normalise(text);
  if (s === '') return { ok: false, message: `Enter a length, ${lengthExample(units)}.` };
  // "1,200" could be one thousand two hundred or one point two: refuse to guess.
  if (/\d,\d{3}(?!\d)/.test(s)) {
    return { ok: false, message: 'A comma followed by three digits is ambiguous; write 1200 or 1.2 instead.' };
  }
  // A decimal comma ("3,2 m") is how most of the world writes it.
  s = s.replace(/(\d),(\d)/g, '$1.$2');
  let negative = false;
  if (s.startsWith('-')) {
    negative = true;
    s = s.slice(1).trim();
  } else if (s.startsWith('+')) s = s.slice(1).trim();

  const parts: Quantity[] = [];
  let rest = s;
  while (rest.length > 0) {
    const num = readNumber(rest);
    const unit = num ? readUnit(num.rest) : null;
    if (!num || !unit) return { ok: false, message: `"${text.trim()}" is not a length we can read; write it ${lengthExample(units)}.` };
    parts.push({ value: num.value, unit: unit.unit });
    rest = unit.rest.replace(/^[\s,]+/, '');
    if (parts.length > 2) break;
  }

  let metres: number;
  if (parts.length === 1) {
    const [p] = parts;
    metres = p.value * METRES_PER[p.unit ?? defaultLengthUnit(units, kind)];
  } else if (parts.length === 2) {
    const [a, b] = parts;
    const first = a.unit ?? (b.unit === 'in' ? 'ft' : null);
    // After feet, a bare number is inches (2' 3); after metres, a bare number means nothing certain.
    const second = b.unit ?? (first === 'ft' ? 'in' : null);
    if (!first || !second) return { ok: false, message: `Give each number in "${text.trim()}" a unit, ${lengthExample(units)}.` };
    if (isImperial(first) !== isImperial(second))
      return { ok: false, message: 'Use one system per value: metric (m, cm, mm) or imperial (ft, in), not both.' };
    if (METRES_PER[first] <= METRES_PER[second])
      return { ok: false, message: 'Write the larger unit first, like "2 ft 3 in" or "1 m 20 cm".' };
    metres = a.value * METRES_PER[first] + b.value * METRES_PER[second];
  } else {
    return { ok: false, message: `"${text.trim()}" has too many numbers; write one length, ${lengthExample(units)}.` };
  }
  if (!Number.isFinite(metres)) return { ok: false, message: 'That length is too large to be real.' };
  return { ok: true, m: negative ? -metres : metres };
}

const DEG = Math.PI / 180;

/** An angle in whole degrees by default: "18°"; negative values use the minus sign. */
export function formatAngle(rad: number, opts: { precision?: number } = {}): string {
  if (!Number.isFinite(rad)) return '—';
  return `${trimmed(rad / DEG, opts.precision ?? 0)}°`;
}

/** Degrees typed by a person: "18", "18°", "18 deg", "-5", "12.5 degrees"; radians only with "rad". */
export function parseAngle(text: string): AngleParse {
  let s = normalise(text).replace(/(\d),(\d)/g, '$1.$2');
  if (s === '') return { ok: false, message: 'Enter an angle in degrees, like "18".' };
  let sign = 1;
  if (s.startsWith('-')) {
    sign = -1;
    s = s.slice(1).trim();
  } else if (s.startsWith('+')) s = s.slice(1).trim();
  const m = /^(\d+(?:\.\d*)?|\.\d+)\s*(°|º|deg|degs|degree|degrees|rad|radians?)?$/.exec(s);
  if (!m) return { ok: false, message: `"${text.trim()}" is not an angle we can read; type degrees, like "18" or "18°".` };
  const value = Number(m[1]) * sign;
  const rad = m[2]?.startsWith('rad') ? value : value * DEG;
  return { ok: true, rad };
}

/** An area: "12.5 m²" or "135 ft²". */
export function formatArea(m2: number, units: UnitSystem, opts: { precision?: number } = {}): string {
  if (!Number.isFinite(m2)) return '—';
  if (units === 'metric') return `${fixed(m2, opts.precision ?? 1)} m²`;
  return `${fixed(m2 / M2_PER_FT2, opts.precision ?? 0)} ft²`;
}

/**
 * Money stored in the currency's minor unit (cents). Intl knows how many minor digits each
 * currency has (EUR 2, JPY 0), so the same integer prints right for any currency.
 */
export function formatMoney(minor: number, currency: string, locale = 'en'): string {
  let fmt: Intl.NumberFormat;
  try {
    fmt = new Intl.NumberFormat(locale, { style: 'currency', currency });
  } catch {
    // An unknown currency code must not blank a whole screen.
    return `${(minor / 100).toFixed(2)} ${currency}`;
  }
  const digits = fmt.resolvedOptions().maximumFractionDigits ?? 2;
  return fmt.format(minor / 10 ** digits);
}

/** A fraction as a whole percentage: 0.734 → "73 %". */
export function formatPercent(fraction: number, opts: { precision?: number } = {}): string {
  if (!Number.isFinite(fraction)) return '—';
  return `${fixed(fraction * 100, opts.precision ?? 0)} %`;
}

/** A pure number (magnification, ratio) with a fixed number of decimals. */
export function formatNumber(n: number, precision = 2): string {
  if (!Number.isFinite(n)) return '—';
  return fixed(n, precision);
}

/** How many minor-unit digits a currency has (EUR 2, JPY 0), from Intl; 2 when Intl does not know it. */
export function minorDigits(currency: string): number {
  try {
    return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
  } catch {
    return 2;
  }
}

/** A price typed in major units ("123.45", "123,45", "€ 99") into the currency's minor unit. */
export function parseMoney(text: string, currency: string): ParseResult<'minor'> {
  const s = normalise(text)
    .replace(/[^\d.,-]/g, '')
    .replace(/(\d),(\d{1,2})$/, '$1.$2')
    .replace(/,/g, '');
  if (s === '') return { ok: false, message: 'Enter a price, like 129.00.' };
  if (!/^\d+(\.\d+)?$/.test(s)) return { ok: false, message: `"${text.trim()}" is not a price we can read; write it like 129.00.` };
  const digits = minorDigits(currency);
  const [, frac = ''] = s.split('.');
  if (frac.length > digits)
    return {
      ok: false,
      message: digits === 0 ? `${currency} has no cents; enter a whole amount.` : `Enter at most ${digits} digits after the point.`,
    };
  return { ok: true, minor: Math.round(Number(s) * 10 ** digits) };
}

/** Minor units back into the plain major-unit text a price field shows: 12900 → "129.00". */
export function minorToText(minor: number, currency: string): string {
  const digits = minorDigits(currency);
  return (minor / 10 ** digits).toFixed(digits);
}

export { chooseScaleBar, SCALE_BAR_COUNTS, type ScaleBar } from './scale-bar';
export { formatRange, rangeStepM, roundRangeDown, METRIC_FINE_BELOW_M, IMPERIAL_FINE_BELOW_M } from './tape';
