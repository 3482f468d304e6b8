import fs from 'node:fs';
import path from 'node:path';
import { MikroORM } from '@mikro-orm/sqlite';
import { ormOptions } from './orm-options';

export type Orm = MikroORM;

/**
 * Opens the SQLite file (creating its folder), turns on WAL and foreign keys, and applies every
 * pending migration. The schema is never auto-updated.
 */
export async function initORM(databasePath: string): Promise<Orm> {
  fs.mkdirSync(path.dirname(databasePath), { recursive: true });
  const orm = await MikroORM.init(ormOptions(databasePath));
  const conn = orm.em.getConnection();
  await conn.execute('PRAGMA journal_mode = WAL');
  await conn.execute('PRAGMA foreign_keys = ON');
  await conn.execute('PRAGMA busy_timeout = 5000');
  await orm.getMigrator().up();
  return orm;
}
