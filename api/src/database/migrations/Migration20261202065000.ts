import { Migration } from '@mikro-orm/migrations';

/** When a member left a guild, and whether she asked for her personal data to be erased. */
export class Migration20261202065000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`memberships\` add \`left_at\` datetime(3) null, add \`erase_requested_at\` datetime(3) null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`memberships\` drop column \`left_at\`, drop column \`erase_requested_at\`;`);
  }

}
