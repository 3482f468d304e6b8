import { Migration } from '@mikro-orm/migrations';

/** The transactional outbox: e-mail owed, written with the change that causes it, delivered with retries. */
export class Migration20261202134000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`outgoing_mail\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`organization_id\` integer not null, \`kind\` text check (\`kind\` in ('invitation', 'password-reset', 'password-changed', 'sheet')) not null, \`to_address\` text not null, \`subject\` text not null, \`text\` text not null, \`attachments\` json not null, \`status\` text check (\`status\` in ('queued', 'sending', 'sent', 'failed')) not null default 'queued', \`attempts\` integer not null default 0, \`next_attempt_at\` datetime not null, \`last_error\` text null, \`sent_at\` datetime null, constraint \`outgoing_mail_organization_id_foreign\` foreign key(\`organization_id\`) references \`organization\`(\`id\`) on delete cascade on update cascade);`,
    );
    this.addSql(`create index \`outgoing_mail_organization_id_index\` on \`outgoing_mail\` (\`organization_id\`);`);
    this.addSql(`create index \`outgoing_mail_status_next_attempt_at_index\` on \`outgoing_mail\` (\`status\`, \`next_attempt_at\`);`);
  }
}
