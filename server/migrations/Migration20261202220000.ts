import { Migration } from '@mikro-orm/migrations';

/** Uploaded plans and photos of a job: what the API knows of each file (the bytes are in the storage backend). */
export class Migration20261202220000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      "create table `stored_file` (`id` text not null, `project_id` integer not null, `kind` text check (`kind` in ('plan', 'photo')) not null, `content_type` text not null, `bytes` integer not null, `name` text not null, `width_px` integer not null, `height_px` integer not null, `placement_id` integer null, `source_page` integer null, `source_pages` integer null, `storage_key` text not null, `thumbnail_key` text not null, `created_at` datetime not null, `created_by_id` integer null, constraint `stored_file_project_id_foreign` foreign key(`project_id`) references `project`(`id`) on delete cascade on update cascade, constraint `stored_file_placement_id_foreign` foreign key(`placement_id`) references `placement`(`id`) on delete cascade on update cascade, constraint `stored_file_created_by_id_foreign` foreign key(`created_by_id`) references `user`(`id`) on delete set null on update cascade, primary key (`id`));",
    );
    this.addSql('create index `stored_file_project_id_index` on `stored_file` (`project_id`);');
    this.addSql('create index `stored_file_placement_id_index` on `stored_file` (`placement_id`);');
    this.addSql('create index `stored_file_created_by_id_index` on `stored_file` (`created_by_id`);');
  }

  override async down(): Promise<void> {
    this.addSql('drop table if exists `stored_file`;');
  }
}
