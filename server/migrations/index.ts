/**
 * The committed migrations, listed explicitly so they load the same under tsx, ts-jest and a
 * bundled build (no folder scanning at run time). Add each new migration here, in order.
 */
import type { MigrationObject } from '@mikro-orm/core';
import { Migration20261202022227 } from './Migration20261202022227';
import { Migration20261202030218 } from './Migration20261202030218';
import { Migration20261202032324 } from './Migration20261202032324';
import { Migration20261202133000 } from './Migration20261202133000';
import { Migration20261202134000 } from './Migration20261202134000';
import { Migration20261202135000 } from './Migration20261202135000';
import { Migration20261202140000 } from './Migration20261202140000';
import { Migration20261202160000 } from './Migration20261202160000';
import { Migration20261202161000 } from './Migration20261202161000';
import { Migration20261202170000 } from './Migration20261202170000';
import { Migration20261202171000 } from './Migration20261202171000';
import { Migration20261202220000 } from './Migration20261202220000';
import { Migration20261202223000 } from './Migration20261202223000';

export const migrationsList: MigrationObject[] = [
  { name: 'Migration20261202022227', class: Migration20261202022227 },
  { name: 'Migration20261202030218', class: Migration20261202030218 },
  { name: 'Migration20261202032324', class: Migration20261202032324 },
  { name: 'Migration20261202133000', class: Migration20261202133000 },
  { name: 'Migration20261202134000', class: Migration20261202134000 },
  { name: 'Migration20261202135000', class: Migration20261202135000 },
  { name: 'Migration20261202140000', class: Migration20261202140000 },
  { name: 'Migration20261202160000', class: Migration20261202160000 },
  { name: 'Migration20261202161000', class: Migration20261202161000 },
  { name: 'Migration20261202170000', class: Migration20261202170000 },
  { name: 'Migration20261202171000', class: Migration20261202171000 },
  { name: 'Migration20261202220000', class: Migration20261202220000 },
  { name: 'Migration20261202223000', class: Migration20261202223000 },
];
