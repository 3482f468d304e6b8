/**
 * One JSON line per request (pino, server/logger.ts): its id, method, path (without the query),
 * status and time, at `info`, `warn` for 4xx and `error` for 5xx; never headers, cookies or
 * bodies. The id comes from the proxy's `X-Request-Id` when it looks like one, otherwise a new
 * UUID; it is sent back in `X-Request-Id` and kept as `req.id` for the error handler's line.
 *
 * Written here rather than taken from pino-http: that package made a child logger and ran its
 * serializers for every request, about a fifth of a signed-in list request's CPU under load
 * (DEVELOPERS.md, "What a request costs"); this writes the same fields with one call.
 */
import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';
import type { Logger as PinoLogger } from 'pino';
import { safePath } from './errors';

/** A request id from the proxy is kept when it looks like one; otherwise a new one is made. */
const INCOMING_REQUEST_ID = /^[A-Za-z0-9._:-]{8,64}$/;

/** Polled by proxies and monitors many times a minute: answered, never logged. */
const QUIET_PATHS = new Set(['/api/health', '/api/ready']);

export function requestLog(log: PinoLogger): RequestHandler {
  return (req, res, next) => {
    const incoming = req.headers['x-request-id'];
    const id = typeof incoming === 'string' && INCOMING_REQUEST_ID.test(incoming) ? incoming : randomUUID();
    req.id = id;
    res.setHeader('X-Request-Id', id);
    if (QUIET_PATHS.has(req.url)) return next();
    const started = performance.now();
    // 'close' comes once, after the answer was sent or when the client went away first.
    res.once('close', () => {
      const status = res.statusCode;
      const level = status >= 500 ? 'error' : status >= 400 ? 'warn' : 'info';
      if (!log.isLevelEnabled(level)) return;
      log[level](
        {
          reqId: id,
          req: { method: req.method, path: safePath(req) },
          res: { status },
          responseTime: Math.round(performance.now() - started),
        },
        res.writableFinished ? 'request completed' : 'request aborted',
      );
    });
    next();
  };
}
