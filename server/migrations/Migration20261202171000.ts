import { Migration } from '@mikro-orm/migrations';

/**
 * The Reply-To address of an outgoing e-mail (a sheet's sender), kept on the row so retries keep it.
 * Written by hand: the generator rebuilds `outgoing_mail` around its enum checks (footgun 38).
 */
export class Migration20261202171000 extends Migration {
  override async up(): Promise<void> {
    this.addSql('alter table `outgoing_mail` add column `reply_to` text null;');
  }
}
