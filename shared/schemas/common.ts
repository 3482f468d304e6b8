import { z } from 'zod';
import { emailRule, newPasswordRule, personNameRule, ROLE_MESSAGE, UNITS_MESSAGE } from './rules';
import { zodText } from './zod-rules';

/** The error body every API route returns: one sentence, plus per-field sentences for forms. */
export const apiErrorBody = z.object({
  error: z.string(),
  fields: z.record(z.string(), z.string()).optional(),
});
export type ApiErrorBody = z.infer<typeof apiErrorBody>;

export const roles = ['installer', 'reviewer', 'admin'] as const;
export const role = z.enum(roles, { message: ROLE_MESSAGE });
export type Role = z.infer<typeof role>;

export const unitSystems = ['metric', 'imperial'] as const;
export const unitSystem = z.enum(unitSystems, { message: UNITS_MESSAGE });
export type UnitSystem = z.infer<typeof unitSystem>;

/** An e-mail address, trimmed and lower-cased so look-ups do not depend on how it was typed. */
export const email = zodText(emailRule);

export const personName = zodText(personNameRule);

/** A new password: long enough to resist guessing, short enough for bcrypt (72 bytes). */
export const newPassword = zodText(newPasswordRule);

/**
 * An id in a path: plain decimal digits, no sign, no leading zero, no spaces, no "0x10" or "1.0"
 * (which a coercing parse would take as aliases of 16 and 1), and within the safe integer range.
 */
export const idParam = z
  .string({ message: 'That id is missing.' })
  .regex(/^[1-9][0-9]{0,14}$/, 'An id is a whole number written with digits only, like 12.')
  .transform((s) => Number(s));

/** Turns a zod error into the API's `{error, fields}` body. */
export function fieldErrors(issues: readonly { path: readonly PropertyKey[]; message: string }[]): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join('.') || '_';
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}
