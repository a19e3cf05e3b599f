import { Migration } from '@mikro-orm/migrations';

/**
 * Offices have terms: who held which office from when (included) until when (excluded; null = no end
 * yet), who recorded it and a short note. Every role held today becomes an open term from the day
 * the member joined, so `memberships.roles` and the terms agree from the start.
 */
export class Migration20261202070500 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`office_terms\` (\`id\` int unsigned not null auto_increment primary key, \`guild_id\` int unsigned not null, \`membership_id\` int unsigned not null, \`role\` varchar(32) not null, \`starts_on\` date not null, \`ends_on\` date null, \`recorded_by_id\` int unsigned null, \`created_at\` datetime(3) not null, \`note\` varchar(300) not null default '') default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`office_terms\` add index \`office_terms_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`office_terms\` add index \`office_terms_membership_id_index\`(\`membership_id\`);`);
    this.addSql(`alter table \`office_terms\` add index \`office_terms_recorded_by_id_index\`(\`recorded_by_id\`);`);
    this.addSql(`alter table \`office_terms\` add index \`office_terms_membership_id_role_index\`(\`membership_id\`, \`role\`);`);
    this.addSql(`alter table \`office_terms\` add index \`office_terms_guild_id_role_starts_on_index\`(\`guild_id\`, \`role\`, \`starts_on\`);`);

    this.addSql(`alter table \`office_terms\` add constraint \`office_terms_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`office_terms\` add constraint \`office_terms_membership_id_foreign\` foreign key (\`membership_id\`) references \`memberships\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`office_terms\` add constraint \`office_terms_recorded_by_id_foreign\` foreign key (\`recorded_by_id\`) references \`memberships\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`insert into \`office_terms\` (\`guild_id\`, \`membership_id\`, \`role\`, \`starts_on\`, \`ends_on\`, \`recorded_by_id\`, \`created_at\`, \`note\`) select m.\`guild_id\`, m.\`id\`, r.\`role\`, date(m.\`joined_at\`), null, null, now(3), 'Recorded from the roles list' from \`memberships\` m, json_table(m.\`roles\`, '$[*]' columns (\`role\` varchar(32) path '$')) r where r.\`role\` in ('admin', 'treasurer', 'membership_chair', 'show_chair') order by m.\`id\`;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists \`office_terms\`;`);
  }

}
