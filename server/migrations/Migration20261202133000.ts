import { Migration } from '@mikro-orm/migrations';

/**
 * Catalogue items belong to an organisation; the demo set (organisation null) is shared and
 * read-only. Codes become unique per owner. Written by hand: the generator would rebuild
 * `mirror_model` (it has enum checks), which cascades into placements (see DEVELOPERS.md).
 */
export class Migration20261202133000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table \`mirror_model\` add column \`organization_id\` integer null constraint \`mirror_model_organization_id_foreign\` references \`organization\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(`create index \`mirror_model_organization_id_index\` on \`mirror_model\` (\`organization_id\`);`);
    // Items an administrator added so far belong to the organisation there was (the first one).
    this.addSql(`update \`mirror_model\` set \`organization_id\` = (select min(\`id\`) from \`organization\`) where \`demo\` = 0;`);
    this.addSql(`drop index if exists \`mirror_model_code_unique\`;`);
    this.addSql(`create unique index \`mirror_model_organization_id_code_unique\` on \`mirror_model\` (\`organization_id\`, \`code\`);`);
  }
}
