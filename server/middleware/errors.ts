import type { ErrorRequestHandler, Request, RequestHandler } from 'express';
import { DriverException } from '@mikro-orm/core';
import { HttpError } from '../http-error';
import type { Logger } from '../logger';
import { writeConflict } from '../write-conflicts';
import { redact } from '../redact';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, `There is no API route ${req.method} ${safePath(req)}.`));
};

/**
 * Errors raised below the routes (body-parser, the router's path decoding) carry a `type` or a
 * 4xx `status`; each becomes a sentence a person can act on, keeping its status.
 */
const BY_TYPE: Record<string, [number, string]> = {
  'entity.parse.failed': [400, 'The request body is not valid JSON.'],
  'entity.too.large': [413, 'The request is too large.'],
  'charset.unsupported': [415, 'Send the request body as UTF-8 (charset=utf-8); other character sets are not accepted.'],
  'encoding.unsupported': [
    415,
    'The request body uses a content encoding the server does not accept; send it uncompressed, or compressed with gzip or deflate.',
  ],
  'request.aborted': [400, 'The request was cut off before its body arrived. Try again.'],
  'request.size.invalid': [400, 'The request body is shorter or longer than its Content-Length says.'],
};

const BY_STATUS: Record<number, string> = {
  400: 'The request is not valid.',
  401: 'You are signed out. Sign in to continue.',
  403: 'This request is not allowed.',
  404: 'That page was not found.',
  405: 'That method is not allowed here.',
  413: 'The request is too large.',
  415: 'The request body is in a format the server does not accept; send JSON in UTF-8.',
};

function knownClientError(err: unknown): [number, string] | undefined {
  const e = err as { type?: string; status?: number; statusCode?: number } | null;
  if (!e || typeof e !== 'object') return undefined;
  if (e.type && BY_TYPE[e.type]) return BY_TYPE[e.type];
  const status = e.status ?? e.statusCode;
  if (err instanceof URIError && status === 400) {
    return [
      400,
      'The address contains a broken percent-escape (such as "%E0" without the rest of its character). Check the link and try again.',
    ];
  }
  // Body errors from zlib ("incorrect header check") and the like carry 400 from body-parser.
  if (typeof status === 'number' && status >= 400 && status < 500) return [status, BY_STATUS[status] ?? 'The request is not valid.'];
  return undefined;
}

/**
 * The path for messages and logs: the route's pattern when one matched (so ids and tokens in the
 * path are not copied), otherwise the path with anything token-like masked.
 */
export function safePath(req: Request): string {
  const pattern = req.route?.path;
  // A router's own root ('/') is the mount path itself: `/api/projects`, not `/api/projects/`.
  if (typeof pattern === 'string') return pattern === '/' && req.baseUrl ? req.baseUrl : `${req.baseUrl}${pattern}`;
  const raw = (req.originalUrl ?? req.url ?? '').split('?')[0];
  return redact(raw).slice(0, 200);
}

export { redact };

/** What the log may keep of an unexpected error: its kind and where it happened, never data. */
export function describeForLog(err: unknown): string {
  if (err instanceof DriverException) {
    // MikroORM puts the statement with its parameters into the message: keep only the kind.
    const code = (err as { code?: string }).code;
    return `${err.name}${code ? ` (${code})` : ''}: database error, statement withheld`;
  }
  // Duck-typed: errors from Node internals can come from another realm (e.g. under Jest).
  const e = err as { name?: unknown; message?: unknown; stack?: unknown } | null;
  if (e && typeof e === 'object' && typeof e.message === 'string') {
    const frames = (typeof e.stack === 'string' ? e.stack : '')
      .split('\n')
      .filter((l) => /^\s+at /.test(l))
      .slice(0, 8);
    return [`${typeof e.name === 'string' ? e.name : 'Error'}: ${redact(e.message)}`, ...frames].join('\n');
  }
  return `non-error value thrown (${typeof err})`;
}

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
    const known = knownClientError(err);
    if (known) {
      res.status(known[0]).json({ error: known[1] });
      return;
    }
    const reqId = req.id;
    (reqId === undefined ? log : log.child({ reqId })).error(`${req.method} ${safePath(req)} failed`, describeForLog(err));
    if (res.headersSent) return;
    res.status(500).json({
      error: 'Sightfan hit an unexpected problem and saved nothing from this request. Try again; if it repeats, tell your administrator.',
    });
  };
}
