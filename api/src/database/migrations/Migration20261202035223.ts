import { Migration } from '@mikro-orm/migrations';

/** Invoices for a quilt show's entry fees beside the dues: what an invoice is for, and which show. */
export class Migration20261202035223 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`dues_invoices\` add \`purpose\` enum('dues', 'show_entry') not null default 'dues', add \`show_id\` int unsigned null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`dues_invoices\` drop column \`purpose\`, drop column \`show_id\`;`);
  }

}
