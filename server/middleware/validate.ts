import type { z } from 'zod';
import { fieldErrors } from '../../shared/schemas';
import { HttpError } from '../http-error';

/** Parses a value with a shared zod schema; a failure becomes 400 with a sentence per field. */
export function parseOr400<S extends z.ZodType>(schema: S, value: unknown, what = 'The form'): z.output<S> {
  const result = schema.safeParse(value ?? {});
  if (result.success) return result.data;
  const fields = fieldErrors(result.error.issues);
  const first = Object.values(fields)[0];
  const message =
    Object.keys(fields).length === 1 && fields._
      ? first
      : `${what} has ${Object.keys(fields).length === 1 ? 'a problem' : 'some problems'}: ${first}`;
  throw new HttpError(400, message ?? `${what} is not valid.`, fields);
}
