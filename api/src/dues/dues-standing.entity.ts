import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Membership } from '../guilds/membership.entity';
import { DuesPlan } from './dues-plan.entity';
import { Household } from './household.entity';

/**
 * A member's dues standing, one row per membership, kept beside the membership rather than in it:
 * the dues module owns these columns and their migration, and the row is what a payment locks
 * (SELECT … FOR UPDATE) to advance paidThrough, so two payments for one member never interleave.
 */
@Entity({ tableName: 'dues_standings' })
@Unique({ properties: ['membership'] })
export class DuesStanding extends BaseEntity<'plan' | 'household' | 'paidThrough' | 'birthDate'> {
  @ManyToOne(() => Membership, { deleteRule: 'cascade' })
  membership!: Membership;

  @ManyToOne(() => DuesPlan, { nullable: true, deleteRule: 'set null' })
  plan?: DuesPlan | null = null;

  @ManyToOne(() => Household, { nullable: true, deleteRule: 'set null' })
  household?: Household | null = null;

  /** Last day paid for, a guild-local date "yyyy-mm-dd"; null when she has never paid. */
  @Property({ type: 'date', nullable: true })
  paidThrough?: string | null = null;

  /** Only for plans with an age rule (a junior plan); recorded by the treasurer. */
  @Property({ type: 'date', nullable: true })
  birthDate?: string | null = null;
}
