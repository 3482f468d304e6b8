import { Migration } from '@mikro-orm/migrations';

/**
 * Twin of the SQLite migration of the same name: the list's index (one organisation's jobs by last
 * change), and the foreign-key indexes SQLite made with its tables but PostgreSQL does not make by
 * itself — without them the project list's filters and its per-project counts, and a job's
 * mirrors, are read by scanning whole tables.
 */
export class Migration20261202223000 extends Migration {
  override async up(): Promise<void> {
    this.addSql('create index "project_owner_id_index" on "project" ("owner_id");');
    this.addSql('create index "project_organization_id_index" on "project" ("organization_id");');
    this.addSql('create index "project_organization_id_updated_at_index" on "project" ("organization_id", "updated_at");');
    this.addSql('create index "project_comment_project_id_index" on "project_comment" ("project_id");');
    this.addSql('create index "placement_project_id_index" on "placement" ("project_id");');
  }
}
