import { z } from 'zod';

/** The error body every API route returns: one sentence, plus per-field sentences for forms. */
export const apiErrorBody = z.object({
  error: z.string(),
  fields: z.record(z.string(), z.string()).optional(),
});
export type ApiErrorBody = z.infer<typeof apiErrorBody>;

export const roles = ['installer', 'reviewer', 'admin'] as const;
export const role = z.enum(roles, { message: 'Choose a role: installer, reviewer or admin.' });
export type Role = z.infer<typeof role>;

export const unitSystems = ['metric', 'imperial'] as const;
export const unitSystem = z.enum(unitSystems, { message: 'Choose metric or imperial units.' });
export type UnitSystem = z.infer<typeof unitSystem>;

/**
 * Text rules. Control characters (NUL, bell, escape, the C1 range, DEL) have no place in anything a
 * person types: they break storage, search and the printed sheet. Single-line fields (names,
 * labels, codes, searches) also refuse line breaks; multi-line fields (notes) keep tab, CR and LF.
 */
// eslint-disable-next-line no-control-regex
const CONTROL_EXCEPT_LAYOUT = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;
const LINE_BREAK = /[\r\n\u2028\u2029]/;
export const CONTROL_MESSAGE = 'Remove the control character (an invisible character such as NUL) from this text.';
export const LINE_BREAK_MESSAGE = 'Keep this to one line (no line breaks).';

/** Adds the single-line rules to a string schema: no line breaks, no control characters. */
export const singleLine = (s: z.ZodString) =>
  s.refine((v) => !LINE_BREAK.test(v), LINE_BREAK_MESSAGE).refine((v) => !CONTROL_EXCEPT_LAYOUT.test(v) && !v.includes('\t'), CONTROL_MESSAGE);

/** Adds the multi-line rules to a string schema: tab and line breaks allowed, other control characters not. */
export const multiLine = (s: z.ZodString) => s.refine((v) => !CONTROL_EXCEPT_LAYOUT.test(v), CONTROL_MESSAGE);

/** An e-mail address, trimmed and lower-cased so look-ups do not depend on how it was typed. */
export const email = z
  .string({ message: 'Enter an e-mail address.' })
  .trim()
  .min(1, 'Enter an e-mail address.')
  .max(254, 'That e-mail address is too long (254 characters at most).')
  .email('Enter a full e-mail address, like name@company.com.')
  .transform((s) => s.toLowerCase());

export const personName = singleLine(
  z.string({ message: 'Enter a name.' }).trim().min(1, 'Enter a name.').max(120, 'Keep the name to 120 characters.'),
);

/** A new password: long enough to resist guessing, short enough for bcrypt (72 bytes). */
export const newPassword = z
  .string({ message: 'Enter a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(72, 'Use at most 72 characters.');

/**
 * An id in a path: plain decimal digits, no sign, no leading zero, no spaces, no "0x10" or "1.0"
 * (which a coercing parse would take as aliases of 16 and 1), and within the safe integer range.
 */
export const idParam = z
  .string({ message: 'That id is missing.' })
  .regex(/^[1-9][0-9]{0,14}$/, 'An id is a whole number written with digits only, like 12.')
  .transform((s) => Number(s));

/** Turns a zod error into the API's `{error, fields}` body. */
export function fieldErrors(issues: ReadonlyArray<{ path: ReadonlyArray<PropertyKey>; message: string }>): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join('.') || '_';
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}
