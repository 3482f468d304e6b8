/**
 * A query builder's SQL, written once per shape of query and run after that with each request's
 * values. MikroORM's query builder spends about 0.7 ms of CPU writing the project list's SQL (the
 * select list, joins, subqueries and the access filter), while running the finished statement costs
 * under 0.1 ms: on a route asked for hundreds of times a second, writing the same SQL again each
 * time was most of the database work.
 *
 * How: the query is built once with stand-in values (`slot(…)`: numbers and strings no request
 * can send), its SQL and parameters are kept, and each stand-in's position in the parameter list
 * is remembered. A later call puts the real values in those positions and runs the kept SQL through
 * the entity manager's connection (so it joins the caller's transaction, and each database keeps
 * its own SQL: the cache is per platform). Building checks that no stand-in was written into the
 * SQL text and none was made into a new value (a pattern around it, a number near it), so a query
 * whose builder reshapes a value is refused at the first call, not answered wrongly. A slot the
 * query does not use (the user's id under a rule that reads only the organisation) is fine.
 *
 * The shape key must name everything that changes the SQL text: which filters are present, the
 * order, the access rule's kind. Values go through slots, never into the key.
 */
import type { Platform } from '@mikro-orm/core';
import type { EntityManager, Knex } from '@mikro-orm/knex';
import { SqlitePlatform } from '@mikro-orm/sqlite';
import type { Database, Statement } from 'sqlite3';

type SlotValue = number | string;

interface Compiled {
  sql: string;
  /** Per parameter: the slot's name to read, or the constant the builder put there. */
  params: ({ slot: string } | { value: unknown })[];
}

const cache = new WeakMap<Platform, Map<string, Compiled>>();

/** Stand-ins: far outside any id, count or limit the API accepts, and strings no form can type. */
function standIn(kind: 'number' | 'string', index: number): SlotValue {
  return kind === 'number' ? -2_000_000_000 - index : `${STRING_MARK}${index}\u0000`;
}

/** The values a query is run with, by slot name; the names and kinds are fixed per shape. */
export type SlotValues = Record<string, SlotValue>;

/**
 * Runs the query `build` makes, for `values`, writing its SQL only the first time this shape is
 * seen on this database. `build` receives stand-ins in place of `values` and must use each one
 * as a whole parameter (compare, equal, `in`), never inside a pattern or an expression.
 */
export async function runCompiled<T>(
  em: EntityManager,
  shape: string,
  values: SlotValues,
  build: (slot: (name: string) => SlotValue) => Buildable,
): Promise<T[]> {
  const platform = em.getPlatform();
  let shapes = cache.get(platform);
  if (!shapes) cache.set(platform, (shapes = new Map()));
  let compiled = shapes.get(shape);
  if (!compiled) {
    compiled = compile(values, build);
    shapes.set(shape, compiled);
  }
  const params = compiled.params.map((p) => {
    if (!('slot' in p)) return p.value;
    if (!(p.slot in values)) throw new Error(`runCompiled(${shape}): no value for the slot "${p.slot}".`);
    return values[p.slot];
  });
  const tx = em.getTransactionContext();
  if (!tx && em.getPlatform() instanceof SqlitePlatform) return runPreparedOnSqlite<T>(em, compiled.sql, params);
  return em.getConnection().execute<T[]>(compiled.sql, params, 'all', tx);
}

/** SQLite statements prepared once per connection (the app has one), by their SQL. */
const prepared = new WeakMap<object, Map<string, Statement>>();

/**
 * Outside a transaction on SQLite: the kept SQL as a prepared statement on the pool's connection.
 * The ORM's execute() writes every value into the SQL text, so SQLite parsed and planned the
 * statement anew on each run, on its one connection that every request waits for. The statement
 * is reported to knex's `query` listeners as the ORM's own are (tests count statements that way).
 */
async function runPreparedOnSqlite<T>(em: EntityManager, sql: string, params: unknown[]): Promise<T[]> {
  const client = em.getKnex().client as KnexClientWithPool;
  const db = (await client.acquireConnection()) as Database;
  try {
    let statements = prepared.get(db);
    if (!statements) {
      prepared.set(db, (statements = new Map()));
      finalizeBeforeClose(client);
    }
    let statement = statements.get(sql);
    if (!statement) statements.set(sql, (statement = db.prepare(sql)));
    client.emit('query', { sql, bindings: params, method: 'select' });
    return await new Promise<T[]>((resolve, reject) =>
      statement.all(params, (err: Error | null, rows: T[]) => {
        if (err) {
          statements.delete(sql);
          reject(err);
        } else resolve(rows);
      }),
    );
  } finally {
    client.releaseConnection(db);
  }
}

interface KnexClientWithPool {
  acquireConnection(): Promise<unknown>;
  releaseConnection(connection: unknown): void;
  destroyRawConnection(connection: unknown): Promise<void>;
  emit(event: 'query', data: { sql: string; bindings: unknown[]; method: string }): void;
}

const finalizing = new WeakSet<object>();

/**
 * SQLite refuses to close a connection that still has prepared statements (SQLITE_BUSY), and knex
 * closes it when the ORM closes (a stop, a test's restart): the connection and its file handle
 * would stay open until the statements were garbage-collected. So the pool's close of a
 * connection first finalizes the statements kept for it.
 */
function finalizeBeforeClose(client: KnexClientWithPool): void {
  if (finalizing.has(client)) return;
  finalizing.add(client);
  const destroy = client.destroyRawConnection.bind(client);
  client.destroyRawConnection = async (connection: unknown) => {
    const statements = prepared.get(connection as object);
    prepared.delete(connection as object);
    if (statements) await Promise.all([...statements.values()].map((st) => new Promise<void>((done) => st.finalize(() => done()))));
    return destroy(connection);
  };
}

/** The ORM's query builder (anything with its knex query), or knex's own for a plain read of a few columns. */
type Buildable = { getKnexQuery(): { toSQL(): Knex.Sql } } | { toSQL(): Knex.Sql };

function compile(values: SlotValues, build: (slot: (name: string) => SlotValue) => Buildable): Compiled {
  const names = Object.keys(values);
  const standIns = new Map<SlotValue, string>();
  names.forEach((name, i) => standIns.set(standIn(typeof values[name] === 'number' ? 'number' : 'string', i), name));
  const byName = new Map([...standIns].map(([v, n]) => [n, v]));
  const qb = build((name) => {
    const v = byName.get(name);
    if (v === undefined) throw new Error(`runCompiled: the query asked for the slot "${name}", which has no value.`);
    return v;
  });
  // knex's own SQL, with `?` for every value on both databases (the query builder's getQuery()
  // numbers them `$1…` on PostgreSQL, which the connection's execute() does not fill in).
  const { sql, bindings } = ('getKnexQuery' in qb ? qb.getKnexQuery() : qb).toSQL();
  if (sql.includes(STRING_MARK) || NUMBER_MARK.test(sql))
    throw new Error('runCompiled: a slot was written into the SQL instead of passed as a value.');
  const params = bindings.map((value) => {
    const slot = standIns.get(value as SlotValue);
    if (slot !== undefined) return { slot };
    if (reshaped(value))
      throw new Error("runCompiled: a slot did not reach the query's parameters unchanged (the query made a new value out of it).");
    return { value };
  });
  return { sql, params };
}

const STRING_MARK = '\u0000sightfan-slot-';
const NUMBER_MARK = /-200000\d{4}/;
/** A parameter made from a stand-in: a string around it, or a number near the stand-ins' range. */
function reshaped(value: unknown): boolean {
  if (typeof value === 'string') return value.includes(STRING_MARK);
  if (typeof value === 'number' || typeof value === 'bigint') return Number(value) <= -1_999_990_000 && Number(value) >= -2_000_010_000;
  return false;
}
