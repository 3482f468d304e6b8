/** An error a route throws on purpose; the error middleware turns it into `{error, fields?}`. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields?: Record<string, string>,
    readonly headers?: Record<string, string>,
    /** Extra members of the error body, e.g. `current` with the record a stale edit lost to. */
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const notFound = (what = 'That page') =>
  new HttpError(404, `${what} was not found. It may have been removed, or the link is wrong.`);
