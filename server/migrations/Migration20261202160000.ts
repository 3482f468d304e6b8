import { Migration } from '@mikro-orm/migrations';

/**
 * The review loop: a job's `state` replaces `status` (every existing job, all 'draft', becomes
 * 'drawing_up'), the reviewer it was sent to and its approval; comments; the append-only audit log,
 * which the database itself refuses to change or delete (triggers); the outbox learns the 'review'
 * kind of e-mail (its check is rebuilt: no table refers to outgoing_mail, so the copy is safe).
 */
export class Migration20261202160000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table \`project\` add column \`state\` text check (\`state\` in ('drawing_up', 'with_reviewer', 'approved', 'returned')) not null default 'drawing_up';`,
    );
    this.addSql(`update \`project\` set \`state\` = 'drawing_up';`);
    this.addSql(`alter table \`project\` drop column \`status\`;`);
    this.addSql(
      `alter table \`project\` add column \`reviewer_id\` integer null constraint \`project_reviewer_id_foreign\` references \`user\` (\`id\`) on update cascade on delete set null;`,
    );
    this.addSql(`alter table \`project\` add column \`sent_at\` datetime null;`);
    this.addSql(
      `alter table \`project\` add column \`approved_by_id\` integer null constraint \`project_approved_by_id_foreign\` references \`user\` (\`id\`) on update cascade on delete set null;`,
    );
    this.addSql(`alter table \`project\` add column \`approved_by_name\` text null;`);
    this.addSql(`alter table \`project\` add column \`approved_by_role\` text null;`);
    this.addSql(`alter table \`project\` add column \`approved_at\` datetime null;`);
    this.addSql(`alter table \`project\` add column \`approved_revision\` integer null;`);
    this.addSql(`alter table \`project\` add column \`approved_hash\` text null;`);
    this.addSql(`create index \`project_reviewer_id_index\` on \`project\` (\`reviewer_id\`);`);
    this.addSql(`create index \`project_approved_by_id_index\` on \`project\` (\`approved_by_id\`);`);
    this.addSql(`create index \`project_state_index\` on \`project\` (\`state\`);`);

    this.addSql(
      `create table \`project_comment\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`project_id\` integer not null, \`parent_id\` integer null, \`author_id\` integer not null, \`body\` text not null, \`pin\` json not null, \`is_return_reason\` integer not null default false, \`resolved\` integer not null default false, constraint \`project_comment_project_id_foreign\` foreign key(\`project_id\`) references \`project\`(\`id\`) on delete cascade on update cascade, constraint \`project_comment_parent_id_foreign\` foreign key(\`parent_id\`) references \`project_comment\`(\`id\`) on delete cascade on update cascade, constraint \`project_comment_author_id_foreign\` foreign key(\`author_id\`) references \`user\`(\`id\`) on update cascade);`,
    );
    this.addSql(`create index \`project_comment_project_id_index\` on \`project_comment\` (\`project_id\`);`);
    this.addSql(`create index \`project_comment_parent_id_index\` on \`project_comment\` (\`parent_id\`);`);
    this.addSql(`create index \`project_comment_author_id_index\` on \`project_comment\` (\`author_id\`);`);

    this.addSql(
      `create table \`project_event\` (\`id\` integer not null primary key autoincrement, \`project_id\` integer not null, \`kind\` text check (\`kind\` in ('created', 'changed', 'placement_added', 'placement_changed', 'placement_removed', 'sent', 'reassigned', 'commented', 'comment_resolved', 'approved', 'returned', 'approval_withdrawn', 'sheet_issued', 'sheet_emailed')) not null, \`actor_id\` integer null, \`actor_name\` text not null, \`at\` datetime not null, \`summary\` text not null, \`changes\` json not null, \`detail\` json not null);`,
    );
    this.addSql(`create index \`project_event_project_id_index\` on \`project_event\` (\`project_id\`);`);
    this.addSql(
      `create trigger \`project_event_no_update\` before update on \`project_event\` begin select raise(abort, 'project_event is append-only'); end;`,
    );
    this.addSql(
      `create trigger \`project_event_no_delete\` before delete on \`project_event\` begin select raise(abort, 'project_event is append-only'); end;`,
    );

    this.addSql(
      `create table \`outgoing_mail__temp_alter\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`organization_id\` integer not null, \`kind\` text check (\`kind\` in ('invitation', 'password-reset', 'password-changed', 'sheet', 'review')) not null, \`to_address\` text not null, \`subject\` text not null, \`text\` text not null, \`attachments\` json not null, \`status\` text check (\`status\` in ('queued', 'sending', 'sent', 'failed')) not null default 'queued', \`attempts\` integer not null default 0, \`next_attempt_at\` datetime not null, \`last_error\` text null, \`sent_at\` datetime null, constraint \`outgoing_mail_organization_id_foreign\` foreign key(\`organization_id\`) references \`organization\`(\`id\`) on delete cascade on update cascade);`,
    );
    this.addSql(
      `insert into \`outgoing_mail__temp_alter\` select \`id\`, \`created_at\`, \`updated_at\`, \`organization_id\`, \`kind\`, \`to_address\`, \`subject\`, \`text\`, \`attachments\`, \`status\`, \`attempts\`, \`next_attempt_at\`, \`last_error\`, \`sent_at\` from \`outgoing_mail\`;`,
    );
    this.addSql(`drop table \`outgoing_mail\`;`);
    this.addSql(`alter table \`outgoing_mail__temp_alter\` rename to \`outgoing_mail\`;`);
    this.addSql(`create index \`outgoing_mail_organization_id_index\` on \`outgoing_mail\` (\`organization_id\`);`);
    this.addSql(`create index \`outgoing_mail_status_next_attempt_at_index\` on \`outgoing_mail\` (\`status\`, \`next_attempt_at\`);`);
  }
}
