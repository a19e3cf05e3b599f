import { Migration } from '@mikro-orm/migrations';

/** Size checks: a photo or ruler reading of a maker's block, its measurement and verdict. */
export class Migration20261201231841 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`size_checks\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`block_id\` int unsigned not null, \`uploaded_by_id\` int unsigned null, \`on_behalf\` tinyint(1) not null default false, \`status\` enum('measured', 'failed', 'manual') not null, \`failure_reason\` varchar(32) null, \`message\` text null, \`images\` json null, \`photo_width_px\` int null, \`photo_height_px\` int null, \`ruler_reading_mm\` numeric(10,3) null, \`print_scale\` numeric(8,6) null, \`width_mm\` numeric(10,3) null, \`height_mm\` numeric(10,3) null, \`diagonals_mm\` json null, \`corner_angles_deg\` json null, \`manual_width_mm\` numeric(10,3) null, \`manual_height_mm\` numeric(10,3) null, \`verdict\` varchar(16) null, \`out_of_square\` tinyint(1) null, \`summary\` text null, \`processing_ms\` int null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`size_checks\` add index \`size_checks_block_id_index\`(\`block_id\`);`);
    this.addSql(`alter table \`size_checks\` add index \`size_checks_uploaded_by_id_index\`(\`uploaded_by_id\`);`);
    this.addSql(`alter table \`size_checks\` add index \`size_checks_block_id_created_at_index\`(\`block_id\`, \`created_at\`);`);

    this.addSql(`alter table \`size_checks\` add constraint \`size_checks_block_id_foreign\` foreign key (\`block_id\`) references \`round_blocks\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`size_checks\` add constraint \`size_checks_uploaded_by_id_foreign\` foreign key (\`uploaded_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists \`size_checks\`;`);
  }

}
