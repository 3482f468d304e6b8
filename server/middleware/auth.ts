import type { RequestHandler } from 'express';
import type { Role } from '../../shared/schemas';
import { HttpError } from '../http-error';
import { User } from '../modules/users/user.entity';
import { requestEm } from './request-context';

/**
 * Loads the signed-in user on every request, so a disabled account or a changed role takes
 * effect at once rather than when the cookie expires. One query (the user joined to their
 * organisation) into the request's entity manager; the password hash is not read here: the few
 * routes that need it (`hasPassword`, the password change) populate it themselves.
 */
export function loadUser(): RequestHandler {
  return async (req, _res, next) => {
    const id = req.session?.userId;
    if (!id) return next();
    const user = await requestEm().findOne(User, { id }, { populate: ['organization'] });
    if (!user || user.disabled) {
      await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
      return next();
    }
    req.user = user;
    next();
  };
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new HttpError(401, 'You are signed out. Sign in to continue.'));
  next();
};

export function requireRole(...allowed: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(new HttpError(401, 'You are signed out. Sign in to continue.'));
    if (!allowed.includes(req.user.role)) {
      return next(new HttpError(403, `Only ${allowed.join(' or ')} accounts can do this. Ask an administrator if you need access.`));
    }
    next();
  };
}
