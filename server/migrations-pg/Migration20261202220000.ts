import { Migration } from '@mikro-orm/migrations';

/** Twin of the SQLite migration of the same name: uploaded plans and photos of a job. */
export class Migration20261202220000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "stored_file" ("id" varchar(32) not null, "project_id" int not null, "kind" text check ("kind" in ('plan', 'photo')) not null, "content_type" varchar(40) not null, "bytes" int not null, "name" varchar(200) not null, "width_px" int not null, "height_px" int not null, "placement_id" int null, "source_page" int null, "source_pages" int null, "storage_key" varchar(100) not null, "thumbnail_key" varchar(100) not null, "created_at" timestamptz not null, "created_by_id" int null, constraint "stored_file_pkey" primary key ("id"));`,
    );
    this.addSql(
      `alter table "stored_file" add constraint "stored_file_project_id_foreign" foreign key ("project_id") references "project" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "stored_file" add constraint "stored_file_placement_id_foreign" foreign key ("placement_id") references "placement" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "stored_file" add constraint "stored_file_created_by_id_foreign" foreign key ("created_by_id") references "user" ("id") on update cascade on delete set null;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "stored_file" cascade;`);
  }
}
