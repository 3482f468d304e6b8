import path from 'node:path';
import { defineConfig as defineSqliteConfig } from '@mikro-orm/sqlite';
import { defineConfig as definePostgresConfig } from '@mikro-orm/postgresql';
import { Migrator } from '@mikro-orm/migrations';
import { entities } from './modules/entities';
import { migrationsList } from './migrations';
import { pgMigrationsList } from './migrations-pg';
import { SightfanPostgreSqlDriver } from './postgres-driver';

/**
 * Where the data lives: a SQLite file (the embedded default) or a PostgreSQL database named by a
 * `postgresql://` URL. Everything else (entities, queries, routes) is the same for both.
 */
export type DatabaseTarget = { kind: 'sqlite'; path: string } | { kind: 'postgresql'; url: string };

/** A SQLite path as a target; a target as itself. */
export function asTarget(target: DatabaseTarget | string): DatabaseTarget {
  return typeof target === 'string' ? { kind: 'sqlite', path: target } : target;
}

function migrationOptions(folder: string) {
  return {
    path: path.join(__dirname, folder),
    pathTs: path.join(__dirname, folder),
    tableName: 'mikro_orm_migrations',
    transactional: true,
    silent: true,
    allOrNothing: true,
    emit: 'ts' as const,
    snapshot: false,
    glob: 'Migration*.{js,ts}',
  };
}

/** ORM options for a SQLite file; used by the app, the CLI config and tests alike. */
export function sqliteOptions(databasePath: string) {
  return defineSqliteConfig({
    dbName: databasePath,
    entities,
    extensions: [Migrator],
    // The schema changes only through committed migrations, never by auto-update at run time.
    migrations: { ...migrationOptions('migrations'), migrationsList },
    forceUtcTimezone: true,
    debug: false,
    allowGlobalContext: false,
  });
}

/** ORM options for PostgreSQL: the same entities, its own migration set (server/migrations-pg). */
export function postgresOptions(url: string) {
  return definePostgresConfig({
    driver: SightfanPostgreSqlDriver,
    clientUrl: url,
    entities,
    extensions: [Migrator],
    migrations: { ...migrationOptions('migrations-pg'), migrationsList: pgMigrationsList },
    forceUtcTimezone: true,
    debug: false,
    allowGlobalContext: false,
    pool: { min: 0, max: 10 },
  });
}

/** @deprecated name kept for callers that only know SQLite: options for a SQLite file. */
export const ormOptions = sqliteOptions;
