import type { FormikErrors, FormikHelpers, FormikProps } from 'formik';
import { ApiError } from '@/shared/api-client';
import { describeError } from '@/shared/errors';

/** Formik's `status` shape for the forms here. */
export interface FormStatus {
  formError?: string;
  done?: string;
  /** The server's per-field messages, and the values they were about. */
  serverFields?: Record<string, string>;
  serverValues?: Record<string, unknown>;
}

/**
 * After a failed submit: the server's per-field sentences go beside the fields this form has, and
 * one sentence (describeError) goes above the submit button. Fields the form does not show are
 * folded into that sentence so nothing the server said is lost.
 */
export function serverErrorsFor<Values extends object>(
  error: unknown,
  knownFields: readonly (keyof Values & string)[],
  values: Values,
): { fieldErrors: FormikErrors<Values>; status: FormStatus } {
  const fieldErrors: Record<string, string> = {};
  const extra: string[] = [];
  if (error instanceof ApiError) {
    for (const [field, message] of Object.entries(error.fields)) {
      if ((knownFields as readonly string[]).includes(field)) fieldErrors[field] = message;
      else extra.push(message);
    }
  }
  const formError = [describeError(error), ...extra].join(' ');
  return {
    fieldErrors: fieldErrors as FormikErrors<Values>,
    status: { formError, serverFields: fieldErrors, serverValues: Object.fromEntries(Object.entries(values)) },
  };
}

/**
 * The message to show beside a field. Formik re-runs the client schema on blur and change and
 * replaces `errors` wholesale, which would wipe a server message a moment after it appears (the
 * field blurs right after Enter). So the server's message is also kept in `status` and shown until
 * the person edits that field.
 */
export function fieldMessage<Values extends object>(form: FormikProps<Values>, name: keyof Values & string): string | undefined {
  if (!form.touched[name]) return undefined;
  const own = form.errors[name];
  if (typeof own === 'string') return own;
  const status = form.status as FormStatus | undefined;
  const server = status?.serverFields?.[name];
  if (server && status?.serverValues?.[name] === form.values[name]) return server;
  return undefined;
}

/**
 * The submit wiring every form here shares: clear the last attempt's messages, run the request, and
 * on failure put the server's sentences beside the fields and above the button (serverErrorsFor).
 * Resolves true when the action succeeded, so a form can reset or say "sent" only then.
 */
export async function submitWithServerErrors<Values extends object>(
  helpers: FormikHelpers<Values>,
  knownFields: readonly (keyof Values & string)[],
  values: Values,
  action: () => Promise<unknown>,
): Promise<boolean> {
  helpers.setStatus(undefined);
  try {
    await action();
    return true;
  } catch (error) {
    const { fieldErrors, status } = serverErrorsFor<Values>(error, knownFields, values);
    helpers.setErrors(fieldErrors);
    helpers.setStatus(status);
    return false;
  }
}
