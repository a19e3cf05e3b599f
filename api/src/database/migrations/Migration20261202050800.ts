import { Migration } from '@mikro-orm/migrations';

/** Members' phone and town, and which contact details other members may see in the directory. */
export class Migration20261202050800 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`users\` add \`phone\` varchar(40) null, add \`town\` varchar(120) null, add \`show_email\` tinyint(1) not null default false, add \`show_phone\` tinyint(1) not null default false, add \`show_town\` tinyint(1) not null default false;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`users\` drop column \`phone\`, drop column \`town\`, drop column \`show_email\`, drop column \`show_phone\`, drop column \`show_town\`;`);
  }

}
