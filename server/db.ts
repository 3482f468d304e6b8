import fs from 'node:fs';
import path from 'node:path';
import { MikroORM } from '@mikro-orm/core';
import type { AbstractSqlDriver, SqlEntityManager } from '@mikro-orm/knex';
import { MikroORM as SqliteORM } from '@mikro-orm/sqlite';
import { MikroORM as PostgresORM, PostgreSqlPlatform } from '@mikro-orm/postgresql';
import { asTarget, postgresOptions, sqliteOptions, type DatabaseTarget } from './orm-options';

/** The ORM over either database; code that holds one never asks which. */
export type Orm = MikroORM<AbstractSqlDriver, SqlEntityManager>;

/** Opens the database without migrating (the backup tools, the migration tests). */
export async function openORM(target: DatabaseTarget | string, extra: { allowGlobalContext?: boolean } = {}): Promise<Orm> {
  const t = asTarget(target);
  if (t.kind === 'postgresql') {
    return (await PostgresORM.init({ ...postgresOptions(t.url), ...extra })) as unknown as Orm;
  }
  fs.mkdirSync(path.dirname(t.path), { recursive: true });
  const orm = (await SqliteORM.init({ ...sqliteOptions(t.path), ...extra })) as unknown as Orm;
  // SQLite-only settings live here and nowhere else: queries are the same on both databases.
  const conn = orm.em.getConnection();
  await conn.execute('PRAGMA journal_mode = WAL');
  await conn.execute('PRAGMA foreign_keys = ON');
  await conn.execute('PRAGMA busy_timeout = 5000');
  return orm;
}

/** Any fixed number: the PostgreSQL advisory lock instances take while they migrate and seed. */
const STARTUP_LOCK = 0x5167_6661;

/**
 * Runs `work` (migrations, the demo seed) while no other instance does: on PostgreSQL under an
 * advisory lock held by a transaction on its own connection, so two instances started together do
 * not both create the same tables. SQLite is one process's file: the work just runs.
 */
export async function underStartupLock<T>(orm: Orm, work: () => Promise<T>): Promise<T> {
  if (!(orm.em.getPlatform() instanceof PostgreSqlPlatform)) return work();
  return orm.em.getKnex().transaction(async (trx) => {
    await trx.raw('select pg_advisory_xact_lock(?)', [STARTUP_LOCK]);
    return work();
  });
}

/**
 * Opens the database (a SQLite file, creating its folder, with WAL and foreign keys on; or
 * PostgreSQL) and applies every pending migration of its set. The schema is never auto-updated.
 */
export async function initORM(target: DatabaseTarget | string): Promise<Orm> {
  const orm = await openORM(target);
  await underStartupLock(orm, () => orm.getMigrator().up());
  return orm;
}
