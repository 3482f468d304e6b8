/**
 * How the one error middleware words the two kinds of write conflict the database itself detects:
 * an optimistic-lock failure (MikroORM's `version` property: the request edited an older version)
 * and a unique-constraint violation. Modules register their wording here; routes just flush.
 */
import { OptimisticLockError, UniqueConstraintViolationException, wrap, type EntityManager } from '@mikro-orm/core';
import { changedElsewhere } from '../shared/errors';
import { HttpError } from './http-error';

type Thing = Parameters<typeof changedElsewhere>[0];
type EntityClass = abstract new (...args: never[]) => object;
interface LockEntry {
  what: Thing;
  /** The record as it now stands, re-read from the database, as the API returns it. */
  current: (em: EntityManager, entity: object) => Promise<unknown>;
}

const locks = new Map<EntityClass, LockEntry>();
const uniques = new Map<string, () => HttpError>();

export function onStaleVersion<E extends object>(
  cls: abstract new (...args: never[]) => E,
  what: Thing,
  current: (em: EntityManager, entity: E) => Promise<unknown>,
) {
  locks.set(cls, { what, current: current as LockEntry['current'] });
}

/**
 * `column` as "table.column", e.g. "mirror_model.code": SQLite names it so in its message;
 * PostgreSQL names the constraint, "mirror_model_code_unique" or "mirror_model_organization_id_code_unique".
 */
export function onDuplicate(column: string, error: () => HttpError) {
  uniques.set(column, error);
}

/** The 409 for a database write conflict, or null when `err` is not one. */
export async function writeConflict(err: unknown): Promise<HttpError | null> {
  if (err instanceof OptimisticLockError) {
    const entity = err.getEntity();
    const entry = entity ? [...locks].find(([cls]) => entity instanceof cls)?.[1] : undefined;
    const em = entity ? wrap(entity, true).__em : undefined;
    const current = entry && em && entity ? await entry.current(em.fork(), entity).catch(() => undefined) : undefined;
    return new HttpError(
      409,
      changedElsewhere(entry?.what ?? 'project'),
      undefined,
      undefined,
      current === undefined ? undefined : { current },
    );
  }
  if (err instanceof UniqueConstraintViolationException) {
    const column = [...uniques.keys()].find((c) => namesColumn(err.message, c));
    return column ? uniques.get(column)!() : new HttpError(409, 'Something with the same name or code already exists; choose another.');
  }
  return null;
}

/** Whether a unique-violation message (SQLite's or PostgreSQL's) is about `table.column`. */
export function namesColumn(message: string, column: string): boolean {
  if (message.includes(column)) return true;
  const [table, col] = column.split('.');
  return new RegExp(`"${table}_(?:\\w+_)?${col}_unique"`).test(message);
}
