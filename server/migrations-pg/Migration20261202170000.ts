import { Migration } from '@mikro-orm/migrations';

/** Rate-limit counters every instance shares (PostgreSQL twin of the SQLite migration of the same name). */
export class Migration20261202170000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "rate_limit" ("key" varchar(255) not null, "points" int not null, "expires_at_ms" bigint not null, constraint "rate_limit_pkey" primary key ("key"));`,
    );
    this.addSql(`create index "rate_limit_expires_at_ms_index" on "rate_limit" ("expires_at_ms");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "rate_limit" cascade;`);
  }
}
