import { z } from 'zod';
import { unprintableMessage } from '../text/printable';

/**
 * A text that will be printed on the specification sheet: refuses characters no shipped face can
 * draw (emoji among them) with a sentence, instead of printing empty boxes.
 */
export const printable = <T extends z.ZodString>(schema: T, opts: { multiline?: boolean } = {}) =>
  schema.superRefine((s, ctx) => {
    const message = unprintableMessage(s, opts.multiline);
    if (message) ctx.addIssue({ code: 'custom', message });
  });

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

/** An e-mail address, trimmed and lower-cased so look-ups do not depend on how it was typed. */
export const email = z
  .string({ message: 'Enter an e-mail address.' })
  .trim()
  .min(1, 'Enter an e-mail address.')
  .max(254, 'That e-mail address is too long (254 characters at most).')
  .email('Enter a full e-mail address, like name@company.com.')
  .transform((s) => s.toLowerCase());

export const personName = printable(
  z
    .string({ message: 'Enter a name.' })
    .trim()
    .min(1, 'Enter a name.')
    .max(120, 'Keep the name to 120 characters.'),
);

/** A new password: long enough to resist guessing, short enough for bcrypt (72 bytes). */
export const newPassword = z
  .string({ message: 'Enter a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(72, 'Use at most 72 characters.');

export const idParam = z.coerce
  .number({ message: 'That id is not a number.' })
  .int('That id is not a whole number.')
  .positive('That id is not valid.');

/** Turns a zod error into the API's `{error, fields}` body. */
export function fieldErrors(issues: ReadonlyArray<{ path: ReadonlyArray<PropertyKey>; message: string }>): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join('.') || '_';
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}
