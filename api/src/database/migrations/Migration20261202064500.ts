import { Migration } from '@mikro-orm/migrations';

/**
 * Members kept on paper: an account may have no e-mail address and no password (added by an
 * officer or by a roster import). And the moment an admin erased a departed member's personal data.
 */
export class Migration20261202064500 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`users\` modify \`email\` varchar(254) null, modify \`password_hash\` varchar(255) null, add \`erased_at\` datetime(3) null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`users\` drop column \`erased_at\`, modify \`email\` varchar(254) not null, modify \`password_hash\` varchar(255) not null;`);
  }

}
