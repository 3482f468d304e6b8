import { Migration } from '@mikro-orm/migrations';

/** A vehicle mirror's class and the fields it counts toward (null on site mirrors). */
export class Migration20261202161000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table \`placement\` add column \`mirror_class\` text check (\`mirror_class\` in ('II', 'III', 'IV', 'V', 'VI')) null;`,
    );
    this.addSql(`alter table \`placement\` add column \`serves_field_ids\` json null;`);
  }
}
