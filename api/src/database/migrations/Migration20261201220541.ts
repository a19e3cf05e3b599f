import { Migration } from '@mikro-orm/migrations';

export class Migration20261201220541 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`guilds\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`name\` varchar(120) not null, \`town\` varchar(120) not null, \`time_zone\` varchar(64) not null default 'America/Chicago', \`currency\` char(3) not null default 'USD', \`unit\` varchar(2) not null default 'in', \`year_start_month\` tinyint not null default 1) default character set utf8mb4 engine = InnoDB;`);

    this.addSql(`create table \`outbox_messages\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`idempotency_key\` varchar(191) not null, \`template\` varchar(64) not null, \`to_address\` varchar(254) not null, \`subject\` varchar(300) not null, \`html\` mediumtext not null, \`text\` mediumtext not null, \`headers\` json null, \`status\` enum('pending', 'sending', 'sent', 'failed') not null default 'pending', \`attempts\` int not null default 0, \`next_attempt_at\` datetime(3) not null, \`locked_until\` datetime(3) null, \`last_error\` text null, \`sent_at\` datetime(3) null, \`provider_message_id\` varchar(255) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`outbox_messages\` add unique \`outbox_messages_idempotency_key_unique\`(\`idempotency_key\`);`);
    this.addSql(`alter table \`outbox_messages\` add index \`outbox_messages_status_next_attempt_at_index\`(\`status\`, \`next_attempt_at\`);`);

    this.addSql(`create table \`sessions\` (\`session_id\` varchar(128) not null, \`expires\` int unsigned not null, \`data\` mediumtext null, primary key (\`session_id\`)) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`sessions\` add index \`sessions_expires_index\`(\`expires\`);`);

    this.addSql(`create table \`sign_in_failures\` (\`id\` bigint unsigned not null auto_increment primary key, \`email\` varchar(254) not null, \`address\` varchar(64) not null, \`created_at\` datetime(3) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`sign_in_failures\` add index \`sign_in_failures_address_created_at_index\`(\`address\`, \`created_at\`);`);
    this.addSql(`alter table \`sign_in_failures\` add index \`sign_in_failures_email_created_at_index\`(\`email\`, \`created_at\`);`);

    this.addSql(`create table \`users\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`email\` varchar(254) not null, \`name\` varchar(120) not null, \`password_hash\` varchar(255) not null, \`last_sign_in_at\` datetime(3) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`users\` add unique \`users_email_unique\`(\`email\`);`);

    this.addSql(`create table \`password_resets\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`user_id\` int unsigned not null, \`token_hash\` varchar(64) not null, \`expires_at\` datetime(3) not null, \`used_at\` datetime(3) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`password_resets\` add index \`password_resets_user_id_index\`(\`user_id\`);`);
    this.addSql(`alter table \`password_resets\` add unique \`password_resets_token_hash_unique\`(\`token_hash\`);`);

    this.addSql(`create table \`memberships\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`user_id\` int unsigned not null, \`guild_id\` int unsigned not null, \`roles\` json not null, \`status\` enum('active', 'left') not null default 'active', \`joined_at\` datetime(3) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`memberships\` add index \`memberships_user_id_index\`(\`user_id\`);`);
    this.addSql(`alter table \`memberships\` add index \`memberships_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`memberships\` add index \`memberships_guild_id_status_index\`(\`guild_id\`, \`status\`);`);
    this.addSql(`alter table \`memberships\` add unique \`memberships_user_id_guild_id_unique\`(\`user_id\`, \`guild_id\`);`);

    this.addSql(`create table \`bees\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`guild_id\` int unsigned not null, \`name\` varchar(120) not null, \`description\` text null, \`organiser_id\` int unsigned not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`bees\` add index \`bees_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`bees\` add index \`bees_organiser_id_index\`(\`organiser_id\`);`);

    this.addSql(`create table \`bee_members\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`bee_id\` int unsigned not null, \`membership_id\` int unsigned not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`bee_members\` add index \`bee_members_bee_id_index\`(\`bee_id\`);`);
    this.addSql(`alter table \`bee_members\` add index \`bee_members_membership_id_index\`(\`membership_id\`);`);
    this.addSql(`alter table \`bee_members\` add unique \`bee_members_bee_id_membership_id_unique\`(\`bee_id\`, \`membership_id\`);`);

    this.addSql(`create table \`invitations\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`guild_id\` int unsigned not null, \`email\` varchar(254) not null, \`roles\` json not null, \`token_hash\` varchar(64) not null, \`invited_by_id\` int unsigned null, \`expires_at\` datetime(3) not null, \`accepted_at\` datetime(3) null, \`revoked_at\` datetime(3) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`invitations\` add index \`invitations_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`invitations\` add unique \`invitations_token_hash_unique\`(\`token_hash\`);`);
    this.addSql(`alter table \`invitations\` add index \`invitations_invited_by_id_index\`(\`invited_by_id\`);`);
    this.addSql(`alter table \`invitations\` add index \`invitations_guild_id_email_index\`(\`guild_id\`, \`email\`);`);

    this.addSql(`alter table \`password_resets\` add constraint \`password_resets_user_id_foreign\` foreign key (\`user_id\`) references \`users\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`memberships\` add constraint \`memberships_user_id_foreign\` foreign key (\`user_id\`) references \`users\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`memberships\` add constraint \`memberships_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`bees\` add constraint \`bees_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`bees\` add constraint \`bees_organiser_id_foreign\` foreign key (\`organiser_id\`) references \`memberships\` (\`id\`) on update cascade on delete restrict;`);

    this.addSql(`alter table \`bee_members\` add constraint \`bee_members_bee_id_foreign\` foreign key (\`bee_id\`) references \`bees\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`bee_members\` add constraint \`bee_members_membership_id_foreign\` foreign key (\`membership_id\`) references \`memberships\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`invitations\` add constraint \`invitations_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`invitations\` add constraint \`invitations_invited_by_id_foreign\` foreign key (\`invited_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`);
  }

}
