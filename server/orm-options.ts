import path from 'node:path';
import { defineConfig } from '@mikro-orm/sqlite';
import { Migrator } from '@mikro-orm/migrations';
import { entities } from './modules/entities';
import { migrationsList } from './migrations';

/** ORM options for a given SQLite file; used by the app, the CLI config and tests alike. */
export function ormOptions(databasePath: string) {
  return defineConfig({
    dbName: databasePath,
    entities,
    extensions: [Migrator],
    // The schema changes only through committed migrations, never by auto-update at run time.
    migrations: {
      path: path.join(__dirname, 'migrations'),
      pathTs: path.join(__dirname, 'migrations'),
      tableName: 'mikro_orm_migrations',
      transactional: true,
      silent: true,
      allOrNothing: true,
      emit: 'ts',
      snapshot: false,
      glob: 'Migration*.{js,ts}',
      migrationsList,
    },
    forceUtcTimezone: true,
    debug: false,
    allowGlobalContext: false,
  });
}
