import { Migration } from '@mikro-orm/migrations';

/**
 * The project list of a reviewer or admin: one organisation's jobs, most recently changed first,
 * read from one index. (SQLite already indexes every foreign key the list and its counts use; the
 * PostgreSQL twin adds those too.) Written by hand: the generator rebuilds `project` around its
 * enum checks (footgun 4).
 */
export class Migration20261202223000 extends Migration {
  override async up(): Promise<void> {
    this.addSql('create index `project_organization_id_updated_at_index` on `project` (`organization_id`, `updated_at`);');
  }
}
