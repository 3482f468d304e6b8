import type { ErrorRequestHandler, RequestHandler } from 'express';
import { HttpError } from '../http-error';
import type { Logger } from '../logger';
import { writeConflict } from '../write-conflicts';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, `There is no API route ${req.method} ${req.originalUrl.split('?')[0]}.`));
};

/** The one error middleware: every failure leaves as `{error, fields?}` with a fitting status. */
export function errorHandler(log: Logger): ErrorRequestHandler {
  return async (err, req, res, _next) => {
    // A stale version or a duplicate caught by the database becomes the same 409 a route would throw.
    err = (await writeConflict(err)) ?? err;
    if (err instanceof HttpError) {
      if (err.headers) res.set(err.headers);
      res.status(err.status).json({ error: err.message, ...(err.fields ? { fields: err.fields } : {}), ...(err.extra ?? {}) });
      return;
    }
    const e = err as { type?: string; status?: number };
    if (e?.type === 'entity.parse.failed') {
      res.status(400).json({ error: 'The request body is not valid JSON.' });
      return;
    }
    if (e?.type === 'entity.too.large') {
      res.status(413).json({ error: 'The request is too large.' });
      return;
    }
    log.error(`${req.method} ${req.originalUrl} failed`, err);
    res.status(500).json({ error: 'Sightfan hit an unexpected problem and saved nothing from this request. Try again; if it repeats, tell your administrator.' });
  };
}
