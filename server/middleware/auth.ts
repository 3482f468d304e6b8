import { ReferenceKind } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/knex';
import type { RequestHandler } from 'express';
import type { Role } from '../../shared/schemas';
import { HttpError } from '../http-error';
import { User } from '../modules/users/user.entity';
import { requestEm } from './request-context';
import { runCompiled } from '../compiled-query';

/** The user row's columns the ORM reads eagerly (scalars and references, not the lazy password hash), from the entity's metadata. */
let userColumns: string[] | undefined;
function eagerUserColumns(em: EntityManager): string[] {
  userColumns ??= em
    .getMetadata()
    .get(User.name)
    .props.filter((p) => !p.lazy && p.persist !== false && (p.kind === ReferenceKind.SCALAR || p.kind === ReferenceKind.MANY_TO_ONE))
    .flatMap((p) => p.fieldNames);
  return userColumns;
}

/**
 * Loads the signed-in user on every request, so a disabled account or a changed role takes
 * effect at once rather than when the cookie expires. It runs on every signed-in request, so it is
 * one plain select of the user's row (its SQL kept: server/compiled-query.ts), mapped into the request's entity manager (`em.map`: a
 * managed entity, changed and flushed like any other); the ORM's own findOne with the organisation
 * joined cost about six times as much CPU. The organisation is a reference (its id only) and the
 * password hash is not read: routes that answer with the user call `loadUserDetails` first.
 */
export function loadUser(): RequestHandler {
  return async (req, _res, next) => {
    const id = req.session?.userId;
    if (!id) return next();
    const em = requestEm();
    const [row] = await runCompiled<Record<string, unknown>>(em, 'user:signed-in', { id }, (slot) =>
      em.getKnex()(em.getMetadata().get(User.name).tableName).select(eagerUserColumns(em)).where('id', slot('id')).limit(1),
    );
    const user = row ? em.map(User, row) : null;
    if (!user || user.disabled) {
      await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
      return next();
    }
    req.user = user;
    next();
  };
}

/** What `loadUser` leaves out (the organisation's name, the password hash), for the routes that answer with the user. */
export async function loadUserDetails(user: User): Promise<User> {
  await requestEm().populate(user, ['organization', 'passwordHash']);
  return user;
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
