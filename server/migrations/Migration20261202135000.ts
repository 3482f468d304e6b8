import { Migration } from '@mikro-orm/migrations';

/** One-time links serve invitations and password resets alike. */
export class Migration20261202135000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table \`invitation\` add column \`purpose\` text check (\`purpose\` in ('invite', 'reset')) not null default 'invite';`,
    );
  }
}
