import { ApiError } from './api-client';

/**
 * The one sentence for "someone else saved this first" (a 409 that carries `current`): the route
 * says it, and every screen that meets such a conflict shows it as it came.
 */
export function changedElsewhere(what: 'project' | 'mirror' | 'catalogue item'): string {
  return `Someone else changed this ${what} (in another tab, on another device, or another person) since you opened it, so your change was not saved.`;
}

/**
 * The one place that turns a raw failure into words a person can act on.
 * Screens show this sentence; forms also show `ApiError.fields` beside each field.
 */
export function describeError(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.status === 429) {
      const wait = error.retryAfterS ? ` Try again in ${formatWait(error.retryAfterS)}.` : '';
      return `${error.message}${wait}`;
    }
    return error.message;
  }
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong. Try again; if it keeps happening, tell your administrator.';
}

function formatWait(seconds: number): string {
  if (seconds < 90) return `${Math.ceil(seconds)} seconds`;
  return `${Math.ceil(seconds / 60)} minutes`;
}
