/**
 * Structured logs: one JSON object per line (pino), so an operator's log shipper can index them.
 * Every line that belongs to an HTTP request carries its `reqId` (also sent back as `X-Request-Id`).
 * Secrets never reach a line: message text passes through `redact` (bcrypt hashes, tokens, SQL),
 * and the request fields that could hold one (cookies, authorization, bodies) are never logged.
 *
 * In tests only errors are written unless LOG_LEVEL says otherwise; LOG_LEVEL picks the level in production too.
 */
import pino, { type DestinationStream, type Logger as PinoLogger } from 'pino';
import { redact } from './redact';

export interface Logger {
  info(message: string, fields?: Record<string, unknown>): void;
  warn(message: string, fields?: Record<string, unknown>): void;
  error(message: string, err?: unknown): void;
  /** The same log with fields bound to every line (e.g. the request id). */
  child(bindings: Record<string, unknown>): Logger;
  /** The pino instance underneath, for the request log (server/middleware/request-log.ts). */
  readonly pino: PinoLogger;
}

/** Paths pino blanks wherever they appear in a logged object. */
export const REDACTED_PATHS = [
  'req.headers.cookie',
  'req.headers.authorization',
  'res.headers["set-cookie"]',
  '*.password',
  '*.currentPassword',
  '*.newPassword',
  '*.passwordHash',
  '*.token',
];

function wrap(p: PinoLogger): Logger {
  return {
    pino: p,
    info: (m, fields) => p.info(fields ?? {}, redact(m)),
    warn: (m, fields) => p.warn(fields ?? {}, redact(m)),
    error: (m, err) => {
      if (err === undefined) p.error(redact(m));
      else p.error({ detail: typeof err === 'string' ? redact(err) : describe(err) }, redact(m));
    },
    child: (bindings) => wrap(p.child(bindings)),
  };
}

function describe(err: unknown): string {
  const e = err as { name?: unknown; message?: unknown } | null;
  if (e && typeof e === 'object' && typeof e.message === 'string')
    return `${typeof e.name === 'string' ? e.name : 'Error'}: ${redact(e.message)}`;
  return `non-error value (${typeof err})`;
}

export function createLogger(quiet = process.env.NODE_ENV === 'test' && !process.env.LOG_LEVEL, destination?: DestinationStream): Logger {
  const level = quiet ? 'error' : (process.env.LOG_LEVEL ?? 'info');
  const options = {
    level,
    base: { service: 'sightfan' },
    timestamp: pino.stdTimeFunctions.isoTime,
    redact: { paths: REDACTED_PATHS, censor: '[redacted]' },
    formatters: { level: (label: string) => ({ level: label }) },
  };
  return wrap(destination ? pino(options, destination) : pino(options));
}
