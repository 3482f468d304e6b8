import type { RequestHandler } from 'express';
import { HttpError } from '../http-error';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses state-changing requests that a browser sent from another site (CSRF defence in depth
 * on top of SameSite=Lax cookies). The Origin header, when present, must match this server's
 * own origin or an allowed dev origin; without Origin, Sec-Fetch-Site must not be cross-site.
 * Non-browser clients (curl, tests) send neither and pass.
 */
export function sameOriginOnly(allowedOrigins: string[]): RequestHandler {
  const allowed = new Set(allowedOrigins);
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const origin = req.get('origin');
    if (origin && origin !== 'null') {
      const own = `${req.protocol}://${req.get('host')}`;
      if (origin === own || allowed.has(origin)) return next();
      return next(new HttpError(403, 'This request came from another website and was refused. Open Sightfan directly and try again.'));
    }
    if (origin === 'null' || req.get('sec-fetch-site') === 'cross-site') {
      return next(new HttpError(403, 'This request came from another website and was refused. Open Sightfan directly and try again.'));
    }
    next();
  };
}
