import { Migration } from '@mikro-orm/migrations';

/** Issued sheet content kept with each revision; the evaluation cache keyed by input hash. */
export class Migration20261202140000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table \`sheet_revision\` add column \`content\` text null;`);
    this.addSql(
      `create table \`sheet_evaluation\` (\`input_hash\` text not null, \`content\` text not null, \`content_hash\` text not null, \`used_at\` datetime not null, primary key (\`input_hash\`));`,
    );
    this.addSql(`create index \`sheet_evaluation_used_at_index\` on \`sheet_evaluation\` (\`used_at\`);`);
  }
}
