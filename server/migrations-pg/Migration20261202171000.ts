import { Migration } from '@mikro-orm/migrations';

/** Twin of the SQLite migration of the same name: the Reply-To address kept on an outgoing e-mail. */
export class Migration20261202171000 extends Migration {
  override async up(): Promise<void> {
    this.addSql('alter table "outgoing_mail" add column "reply_to" varchar(320) null;');
  }
}
