import { Migration } from '@mikro-orm/migrations';

/** A member can turn reminder e-mails off (profile page or one-click unsubscribe link). */
export class Migration20261202045616 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`users\` add \`reminders_off\` tinyint(1) not null default false;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`users\` drop column \`reminders_off\`;`);
  }

}
