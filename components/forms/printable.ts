import type { StringSchema } from 'yup';
import { unprintableMessage } from '@/shared/text/printable';

/**
 * The sheet's printable-character rule (shared/text/printable.ts) as a yup test, so a form says
 * "emoji cannot be printed" before sending, in the same words as the server.
 */
export function printableText<S extends StringSchema<string | undefined>>(schema: S, multiline = false): S {
  return schema.test('printable', (value, ctx) => {
    const message = value ? unprintableMessage(value, multiline) : null;
    return message ? ctx.createError({ message }) : true;
  }) as S;
}
