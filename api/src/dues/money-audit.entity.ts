import { Entity, Index, ManyToOne, PrimaryKey, Property } from '@mikro-orm/core';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';

export const AUDIT_ACTIONS = [
  'payment',
  'manual_payment',
  'refund',
  'void',
  'plan_created',
  'plan_changed',
  'member_plan_changed',
  'settings_changed',
  'household_created',
  // A departed member's personal data erased; her money records stay under the record name.
  'member_erased',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/**
 * The money audit log. Rows are only ever inserted: triggers in the migration refuse UPDATE and
 * DELETE, so not even a bug can rewrite the books' history.
 */
@Entity({ tableName: 'dues_audit_log' })
@Index({ properties: ['guild', 'at'] })
export class MoneyAuditEntry {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  /** Who did it; null for the payment service. */
  @ManyToOne(() => Membership, { nullable: true, deleteRule: 'set null' })
  actor?: Membership | null = null;

  @Property({ type: 'string', length: 120 })
  actorName!: string;

  @Property({ type: 'string', length: 32 })
  action!: AuditAction;

  @Property({ type: 'string', length: 32 })
  subjectType!: string;

  @Property({ type: 'integer', nullable: true })
  subjectId?: number | null = null;

  @Property({ type: 'string', length: 500 })
  summary!: string;

  @Property({ type: 'json' })
  detail: Record<string, unknown> = {};

  @Property({ type: 'datetime', length: 3 })
  at: Date = new Date();
}
