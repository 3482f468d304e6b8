/**
 * PostgreSQL's migrations, listed explicitly like SQLite's (server/migrations/index.ts). The set
 * starts at the schema SQLite reaches with Migration20261202161000 (one migration creates it all);
 * after that, every SQLite migration gets a PostgreSQL twin of the same name, added here.
 */
import type { MigrationObject } from '@mikro-orm/core';
import { Migration20261202161000 } from './Migration20261202161000';
import { Migration20261202170000 } from './Migration20261202170000';
import { Migration20261202171000 } from './Migration20261202171000';
import { Migration20261202220000 } from './Migration20261202220000';
import { Migration20261202223000 } from './Migration20261202223000';

export const pgMigrationsList: MigrationObject[] = [
  { name: 'Migration20261202161000', class: Migration20261202161000 },
  { name: 'Migration20261202170000', class: Migration20261202170000 },
  { name: 'Migration20261202171000', class: Migration20261202171000 },
  { name: 'Migration20261202220000', class: Migration20261202220000 },
  { name: 'Migration20261202223000', class: Migration20261202223000 },
];
