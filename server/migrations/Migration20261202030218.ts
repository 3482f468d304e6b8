import { Migration } from '@mikro-orm/migrations';

export class Migration20261202030218 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`mirror_model\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`code\` text not null, \`name\` text not null, \`shape\` text check (\`shape\` in ('round', 'rect', 'dome')) not null, \`dome_portion\` text check (\`dome_portion\` in ('full', 'half', 'quarter')) null, \`diameter_m\` real null, \`width_m\` real null, \`height_m\` real null, \`radius_m\` real null, \`material\` text not null default '', \`reflectance\` real null, \`mass_kg\` real null, \`unit_price_minor\` integer not null, \`currency\` text not null, \`notes\` text not null default '', \`active\` integer not null default true, \`demo\` integer not null default false, \`version\` integer not null default 1);`,
    );
    this.addSql(`create unique index \`mirror_model_code_unique\` on \`mirror_model\` (\`code\`);`);

    this.addSql(
      `create table \`project\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`owner_id\` integer not null, \`organization_id\` integer not null, \`name\` text not null, \`customer\` text not null default '', \`site\` text not null default '', \`kind\` text check (\`kind\` in ('site', 'vehicle')) not null default 'site', \`units\` text check (\`units\` in ('metric', 'imperial')) null, \`notes\` text not null default '', \`status\` text check (\`status\` in ('draft')) not null default 'draft', \`scene\` json not null, \`version\` integer not null default 1, \`demo\` integer not null default false, constraint \`project_owner_id_foreign\` foreign key(\`owner_id\`) references \`user\`(\`id\`) on update cascade, constraint \`project_organization_id_foreign\` foreign key(\`organization_id\`) references \`organization\`(\`id\`) on update cascade);`,
    );
    this.addSql(`create index \`project_owner_id_index\` on \`project\` (\`owner_id\`);`);
    this.addSql(`create index \`project_organization_id_index\` on \`project\` (\`organization_id\`);`);

    this.addSql(
      `create table \`placement\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`project_id\` integer not null, \`label\` text not null, \`catalogue_item_id\` integer null, \`custom_mirror\` json null, \`x_m\` real not null, \`y_m\` real not null, \`height_m\` real not null, \`azimuth_rad\` real not null, \`tilt_down_rad\` real not null, \`viewer_id\` text null, \`notes\` text not null default '', \`version\` integer not null default 1, constraint \`placement_project_id_foreign\` foreign key(\`project_id\`) references \`project\`(\`id\`) on delete cascade on update cascade, constraint \`placement_catalogue_item_id_foreign\` foreign key(\`catalogue_item_id\`) references \`mirror_model\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`placement_project_id_index\` on \`placement\` (\`project_id\`);`);
    this.addSql(`create index \`placement_catalogue_item_id_index\` on \`placement\` (\`catalogue_item_id\`);`);
  }
}
