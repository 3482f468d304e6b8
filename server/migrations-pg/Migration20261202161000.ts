import { Migration } from '@mikro-orm/migrations';

/**
 * PostgreSQL starts here: the whole schema as SQLite has it after its migrations up to this same
 * name (written from the schema generator, then checked by tests/server/schema-in-step.test.ts),
 * with the audit log's append-only rule as a trigger function, as SQLite's Migration20261202160000
 * has it.
 */
export class Migration20261202161000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "mail_message" ("id" serial primary key, "from_address" varchar(320) not null, "to_addresses" jsonb not null, "subject" varchar(998) not null, "text" text not null, "attachments" jsonb not null, "raw" text not null, "received_at" timestamptz not null);`,
    );
    this.addSql(
      `create table "organization" ("id" serial primary key, "created_at" timestamptz not null, "updated_at" timestamptz not null, "name" varchar(200) not null, "demo" boolean not null default false);`,
    );
    this.addSql(
      `create table "mirror_model" ("id" serial primary key, "created_at" timestamptz not null, "updated_at" timestamptz not null, "organization_id" int null, "code" varchar(40) not null, "name" varchar(160) not null, "shape" text check ("shape" in ('round', 'rect', 'dome')) not null, "dome_portion" text check ("dome_portion" in ('full', 'half', 'quarter')) null, "diameter_m" double precision null, "width_m" double precision null, "height_m" double precision null, "radius_m" double precision null, "material" varchar(80) not null default '', "reflectance" double precision null, "mass_kg" double precision null, "unit_price_minor" int not null, "currency" varchar(3) not null, "notes" text not null default '', "active" boolean not null default true, "demo" boolean not null default false, "version" int not null default 1);`,
    );
    this.addSql(`alter table "mirror_model" add constraint "mirror_model_organization_id_code_unique" unique ("organization_id", "code");`);
    this.addSql(
      `create table "outgoing_mail" ("id" serial primary key, "created_at" timestamptz not null, "updated_at" timestamptz not null, "organization_id" int not null, "kind" text check ("kind" in ('invitation', 'password-reset', 'password-changed', 'sheet', 'review')) not null, "to_address" varchar(320) not null, "subject" varchar(998) not null, "text" text not null, "attachments" jsonb not null, "status" text check ("status" in ('queued', 'sending', 'sent', 'failed')) not null default 'queued', "attempts" int not null default 0, "next_attempt_at" timestamptz not null, "last_error" varchar(300) null, "sent_at" timestamptz null);`,
    );
    this.addSql(`create index "outgoing_mail_status_next_attempt_at_index" on "outgoing_mail" ("status", "next_attempt_at");`);
    this.addSql(
      `create table "project_event" ("id" serial primary key, "project_id" int not null, "kind" text check ("kind" in ('created', 'changed', 'placement_added', 'placement_changed', 'placement_removed', 'sent', 'reassigned', 'commented', 'comment_resolved', 'approved', 'returned', 'approval_withdrawn', 'sheet_issued', 'sheet_emailed')) not null, "actor_id" int null, "actor_name" varchar(120) not null, "at" timestamptz not null, "summary" text not null, "changes" jsonb not null, "detail" jsonb not null);`,
    );
    this.addSql(`create index "project_event_project_id_index" on "project_event" ("project_id");`);
    this.addSql(
      `create table "session" ("sid" varchar(128) not null, "data" text not null, "user_id" int null, "expires_at" timestamptz not null, constraint "session_pkey" primary key ("sid"));`,
    );
    this.addSql(`create index "session_user_id_index" on "session" ("user_id");`);
    this.addSql(`create index "session_expires_at_index" on "session" ("expires_at");`);
    this.addSql(
      `create table "sheet_evaluation" ("input_hash" varchar(64) not null, "content" text not null, "content_hash" varchar(64) not null, "used_at" timestamptz not null, constraint "sheet_evaluation_pkey" primary key ("input_hash"));`,
    );
    this.addSql(`create index "sheet_evaluation_used_at_index" on "sheet_evaluation" ("used_at");`);
    this.addSql(
      `create table "user" ("id" serial primary key, "created_at" timestamptz not null, "updated_at" timestamptz not null, "organization_id" int not null, "email" varchar(254) not null, "name" varchar(120) not null, "password_hash" varchar(100) null, "role" text check ("role" in ('installer', 'reviewer', 'admin')) not null, "disabled" boolean not null default false, "units" text check ("units" in ('metric', 'imperial')) not null default 'metric');`,
    );
    this.addSql(`alter table "user" add constraint "user_email_unique" unique ("email");`);
    this.addSql(
      `create table "project" ("id" serial primary key, "created_at" timestamptz not null, "updated_at" timestamptz not null, "owner_id" int not null, "organization_id" int not null, "name" varchar(80) not null, "customer" varchar(160) not null default '', "site" varchar(200) not null default '', "kind" text check ("kind" in ('site', 'vehicle')) not null default 'site', "units" text check ("units" in ('metric', 'imperial')) null, "notes" text not null default '', "state" text check ("state" in ('drawing_up', 'with_reviewer', 'approved', 'returned')) not null default 'drawing_up', "reviewer_id" int null, "sent_at" timestamptz null, "approved_by_id" int null, "approved_by_name" varchar(120) null, "approved_by_role" varchar(40) null, "approved_at" timestamptz null, "approved_revision" int null, "approved_hash" varchar(64) null, "scene" jsonb not null, "version" int not null default 1, "demo" boolean not null default false);`,
    );
    this.addSql(`create index "project_state_index" on "project" ("state");`);
    this.addSql(
      `create table "sheet_revision" ("id" serial primary key, "project_id" int not null, "number" int not null, "content_hash" varchar(64) not null, "issued_at" timestamptz not null, "issued_by_id" int not null, "content" text null, "units" text check ("units" in ('metric', 'imperial')) null);`,
    );
    this.addSql(`alter table "sheet_revision" add constraint "sheet_revision_project_id_number_unique" unique ("project_id", "number");`);
    this.addSql(
      `create table "project_comment" ("id" serial primary key, "created_at" timestamptz not null, "updated_at" timestamptz not null, "project_id" int not null, "parent_id" int null, "author_id" int not null, "body" text not null, "pin" jsonb not null, "is_return_reason" boolean not null default false, "resolved" boolean not null default false);`,
    );
    this.addSql(
      `create table "placement" ("id" serial primary key, "created_at" timestamptz not null, "updated_at" timestamptz not null, "project_id" int not null, "label" varchar(80) not null, "catalogue_item_id" int null, "custom_mirror" jsonb null, "x_m" double precision not null, "y_m" double precision not null, "height_m" double precision not null, "azimuth_rad" double precision not null, "tilt_down_rad" double precision not null, "viewer_id" varchar(40) null, "notes" text not null default '', "mirror_class" text check ("mirror_class" in ('II', 'III', 'IV', 'V', 'VI')) null, "serves_field_ids" jsonb null, "version" int not null default 1);`,
    );
    this.addSql(
      `create table "invitation" ("id" serial primary key, "created_at" timestamptz not null, "updated_at" timestamptz not null, "user_id" int not null, "purpose" text check ("purpose" in ('invite', 'reset')) not null default 'invite', "token_hash" varchar(64) not null, "expires_at" timestamptz not null, "used_at" timestamptz null);`,
    );
    this.addSql(`alter table "invitation" add constraint "invitation_token_hash_unique" unique ("token_hash");`);
    this.addSql(
      `alter table "mirror_model" add constraint "mirror_model_organization_id_foreign" foreign key ("organization_id") references "organization" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "outgoing_mail" add constraint "outgoing_mail_organization_id_foreign" foreign key ("organization_id") references "organization" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "user" add constraint "user_organization_id_foreign" foreign key ("organization_id") references "organization" ("id") on update cascade;`,
    );
    this.addSql(
      `alter table "project" add constraint "project_owner_id_foreign" foreign key ("owner_id") references "user" ("id") on update cascade;`,
    );
    this.addSql(
      `alter table "project" add constraint "project_organization_id_foreign" foreign key ("organization_id") references "organization" ("id") on update cascade;`,
    );
    this.addSql(
      `alter table "project" add constraint "project_reviewer_id_foreign" foreign key ("reviewer_id") references "user" ("id") on update cascade on delete set null;`,
    );
    this.addSql(
      `alter table "project" add constraint "project_approved_by_id_foreign" foreign key ("approved_by_id") references "user" ("id") on update cascade on delete set null;`,
    );
    this.addSql(
      `alter table "sheet_revision" add constraint "sheet_revision_project_id_foreign" foreign key ("project_id") references "project" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "sheet_revision" add constraint "sheet_revision_issued_by_id_foreign" foreign key ("issued_by_id") references "user" ("id") on update cascade;`,
    );
    this.addSql(
      `alter table "project_comment" add constraint "project_comment_project_id_foreign" foreign key ("project_id") references "project" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "project_comment" add constraint "project_comment_parent_id_foreign" foreign key ("parent_id") references "project_comment" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "project_comment" add constraint "project_comment_author_id_foreign" foreign key ("author_id") references "user" ("id") on update cascade;`,
    );
    this.addSql(
      `alter table "placement" add constraint "placement_project_id_foreign" foreign key ("project_id") references "project" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "placement" add constraint "placement_catalogue_item_id_foreign" foreign key ("catalogue_item_id") references "mirror_model" ("id") on update cascade on delete set null;`,
    );
    this.addSql(
      `alter table "invitation" add constraint "invitation_user_id_foreign" foreign key ("user_id") references "user" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `create function "project_event_append_only"() returns trigger language plpgsql as $$ begin raise exception 'project_event is append-only'; end; $$;`,
    );
    this.addSql(
      `create trigger "project_event_no_update" before update on "project_event" for each row execute function "project_event_append_only"();`,
    );
    this.addSql(
      `create trigger "project_event_no_delete" before delete on "project_event" for each row execute function "project_event_append_only"();`,
    );
  }
}
