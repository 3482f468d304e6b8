/**
 * Builds the forms' yup fields from the shared rules (shared/schemas/rules.ts), so a form refuses
 * what the route refuses, in the same words. Formik shows the first failing check per field, which
 * is the rule's order, the same order the zod side checks in.
 */
import * as yup from 'yup';
import { numberProblem, textLinesProblem, textPrintProblem, type NumberRule, type TextRule } from '@/shared/schemas/rules';

export function yupText(rule: TextRule): yup.StringSchema<string | undefined> {
  let s: yup.StringSchema<string | undefined> = yup.string();
  if (rule.trim) s = s.trim();
  if (rule.letterCase === 'lower') s = s.lowercase();
  if (rule.letterCase === 'upper') s = s.uppercase();
  if (rule.required) s = s.required(rule.required);
  if (rule.minLength) s = s.min(rule.minLength.value, rule.minLength.message);
  s = s.max(rule.maxLength.value, rule.maxLength.message);
  if (rule.pattern) s = s.matches(rule.pattern.re, rule.pattern.message);
  if (rule.lines || rule.printable) {
    s = s.test('lines', (v, ctx) => {
      const problem = v ? (textLinesProblem(rule, v) ?? textPrintProblem(rule, v)) : null;
      return problem ? ctx.createError({ message: problem }) : true;
    });
  }
  return s;
}

/**
 * A text field that must be the same as another field (`same`: a password typed again) or differ
 * from it (a new password and the current one). Checked after the field's own rule, as the route
 * checks the pair after each field: yup's `oneOf` would run first and hide the rule's sentence.
 */
export function yupTextComparedTo(rule: TextRule, other: string, relation: 'same' | 'different', message: string) {
  return yupText(rule).test('compared', message, function (value) {
    const theirs: unknown = this.parent?.[other];
    // Formik hands yup an empty field as undefined (footgun 26): compare them as empty text.
    const equal = (value ?? '') === (theirs ?? '');
    return relation === 'same' ? equal : !equal;
  });
}

/** A number held as a number (or null while empty); a required rule refuses null. */
export function yupNumber(rule: NumberRule) {
  return yup
    .number()
    .typeError(rule.required)
    .nullable()
    .test('rule', (n, ctx) => {
      const problem = numberProblem(rule, n);
      return problem ? ctx.createError({ message: problem }) : true;
    });
}

const readDecimal = (s: string) => (/^\s*\d+([.,]\d+)?\s*$/.test(s) ? Number(s.trim().replace(',', '.')) : Number.NaN);

/**
 * An optional number typed as text ("80", "12,5"): empty is allowed; otherwise the text is read,
 * divided (a percentage by 100 for a fraction) and held to the rule. Unreadable text gets `required`.
 */
export function yupNumberText(rule: NumberRule, divisor = 1) {
  return yup
    .string()
    .default('')
    .test('rule', (s, ctx) => {
      if (!s || !s.trim()) return true;
      const problem = numberProblem(rule, readDecimal(s) / divisor);
      return problem ? ctx.createError({ message: problem }) : true;
    });
}

/** The same reading the forms' bodies use, so the form and the request agree on the number. */
export function numberOfText(s: string, divisor = 1): number | null {
  return s.trim() ? readDecimal(s) / divisor : null;
}
