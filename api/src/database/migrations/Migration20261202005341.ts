import { Migration } from '@mikro-orm/migrations';

/**
 * Dues and payments: settings, plans, households, each member's standing, invoices, payments,
 * refunds, receipt counters, processed payment-service events and the append-only money audit log.
 */
export class Migration20261202005341 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`dues_settings\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`guild_id\` int unsigned not null, \`year_start_month\` tinyint not null, \`due_month\` tinyint not null, \`due_day\` tinyint not null, \`grace_days\` smallint not null, \`late_fee_cents\` int not null, \`early_renewal_days\` smallint not null, \`proration\` json not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`dues_settings\` add index \`dues_settings_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`dues_settings\` add unique \`dues_settings_guild_id_unique\`(\`guild_id\`);`);

    this.addSql(`create table \`dues_plans\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`guild_id\` int unsigned not null, \`name\` varchar(80) not null, \`kind\` enum('standard', 'household', 'lifetime', 'honorary') not null, \`yearly_cents\` int not null, \`min_age\` tinyint null, \`max_age\` tinyint null, \`active\` tinyint(1) not null default true) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`dues_plans\` add index \`dues_plans_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`dues_plans\` add unique \`dues_plans_guild_id_name_unique\`(\`guild_id\`, \`name\`);`);

    this.addSql(`create table \`households\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`guild_id\` int unsigned not null, \`name\` varchar(120) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`households\` add index \`households_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`households\` add unique \`households_guild_id_name_unique\`(\`guild_id\`, \`name\`);`);

    this.addSql(`create table \`payment_webhook_events\` (\`id\` int unsigned not null auto_increment primary key, \`event_id\` varchar(255) not null, \`type\` varchar(100) not null, \`invoice_id\` int null, \`received_at\` datetime(3) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`payment_webhook_events\` add unique \`payment_webhook_events_event_id_unique\`(\`event_id\`);`);

    this.addSql(`create table \`dues_receipt_counters\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`guild_id\` int unsigned not null, \`year\` smallint not null, \`next_number\` int not null default 1) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`dues_receipt_counters\` add index \`dues_receipt_counters_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`dues_receipt_counters\` add unique \`dues_receipt_counters_guild_id_year_unique\`(\`guild_id\`, \`year\`);`);

    this.addSql(`create table \`dues_audit_log\` (\`id\` int unsigned not null auto_increment primary key, \`guild_id\` int unsigned not null, \`actor_id\` int unsigned null, \`actor_name\` varchar(120) not null, \`action\` varchar(32) not null, \`subject_type\` varchar(32) not null, \`subject_id\` int null, \`summary\` varchar(500) not null, \`detail\` json not null, \`at\` datetime(3) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`dues_audit_log\` add index \`dues_audit_log_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`dues_audit_log\` add index \`dues_audit_log_actor_id_index\`(\`actor_id\`);`);
    this.addSql(`alter table \`dues_audit_log\` add index \`dues_audit_log_guild_id_at_index\`(\`guild_id\`, \`at\`);`);

    this.addSql(`create table \`dues_standings\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`membership_id\` int unsigned not null, \`plan_id\` int unsigned null, \`household_id\` int unsigned null, \`paid_through\` date null, \`birth_date\` date null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`dues_standings\` add index \`dues_standings_membership_id_index\`(\`membership_id\`);`);
    this.addSql(`alter table \`dues_standings\` add index \`dues_standings_plan_id_index\`(\`plan_id\`);`);
    this.addSql(`alter table \`dues_standings\` add index \`dues_standings_household_id_index\`(\`household_id\`);`);
    this.addSql(`alter table \`dues_standings\` add unique \`dues_standings_membership_id_unique\`(\`membership_id\`);`);

    this.addSql(`create table \`dues_invoices\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`guild_id\` int unsigned not null, \`membership_id\` int unsigned not null, \`plan_id\` int unsigned null, \`plan_name\` varchar(80) not null, \`year_label\` varchar(40) not null, \`covers_from\` date null, \`covers_through\` date null, \`lines\` json not null, \`total_cents\` int not null, \`currency\` char(3) not null, \`status\` enum('open', 'paid', 'void', 'refunded', 'partially_refunded') not null default 'open', \`open_key\` varchar(64) null, \`checkout_session_id\` varchar(255) null, \`checkout_url\` text null, \`checkout_attempts\` int not null default 0, \`payment_note\` varchar(500) null, \`paid_at\` datetime(3) null, \`paid_on\` date null, \`method\` enum('card', 'cash', 'cheque') null, \`cheque_number\` varchar(40) null, \`receipt_number\` varchar(16) null, \`refunded_cents\` int not null default 0, \`prior_paid_through\` date null, \`created_by_id\` int unsigned null, \`voided_at\` datetime(3) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`dues_invoices\` add index \`dues_invoices_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`dues_invoices\` add index \`dues_invoices_membership_id_index\`(\`membership_id\`);`);
    this.addSql(`alter table \`dues_invoices\` add index \`dues_invoices_plan_id_index\`(\`plan_id\`);`);
    this.addSql(`alter table \`dues_invoices\` add unique \`dues_invoices_open_key_unique\`(\`open_key\`);`);
    this.addSql(`alter table \`dues_invoices\` add unique \`dues_invoices_checkout_session_id_unique\`(\`checkout_session_id\`);`);
    this.addSql(`alter table \`dues_invoices\` add index \`dues_invoices_created_by_id_index\`(\`created_by_id\`);`);
    this.addSql(`alter table \`dues_invoices\` add index \`dues_invoices_guild_id_status_index\`(\`guild_id\`, \`status\`);`);
    this.addSql(`alter table \`dues_invoices\` add unique \`dues_invoices_guild_id_receipt_number_unique\`(\`guild_id\`, \`receipt_number\`);`);

    this.addSql(`create table \`dues_payments\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`invoice_id\` int unsigned not null, \`guild_id\` int unsigned not null, \`method\` enum('card', 'cash', 'cheque') not null, \`amount_cents\` int not null, \`fee_cents\` int not null default 0, \`net_cents\` int not null, \`payment_intent_id\` varchar(255) null, \`charge_id\` varchar(255) null, \`card_brand\` varchar(32) null, \`card_last4\` varchar(4) null, \`cheque_number\` varchar(40) null, \`paid_at\` datetime(3) not null, \`refunded_cents\` int not null default 0, \`recorded_by_id\` int unsigned null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`dues_payments\` add index \`dues_payments_invoice_id_index\`(\`invoice_id\`);`);
    this.addSql(`alter table \`dues_payments\` add index \`dues_payments_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`dues_payments\` add unique \`dues_payments_payment_intent_id_unique\`(\`payment_intent_id\`);`);
    this.addSql(`alter table \`dues_payments\` add index \`dues_payments_recorded_by_id_index\`(\`recorded_by_id\`);`);
    this.addSql(`alter table \`dues_payments\` add unique \`dues_payments_invoice_id_unique\`(\`invoice_id\`);`);

    this.addSql(`create table \`dues_refunds\` (\`id\` int unsigned not null auto_increment primary key, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`payment_id\` int unsigned not null, \`guild_id\` int unsigned not null, \`amount_cents\` int not null, \`provider_refund_id\` varchar(255) null, \`reason\` varchar(500) null, \`by_id\` int unsigned null, \`by_name\` varchar(120) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`dues_refunds\` add index \`dues_refunds_payment_id_index\`(\`payment_id\`);`);
    this.addSql(`alter table \`dues_refunds\` add index \`dues_refunds_guild_id_index\`(\`guild_id\`);`);
    this.addSql(`alter table \`dues_refunds\` add unique \`dues_refunds_provider_refund_id_unique\`(\`provider_refund_id\`);`);
    this.addSql(`alter table \`dues_refunds\` add index \`dues_refunds_by_id_index\`(\`by_id\`);`);

    this.addSql(`alter table \`dues_settings\` add constraint \`dues_settings_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`dues_plans\` add constraint \`dues_plans_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`households\` add constraint \`households_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`dues_receipt_counters\` add constraint \`dues_receipt_counters_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`dues_audit_log\` add constraint \`dues_audit_log_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`dues_audit_log\` add constraint \`dues_audit_log_actor_id_foreign\` foreign key (\`actor_id\`) references \`memberships\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`dues_standings\` add constraint \`dues_standings_membership_id_foreign\` foreign key (\`membership_id\`) references \`memberships\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`dues_standings\` add constraint \`dues_standings_plan_id_foreign\` foreign key (\`plan_id\`) references \`dues_plans\` (\`id\`) on update cascade on delete set null;`);
    this.addSql(`alter table \`dues_standings\` add constraint \`dues_standings_household_id_foreign\` foreign key (\`household_id\`) references \`households\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`dues_invoices\` add constraint \`dues_invoices_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`dues_invoices\` add constraint \`dues_invoices_membership_id_foreign\` foreign key (\`membership_id\`) references \`memberships\` (\`id\`) on update cascade on delete restrict;`);
    this.addSql(`alter table \`dues_invoices\` add constraint \`dues_invoices_plan_id_foreign\` foreign key (\`plan_id\`) references \`dues_plans\` (\`id\`) on update cascade on delete set null;`);
    this.addSql(`alter table \`dues_invoices\` add constraint \`dues_invoices_created_by_id_foreign\` foreign key (\`created_by_id\`) references \`memberships\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`dues_payments\` add constraint \`dues_payments_invoice_id_foreign\` foreign key (\`invoice_id\`) references \`dues_invoices\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`dues_payments\` add constraint \`dues_payments_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`dues_payments\` add constraint \`dues_payments_recorded_by_id_foreign\` foreign key (\`recorded_by_id\`) references \`memberships\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`dues_refunds\` add constraint \`dues_refunds_payment_id_foreign\` foreign key (\`payment_id\`) references \`dues_payments\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`dues_refunds\` add constraint \`dues_refunds_guild_id_foreign\` foreign key (\`guild_id\`) references \`guilds\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`dues_refunds\` add constraint \`dues_refunds_by_id_foreign\` foreign key (\`by_id\`) references \`memberships\` (\`id\`) on update cascade on delete set null;`);

    // The money audit log only grows: refuse every UPDATE and DELETE of its rows. (Cascades from a
    // deleted guild are foreign-key actions, which do not fire triggers.)
    this.addSql(`create trigger \`dues_audit_log_no_update\` before update on \`dues_audit_log\` for each row signal sqlstate '45000' set message_text = 'The money audit log is append-only.';`);
    this.addSql(`create trigger \`dues_audit_log_no_delete\` before delete on \`dues_audit_log\` for each row signal sqlstate '45000' set message_text = 'The money audit log is append-only.';`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop trigger if exists \`dues_audit_log_no_update\`;`);
    this.addSql(`drop trigger if exists \`dues_audit_log_no_delete\`;`);
    this.addSql(`alter table \`dues_standings\` drop foreign key \`dues_standings_plan_id_foreign\`;`);

    this.addSql(`alter table \`dues_invoices\` drop foreign key \`dues_invoices_plan_id_foreign\`;`);

    this.addSql(`alter table \`dues_standings\` drop foreign key \`dues_standings_household_id_foreign\`;`);

    this.addSql(`alter table \`dues_payments\` drop foreign key \`dues_payments_invoice_id_foreign\`;`);

    this.addSql(`alter table \`dues_refunds\` drop foreign key \`dues_refunds_payment_id_foreign\`;`);

    this.addSql(`drop table if exists \`dues_settings\`;`);

    this.addSql(`drop table if exists \`dues_plans\`;`);

    this.addSql(`drop table if exists \`households\`;`);

    this.addSql(`drop table if exists \`payment_webhook_events\`;`);

    this.addSql(`drop table if exists \`dues_receipt_counters\`;`);

    this.addSql(`drop table if exists \`dues_audit_log\`;`);

    this.addSql(`drop table if exists \`dues_standings\`;`);

    this.addSql(`drop table if exists \`dues_invoices\`;`);

    this.addSql(`drop table if exists \`dues_payments\`;`);

    this.addSql(`drop table if exists \`dues_refunds\`;`);
  }

}
