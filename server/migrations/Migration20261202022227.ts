import { Migration } from '@mikro-orm/migrations';

export class Migration20261202022227 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`mail_message\` (\`id\` integer not null primary key autoincrement, \`from_address\` text not null, \`to_addresses\` json not null, \`subject\` text not null, \`text\` text not null, \`attachments\` json not null, \`raw\` text not null, \`received_at\` datetime not null);`,
    );

    this.addSql(
      `create table \`organization\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`name\` text not null, \`demo\` integer not null default false);`,
    );

    this.addSql(
      `create table \`session\` (\`sid\` text not null, \`data\` text not null, \`user_id\` integer null, \`expires_at\` datetime not null, primary key (\`sid\`));`,
    );
    this.addSql(`create index \`session_user_id_index\` on \`session\` (\`user_id\`);`);
    this.addSql(`create index \`session_expires_at_index\` on \`session\` (\`expires_at\`);`);

    this.addSql(
      `create table \`user\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`organization_id\` integer not null, \`email\` text not null, \`name\` text not null, \`password_hash\` text null, \`role\` text check (\`role\` in ('installer', 'reviewer', 'admin')) not null, \`disabled\` integer not null default false, \`units\` text check (\`units\` in ('metric', 'imperial')) not null default 'metric', constraint \`user_organization_id_foreign\` foreign key(\`organization_id\`) references \`organization\`(\`id\`) on update cascade);`,
    );
    this.addSql(`create index \`user_organization_id_index\` on \`user\` (\`organization_id\`);`);
    this.addSql(`create unique index \`user_email_unique\` on \`user\` (\`email\`);`);

    this.addSql(
      `create table \`invitation\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`user_id\` integer not null, \`token_hash\` text not null, \`expires_at\` datetime not null, \`used_at\` datetime null, constraint \`invitation_user_id_foreign\` foreign key(\`user_id\`) references \`user\`(\`id\`) on delete cascade on update cascade);`,
    );
    this.addSql(`create index \`invitation_user_id_index\` on \`invitation\` (\`user_id\`);`);
    this.addSql(`create unique index \`invitation_token_hash_unique\` on \`invitation\` (\`token_hash\`);`);
  }
}
