import { Migration } from '@mikro-orm/migrations';

export class Migration20261202032324 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`sheet_revision\` (\`id\` integer not null primary key autoincrement, \`project_id\` integer not null, \`number\` integer not null, \`content_hash\` text not null, \`issued_at\` datetime not null, \`issued_by_id\` integer not null, constraint \`sheet_revision_project_id_foreign\` foreign key(\`project_id\`) references \`project\`(\`id\`) on delete cascade on update cascade, constraint \`sheet_revision_issued_by_id_foreign\` foreign key(\`issued_by_id\`) references \`user\`(\`id\`) on update cascade);`,
    );
    this.addSql(`create index \`sheet_revision_project_id_index\` on \`sheet_revision\` (\`project_id\`);`);
    this.addSql(`create index \`sheet_revision_issued_by_id_index\` on \`sheet_revision\` (\`issued_by_id\`);`);
    this.addSql(`create unique index \`sheet_revision_project_id_number_unique\` on \`sheet_revision\` (\`project_id\`, \`number\`);`);
  }
}
