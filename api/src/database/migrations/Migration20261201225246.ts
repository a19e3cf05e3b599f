import { Migration } from '@mikro-orm/migrations';

/** Bees get rotations and rounds: the queen order, monthly slots, assignments, pattern files and makers' blocks. */
export class Migration20261201225246 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`rounds\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`bee_id\` int unsigned not null, \`month\` char(7) not null, \`queen_id\` int unsigned not null, \`title\` varchar(160) not null, \`instructions\` text not null, \`pattern_link\` varchar(500) null, \`finished_width_mm\` numeric(10,3) not null, \`finished_height_mm\` numeric(10,3) not null, \`seam_allowance_mm\` numeric(10,3) not null, \`tolerance_mm\` numeric(10,3) not null, \`trim_mode\` enum('trim', 'untrimmed') not null, \`swatches\` json not null, \`background\` json null, \`fabric_source\` enum('stash', 'queen_sends') not null, \`due_date\` char(10) not null, \`send_at\` datetime(3) not null, \`delivery_method\` enum('mail', 'meeting') not null, \`delivery_address\` text null, \`meeting_details\` text null, \`status\` enum('draft', 'published') not null default 'draft', \`published_at\` datetime(3) null, \`sent_at\` datetime(3) null, \`change_pending_since\` datetime(3) null, \`last_edited_at\` datetime(3) null, \`changed_fields\` json not null, \`change_batch\` int not null default 0) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`rounds\` add index \`rounds_bee_id_index\`(\`bee_id\`);`);
    this.addSql(`alter table \`rounds\` add index \`rounds_queen_id_index\`(\`queen_id\`);`);
    this.addSql(`alter table \`rounds\` add index \`rounds_status_send_at_index\`(\`status\`, \`send_at\`);`);
    this.addSql(`alter table \`rounds\` add unique \`rounds_bee_id_month_unique\`(\`bee_id\`, \`month\`);`);

    this.addSql(`create table \`round_files\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`round_id\` int unsigned not null, \`storage_key\` varchar(64) not null, \`filename\` varchar(255) not null, \`content_type\` varchar(64) not null, \`size\` int not null, \`uploaded_by_id\` int unsigned null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`round_files\` add index \`round_files_round_id_index\`(\`round_id\`);`);
    this.addSql(`alter table \`round_files\` add index \`round_files_uploaded_by_id_index\`(\`uploaded_by_id\`);`);

    this.addSql(`create table \`round_blocks\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`round_id\` int unsigned not null, \`maker_id\` int unsigned not null, \`status\` enum('not_started', 'made', 'mailed', 'handed_over', 'received') not null default 'not_started', \`tracking_number\` varchar(80) null, \`updated_by_id\` int unsigned null, \`on_behalf\` tinyint(1) not null default false, \`status_changed_at\` datetime(3) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`round_blocks\` add index \`round_blocks_round_id_index\`(\`round_id\`);`);
    this.addSql(`alter table \`round_blocks\` add index \`round_blocks_maker_id_index\`(\`maker_id\`);`);
    this.addSql(`alter table \`round_blocks\` add index \`round_blocks_updated_by_id_index\`(\`updated_by_id\`);`);
    this.addSql(`alter table \`round_blocks\` add unique \`round_blocks_round_id_maker_id_unique\`(\`round_id\`, \`maker_id\`);`);

    this.addSql(`create table \`bee_slots\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`bee_id\` int unsigned not null, \`month\` char(7) not null, \`queen_id\` int unsigned null, \`skipped\` tinyint(1) not null default false) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`bee_slots\` add index \`bee_slots_bee_id_index\`(\`bee_id\`);`);
    this.addSql(`alter table \`bee_slots\` add index \`bee_slots_queen_id_index\`(\`queen_id\`);`);
    this.addSql(`alter table \`bee_slots\` add unique \`bee_slots_bee_id_month_unique\`(\`bee_id\`, \`month\`);`);

    this.addSql(`alter table \`rounds\` add constraint \`rounds_bee_id_foreign\` foreign key (\`bee_id\`) references \`bees\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`rounds\` add constraint \`rounds_queen_id_foreign\` foreign key (\`queen_id\`) references \`memberships\` (\`id\`) on update cascade on delete restrict;`);

    this.addSql(`alter table \`round_files\` add constraint \`round_files_round_id_foreign\` foreign key (\`round_id\`) references \`rounds\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`round_files\` add constraint \`round_files_uploaded_by_id_foreign\` foreign key (\`uploaded_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`round_blocks\` add constraint \`round_blocks_round_id_foreign\` foreign key (\`round_id\`) references \`rounds\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`round_blocks\` add constraint \`round_blocks_maker_id_foreign\` foreign key (\`maker_id\`) references \`memberships\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`round_blocks\` add constraint \`round_blocks_updated_by_id_foreign\` foreign key (\`updated_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`bee_slots\` add constraint \`bee_slots_bee_id_foreign\` foreign key (\`bee_id\`) references \`bees\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`bee_slots\` add constraint \`bee_slots_queen_id_foreign\` foreign key (\`queen_id\`) references \`memberships\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`outbox_messages\` add \`attachments\` json null;`);

    this.addSql(`alter table \`bees\` add \`handover\` enum('mail', 'meeting') not null default 'meeting', add \`start_month\` char(7) not null default '2026-01', add \`months\` tinyint not null default 12, add \`skipped_months\` json not null default '[]', add \`rotation_order\` json not null default '[]', add \`rotation_seed\` varchar(32) null;`);

    this.addSql(`alter table \`bee_members\` add \`status\` enum('invited', 'active', 'left') not null default 'active', add \`joined_at\` datetime(3) null, add \`left_at\` datetime(3) null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`round_files\` drop foreign key \`round_files_round_id_foreign\`;`);

    this.addSql(`alter table \`round_blocks\` drop foreign key \`round_blocks_round_id_foreign\`;`);

    this.addSql(`drop table if exists \`rounds\`;`);

    this.addSql(`drop table if exists \`round_files\`;`);

    this.addSql(`drop table if exists \`round_blocks\`;`);

    this.addSql(`drop table if exists \`bee_slots\`;`);

    this.addSql(`alter table \`bees\` drop column \`handover\`, drop column \`start_month\`, drop column \`months\`, drop column \`skipped_months\`, drop column \`rotation_order\`, drop column \`rotation_seed\`;`);

    this.addSql(`alter table \`bee_members\` drop column \`status\`, drop column \`joined_at\`, drop column \`left_at\`;`);

    this.addSql(`alter table \`outbox_messages\` drop column \`attachments\`;`);
  }

}
