/**
 * One entity manager per request (MikroORM's `RequestContext`): the user `loadUser` finds, the
 * project a route loads and whatever it flushes share one identity map and one unit of work.
 * Handlers get it with `requestEm()`; background work (the mail dispatcher, the session store,
 * workers, seeders) has no request and keeps its own explicit `orm.em.fork()`.
 */
import { RequestContext } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/knex';
import type { RequestHandler } from 'express';
import type { Orm } from '../db';

/** Runs the rest of the request inside a fresh fork of the ORM's entity manager. */
export function requestContext(orm: Orm): RequestHandler {
  return (_req, _res, next) => RequestContext.create(orm.em, next);
}

/** The current request's entity manager; throws when called outside `requestContext`. */
export function requestEm(): EntityManager {
  const em = RequestContext.getEntityManager();
  if (!em) throw new Error('requestEm() was called outside a request: mount requestContext(orm) before the routes.');
  return em as EntityManager;
}
