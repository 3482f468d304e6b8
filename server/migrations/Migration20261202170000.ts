import { Migration } from '@mikro-orm/migrations';

/**
 * Rate-limit counters (sign-in attempts, reset e-mails) move from one process's memory to the
 * database, so every instance counts the same attempts. Its PostgreSQL twin has the same name in
 * server/migrations-pg.
 */
export class Migration20261202170000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`rate_limit\` (\`key\` text not null, \`points\` integer not null, \`expires_at_ms\` bigint not null, primary key (\`key\`));`,
    );
    this.addSql(`create index \`rate_limit_expires_at_ms_index\` on \`rate_limit\` (\`expires_at_ms\`);`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists \`rate_limit\`;`);
  }
}
