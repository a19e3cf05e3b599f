import { Migration } from '@mikro-orm/migrations';

/**
 * Quilt shows: shows, categories with size rules, entries, visitor ballot codes, who has voted
 * (unique per show, the one-ballot guard), the anonymous ballots and the chair's tie decisions.
 */
export class Migration20261202033214 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`shows\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`guild_id\` int unsigned not null, \`name\` varchar(120) not null, \`venue\` varchar(200) not null, \`description\` text not null default (''), \`starts_on\` date not null, \`ends_on\` date not null, \`entries_open_on\` date null, \`entries_close_on\` date null, \`max_entries_per_member\` smallint null, \`entry_fee_cents\` int not null default 0, \`entry_fee_cap_cents\` int null, \`sleeve_depth_mm\` numeric(10,3) not null default 101.6, \`narrow_under_mm\` numeric(10,3) null default 762, \`narrow_depth_mm\` numeric(10,3) null default 76.2, \`split_over_mm\` numeric(10,3) null default 2286, \`voting_kind\` enum('per_category', 'approval', 'ranked') not null default 'per_category', \`ranked_method\` enum('points', 'instant_runoff') not null default 'points', \`rank_depth\` tinyint not null default 3, \`voting_opens_at\` datetime(3) null, \`voting_closes_at\` datetime(3) null, \`voting_opened_at\` datetime(3) null, \`voting_closed_at\` datetime(3) null, \`results_published_at\` datetime(3) null, \`makers_hidden\` tinyint(1) not null default true, \`created_by_id\` int unsigned null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`shows\` add index \`shows_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`shows\` add index \`shows_created_by_id_index\`(\`created_by_id\`);`);

    this.addSql(`create table \`show_voters\` (\`id\` int unsigned not null auto_increment primary key, \`show_id\` int unsigned not null, \`voter_key\` varchar(40) not null, \`channel\` varchar(8) not null, \`cast_at\` datetime(3) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`show_voters\` add index \`show_voters_show_id_index\`(\`show_id\`);`);
    this.addSql(`alter table \`show_voters\` add unique \`show_voters_show_id_voter_key_unique\`(\`show_id\`, \`voter_key\`);`);

    this.addSql(`create table \`show_categories\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`show_id\` int unsigned not null, \`name\` varchar(80) not null, \`description\` varchar(500) not null default '', \`judged\` tinyint(1) not null default true, \`sort_order\` smallint not null default 0, \`size_kind\` enum('none', 'dimensions', 'perimeter') not null default 'none', \`min_width_mm\` numeric(10,3) null, \`max_width_mm\` numeric(10,3) null, \`min_height_mm\` numeric(10,3) null, \`max_height_mm\` numeric(10,3) null, \`min_perimeter_mm\` numeric(10,3) null, \`min_inclusive\` tinyint(1) not null default true, \`max_perimeter_mm\` numeric(10,3) null, \`max_inclusive\` tinyint(1) not null default true, \`min_makers\` tinyint null, \`max_entries_per_member\` smallint null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`show_categories\` add index \`show_categories_show_id_index\`(\`show_id\`);`);
    this.addSql(`alter table \`show_categories\` add unique \`show_categories_show_id_name_unique\`(\`show_id\`, \`name\`);`);

    this.addSql(`create table \`show_tie_decisions\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`show_id\` int unsigned not null, \`category_id\` int unsigned null, \`entry_order\` json not null, \`note\` varchar(300) not null default '', \`decided_by_id\` int unsigned null, \`decided_by_name\` varchar(120) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`show_tie_decisions\` add index \`show_tie_decisions_show_id_index\`(\`show_id\`);`);
    this.addSql(`alter table \`show_tie_decisions\` add index \`show_tie_decisions_category_id_index\`(\`category_id\`);`);
    this.addSql(`alter table \`show_tie_decisions\` add index \`show_tie_decisions_decided_by_id_index\`(\`decided_by_id\`);`);

    this.addSql(`create table \`show_entries\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`show_id\` int unsigned not null, \`category_id\` int unsigned not null, \`membership_id\` int unsigned not null, \`entered_by_id\` int unsigned null, \`title\` varchar(160) not null, \`width_mm\` numeric(10,3) not null, \`height_mm\` numeric(10,3) not null, \`makers\` json not null, \`quilter\` varchar(120) not null default '', \`techniques\` varchar(300) not null default '', \`story\` text not null default (''), \`for_sale\` tinyint(1) not null default false, \`price_cents\` int null, \`photo_key\` varchar(80) null, \`photo_thumb_key\` varchar(80) null, \`status\` enum('submitted', 'accepted', 'declined', 'withdrawn') not null default 'submitted', \`decline_reason\` varchar(500) null, \`entry_number\` smallint null, \`reviewed_at\` datetime(3) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`show_entries\` add index \`show_entries_show_id_index\`(\`show_id\`);`);
    this.addSql(`alter table \`show_entries\` add index \`show_entries_category_id_index\`(\`category_id\`);`);
    this.addSql(`alter table \`show_entries\` add index \`show_entries_membership_id_index\`(\`membership_id\`);`);
    this.addSql(`alter table \`show_entries\` add index \`show_entries_entered_by_id_index\`(\`entered_by_id\`);`);
    this.addSql(`alter table \`show_entries\` add index \`show_entries_show_id_status_index\`(\`show_id\`, \`status\`);`);
    this.addSql(`alter table \`show_entries\` add unique \`show_entries_show_id_entry_number_unique\`(\`show_id\`, \`entry_number\`);`);

    this.addSql(`create table \`show_ballots\` (\`id\` char(22) not null, \`show_id\` int unsigned not null, \`choices\` json not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`show_ballots\` add index \`show_ballots_show_id_index\`(\`show_id\`);`);

    this.addSql(`create table \`ballot_codes\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`show_id\` int unsigned not null, \`code\` char(12) not null, \`batch\` smallint not null, \`used_at\` datetime(3) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`ballot_codes\` add index \`ballot_codes_show_id_index\`(\`show_id\`);`);
    this.addSql(`alter table \`ballot_codes\` add unique \`ballot_codes_code_unique\`(\`code\`);`);
    this.addSql(`alter table \`ballot_codes\` add index \`ballot_codes_show_id_batch_index\`(\`show_id\`, \`batch\`);`);

    this.addSql(`alter table \`shows\` add constraint \`shows_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`shows\` add constraint \`shows_created_by_id_foreign\` foreign key (\`created_by_id\`) references \`memberships\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`show_voters\` add constraint \`show_voters_show_id_foreign\` foreign key (\`show_id\`) references \`shows\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`show_categories\` add constraint \`show_categories_show_id_foreign\` foreign key (\`show_id\`) references \`shows\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`show_tie_decisions\` add constraint \`show_tie_decisions_show_id_foreign\` foreign key (\`show_id\`) references \`shows\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`show_tie_decisions\` add constraint \`show_tie_decisions_category_id_foreign\` foreign key (\`category_id\`) references \`show_categories\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`show_tie_decisions\` add constraint \`show_tie_decisions_decided_by_id_foreign\` foreign key (\`decided_by_id\`) references \`memberships\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`show_entries\` add constraint \`show_entries_show_id_foreign\` foreign key (\`show_id\`) references \`shows\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`show_entries\` add constraint \`show_entries_category_id_foreign\` foreign key (\`category_id\`) references \`show_categories\` (\`id\`) on update cascade on delete restrict;`);
    this.addSql(`alter table \`show_entries\` add constraint \`show_entries_membership_id_foreign\` foreign key (\`membership_id\`) references \`memberships\` (\`id\`) on update cascade on delete restrict;`);
    this.addSql(`alter table \`show_entries\` add constraint \`show_entries_entered_by_id_foreign\` foreign key (\`entered_by_id\`) references \`memberships\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`show_ballots\` add constraint \`show_ballots_show_id_foreign\` foreign key (\`show_id\`) references \`shows\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`ballot_codes\` add constraint \`ballot_codes_show_id_foreign\` foreign key (\`show_id\`) references \`shows\` (\`id\`) on update cascade on delete cascade;`);

  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`show_voters\` drop foreign key \`show_voters_show_id_foreign\`;`);

    this.addSql(`alter table \`show_categories\` drop foreign key \`show_categories_show_id_foreign\`;`);

    this.addSql(`alter table \`show_tie_decisions\` drop foreign key \`show_tie_decisions_show_id_foreign\`;`);

    this.addSql(`alter table \`show_entries\` drop foreign key \`show_entries_show_id_foreign\`;`);

    this.addSql(`alter table \`show_ballots\` drop foreign key \`show_ballots_show_id_foreign\`;`);

    this.addSql(`alter table \`ballot_codes\` drop foreign key \`ballot_codes_show_id_foreign\`;`);

    this.addSql(`alter table \`show_tie_decisions\` drop foreign key \`show_tie_decisions_category_id_foreign\`;`);

    this.addSql(`alter table \`show_entries\` drop foreign key \`show_entries_category_id_foreign\`;`);

    this.addSql(`drop table if exists \`shows\`;`);

    this.addSql(`drop table if exists \`show_voters\`;`);

    this.addSql(`drop table if exists \`show_categories\`;`);

    this.addSql(`drop table if exists \`show_tie_decisions\`;`);

    this.addSql(`drop table if exists \`show_entries\`;`);

    this.addSql(`drop table if exists \`show_ballots\`;`);

    this.addSql(`drop table if exists \`ballot_codes\`;`);

  }

}
