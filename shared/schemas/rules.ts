/**
 * Every limit, pattern and message a person can meet in a form, written once.
 *
 * Plain data, no zod and no yup: the API contract (`shared/schemas/*`, zod, built by `./zod-rules`)
 * and the app's forms (`components/forms/yup-rules.ts`, yup) are both built from these, so a form
 * refuses exactly what the route refuses and says it in the same words
 * (tests/app/form-rules.test.tsx feeds both the same generated inputs).
 *
 * To change what a field accepts or what it says, change it here.
 */
import { formatLength, type UnitSystem } from '../units';
import { unprintableMessage } from '../text/printable';
import { PLACEMENT_LIMITS } from './limits';

/** A limit and the sentence shown when it is crossed. */
export interface Limit {
  readonly value: number;
  readonly message: string;
}

/** A text field. Checks run in this order and the first one that fails is the field's message. */
export interface TextRule {
  /** Surrounding white space is removed before checking and before saving. */
  readonly trim: boolean;
  /** Letters are turned to this case (after trimming) before checking and before saving. */
  readonly letterCase?: 'upper' | 'lower';
  /** Said when the field is empty (after trimming); absent when the field may be empty. */
  readonly required?: string;
  readonly minLength?: Limit;
  readonly maxLength: Limit;
  readonly pattern?: { readonly re: RegExp; readonly message: string };
  /**
   * What the text may hold: one line (names, labels, codes: no line breaks, no tab, no control
   * characters) or several (notes: tab and line breaks kept, other control characters refused).
   * Absent only for passwords, which are never stored or printed as text.
   */
  readonly lines?: 'single' | 'multi';
  /**
   * The text is printed on the specification sheet: characters no shipped face can draw (emoji
   * among them) are refused with a sentence (shared/text/printable.ts), never printed as boxes.
   */
  readonly printable?: boolean;
}

/**
 * Control characters (NUL, bell, escape, the C1 range, DEL) have no place in anything a person
 * types: they break storage, search and the printed sheet.
 */
const LINE_BREAK = /[\r\n\u2028\u2029]/;
/** C0 and C1 control characters and DEL; tab, LF and CR count as layout where `layout` is true. */
function hasControl(value: string, layout: boolean): boolean {
  for (let i = 0; i < value.length; i++) {
    const c = value.charCodeAt(i);
    if (layout && (c === 9 || c === 10 || c === 13)) continue;
    if (c <= 0x1f || (c >= 0x7f && c <= 0x9f)) return true;
  }
  return false;
}
export const CONTROL_MESSAGE = 'Remove the control character (an invisible character such as NUL) from this text.';
export const LINE_BREAK_MESSAGE = 'Keep this to one line (no line breaks).';

/** The sentence for text that breaks the rule's `lines`, or null; line breaks are named first. */
export function textLinesProblem(rule: Pick<TextRule, 'lines'>, value: string): string | null {
  if (!rule.lines) return null;
  if (rule.lines === 'single' && LINE_BREAK.test(value)) return LINE_BREAK_MESSAGE;
  if (hasControl(value, rule.lines === 'multi')) return CONTROL_MESSAGE;
  return null;
}

/** The sentence for text the sheet cannot print, or null (only for rules marked `printable`). */
export function textPrintProblem(rule: Pick<TextRule, 'lines' | 'printable'>, value: string): string | null {
  return rule.printable ? unprintableMessage(value, rule.lines === 'multi') : null;
}

/** A number typed as a number. `required` is also said when it is missing or not a finite number. */
export interface NumberRule {
  readonly required: string;
  readonly integer?: string;
  /** Inclusive lower bound. */
  readonly min?: Limit;
  /** Strict lower bound (the value must be more than this). */
  readonly above?: Limit;
  readonly max?: Limit;
}

/**
 * One e-mail address pattern for the whole product: the "practical" pattern zod 4 uses for
 * `z.email()` (zod/v4/core/regexes.ts), kept here so the form and the route cannot disagree.
 */
export const EMAIL_PATTERN = /^(?:[A-Za-z0-9_'+\-]+\.)*[A-Za-z0-9_'+\-]*[A-Za-z0-9_+-]@(?:[A-Za-z0-9][A-Za-z0-9\-]*\.)+[A-Za-z]{2,}$/;

export const emailRule: TextRule = {
  trim: true,
  // Look-ups must not depend on how the address was typed.
  letterCase: 'lower',
  required: 'Enter an e-mail address.',
  // RFC 5321 limits a forward path to 256 octets including the angle brackets.
  maxLength: { value: 254, message: 'That e-mail address is too long (254 characters at most).' },
  pattern: { re: EMAIL_PATTERN, message: 'Enter a full e-mail address, like name@company.com.' },
  lines: 'single',
};

export const personNameRule: TextRule = {
  trim: true,
  required: 'Enter a name.',
  maxLength: { value: 120, message: 'Keep the name to 120 characters.' },
  lines: 'single',
  printable: true,
};

/** A new password: long enough to resist guessing, short enough for bcrypt (it reads 72 bytes). */
export const newPasswordRule: TextRule = {
  trim: false,
  required: 'Choose a password.',
  minLength: { value: 10, message: 'Use at least 10 characters.' },
  maxLength: { value: 72, message: 'Use at most 72 characters.' },
};

export const passwordAgainRule: TextRule = {
  trim: false,
  required: 'Type the password again.',
  maxLength: { value: 200, message: 'That password is too long.' },
};
export const PASSWORDS_DIFFER = 'The two passwords are not the same.';

/** The password typed at sign-in: anything up to a generous length (it is only compared). */
export const currentPasswordRule: TextRule = {
  trim: false,
  required: 'Enter your password.',
  maxLength: { value: 200, message: 'That password is too long.' },
};

/** The current password typed to change it: as at sign-in, asked for in other words. */
export const oldPasswordRule: TextRule = { ...currentPasswordRule, required: 'Enter your current password.' };
/** The new password typed again when changing it. */
export const newPasswordAgainRule: TextRule = { ...passwordAgainRule, required: 'Type the new password again.' };
export const PASSWORD_UNCHANGED = 'Choose a password different from the current one.';

export const ROLE_MESSAGE = 'Choose a role: installer, reviewer or admin.';
export const UNITS_MESSAGE = 'Choose metric or imperial units.';

/** Names of things in a project ("Give the zone a name."). */
export const labelRule = (what: string): TextRule => ({
  trim: true,
  required: `Give the ${what} a name.`,
  maxLength: { value: 80, message: `Keep the ${what}'s name to 80 characters.` },
  lines: 'single',
  printable: true,
});

/** An optional free-text field of at most `max` characters ("Keep the notes to 2,000 characters."). */
export const optionalTextRule = (what: string, max: number, lines: 'single' | 'multi', trim = true): TextRule => ({
  trim,
  maxLength: { value: max, message: `Keep the ${what} to ${max.toLocaleString('en-GB')} characters.` },
  lines,
  printable: true,
});

/** A search box: one line (never printed). */
export const searchRule: TextRule = { ...optionalTextRule('search', 100, 'single'), printable: false };

export const projectRules = {
  name: labelRule('project'),
  customer: optionalTextRule('customer', 160, 'single'),
  site: optionalTextRule('site', 200, 'single'),
  notes: optionalTextRule('notes', 5000, 'multi', false),
} as const;

export const placementRules = {
  label: labelRule('mirror'),
  notes: optionalTextRule('notes', 2000, 'multi', false),
} as const;

export const sheetEmailRules = {
  to: emailRule,
  note: optionalTextRule('note', 2000, 'multi'),
} as const;

/** A mirror dimension in metres; messages come out in the reader's units (the API speaks metric). */
export interface SizeLimit {
  readonly what: string;
  readonly minM: number;
  readonly maxM: number;
}

export const MIRROR_SIZES = {
  diameter: { what: 'diameter', minM: 0.05, maxM: 3 },
  domeDiameter: { what: 'diameter', minM: 0.1, maxM: 3 },
  width: { what: 'width', minM: 0.05, maxM: 3 },
  height: { what: 'height', minM: 0.05, maxM: 3 },
  radius: { what: 'radius of curvature', minM: 0.05, maxM: 50 },
} as const satisfies Record<string, SizeLimit>;

export function sizeRule(size: SizeLimit, units: UnitSystem): NumberRule {
  const f = (m: number) => formatLength(m, units, { kind: 'size' });
  return {
    required: `Enter the ${size.what}.`,
    min: { value: size.minM, message: `The ${size.what} must be at least ${f(size.minM)}.` },
    max: { value: size.maxM, message: `The ${size.what} must be at most ${f(size.maxM)}.` },
  };
}

/**
 * A limit said in the reader's units: metric as the plain number of metres ("0.2 m"), imperial in
 * feet and inches to the nearest inch ("8 in", "98 ft 5 in"), as a tape measure reads.
 */
export function limitLength(m: number, units: UnitSystem): string {
  return units === 'metric' ? `${m} m` : formatLength(m, 'imperial', { kind: 'distance', precision: 0 });
}

/**
 * A mirror's mounting height (floor to the mirror's centre), with its limits in the reader's units.
 * The route uses the metric sentences; the editor checks the typed value with the reader's units
 * before anything is sent, so "-3 ft" in imperial is answered in feet and inches.
 */
export function mountingHeightRule(units: UnitSystem): NumberRule {
  return {
    required: 'Enter the mounting height.',
    min: {
      value: PLACEMENT_LIMITS.heightM.min,
      message: `Mount the mirror at least ${limitLength(PLACEMENT_LIMITS.heightM.min, units)} above the floor.`,
    },
    max: {
      value: PLACEMENT_LIMITS.heightM.max,
      message: `A mounting height over ${limitLength(PLACEMENT_LIMITS.heightM.max, units)} is out of range.`,
    },
  };
}

/** The largest distance of a plan point from the origin on either axis, in metres. */
export const MAX_SITE_M = 2000;

/** A plan coordinate (a mirror's or a point's x or y), with its limit in the reader's units. */
export function planCoordinateRule(units: UnitSystem): NumberRule {
  const far = `That point is more than ${units === 'metric' ? '2 km' : limitLength(MAX_SITE_M, units)} from the origin.`;
  return { required: 'Enter a position.', min: { value: -MAX_SITE_M, message: far }, max: { value: MAX_SITE_M, message: far } };
}

export const DOME_PORTION_MESSAGE = 'Choose a full, half or quarter dome.';
export const MIRROR_SHAPE_MESSAGE = 'Choose a shape: round, rectangular or dome.';

/** The dimensions that decide whether a spherical panel can exist. */
export type MirrorSize =
  | { shape: 'round'; diameterM: number; radiusM: number }
  | { shape: 'rect'; widthM: number; heightM: number; radiusM: number }
  | { shape: 'dome' };

/** The sphere's radius must exceed the half-aperture, or the panel could not be cut from it. */
export function mirrorSizeProblem(m: MirrorSize): { field: 'radiusM'; message: string } | null {
  if (m.shape === 'round' && m.diameterM >= 2 * m.radiusM) {
    return {
      field: 'radiusM',
      message: 'The radius of curvature must be more than half the diameter: no sphere that small has a cap this wide.',
    };
  }
  if (m.shape === 'rect' && Math.hypot(m.widthM, m.heightM) >= 2 * m.radiusM) {
    return {
      field: 'radiusM',
      message: 'The radius of curvature must be more than half the panel diagonal: no sphere that small has a panel this large.',
    };
  }
  return null;
}

export const catalogueRules = {
  code: {
    trim: true,
    required: 'Enter a catalogue code.',
    maxLength: { value: 40, message: 'Keep the code to 40 characters.' },
    pattern: { re: /^[A-Za-z0-9._-]+$/, message: 'Use letters, digits, dot, dash or underscore in the code.' },
    lines: 'single',
  },
  name: {
    trim: true,
    required: 'Enter a name.',
    maxLength: { value: 160, message: 'Keep the name to 160 characters.' },
    lines: 'single',
    printable: true,
  },
  material: optionalTextRule('material', 80, 'single'),
  notes: optionalTextRule('notes', 2000, 'multi', false),
  currency: {
    trim: true,
    letterCase: 'upper',
    required: 'Enter a currency code.',
    maxLength: { value: 3, message: 'Use a three-letter currency code, like EUR or USD.' },
    pattern: { re: /^[A-Z]{3}$/, message: 'Use a three-letter currency code, like EUR or USD.' },
    lines: 'single',
  },
  /** A fraction; the form shows it as a percentage. */
  reflectance: {
    required: 'Enter the reflectance from 4 % to 100 %.',
    min: { value: 0.04, message: 'Enter the reflectance from 4 % to 100 %: below 4 % it is not a mirror.' },
    max: { value: 1, message: 'Enter the reflectance from 4 % to 100 %.' },
  },
  massKg: {
    required: 'Enter the mass in kilograms.',
    above: { value: 0, message: 'The mass must be more than zero.' },
    max: { value: 200, message: 'The mass must be at most 200 kg.' },
  },
  /** Price in the currency's minor unit (cents), so sums are exact. */
  unitPriceMinor: {
    required: 'Enter a price.',
    integer: 'Enter the price in whole cents.',
    min: { value: 0, message: 'The price cannot be negative.' },
    max: { value: 100_000_000, message: 'That price is too high.' },
  },
} as const satisfies Record<string, TextRule | NumberRule>;

/**
 * The first message a number rule gives for a value, or null when it passes. Used where a value
 * is parsed from text first (a price, a percentage), so the form can apply the same rule.
 */
export function numberProblem(rule: NumberRule, n: number | null | undefined): string | null {
  if (n == null || !Number.isFinite(n)) return rule.required;
  if (rule.integer && !Number.isInteger(n)) return rule.integer;
  if (rule.min && n < rule.min.value) return rule.min.message;
  if (rule.above && n <= rule.above.value) return rule.above.message;
  if (rule.max && n > rule.max.value) return rule.max.message;
  return null;
}
