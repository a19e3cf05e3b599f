import { Entity, Enum, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Membership } from '../guilds/membership.entity';
import { User } from '../users/user.entity';
import { Round } from './round.entity';

export const BLOCK_STATUSES = ['not_started', 'made', 'mailed', 'handed_over', 'received'] as const;
export type BlockStatus = (typeof BLOCK_STATUSES)[number];

/** One maker's block for one round. */
@Entity({ tableName: 'round_blocks' })
@Unique({ properties: ['round', 'maker'] })
export class RoundBlock extends BaseEntity<'status' | 'onBehalf'> {
  @ManyToOne(() => Round, { deleteRule: 'cascade' })
  round!: Round;

  @ManyToOne(() => Membership, { deleteRule: 'cascade' })
  maker!: Membership;

  @Enum({ items: [...BLOCK_STATUSES], type: 'string', length: 16 })
  status: BlockStatus = 'not_started';

  @Property({ type: 'string', length: 80, nullable: true })
  trackingNumber?: string | null;

  @ManyToOne(() => User, { deleteRule: 'set null', nullable: true })
  updatedBy?: User | null;

  /** Set by the organiser for a maker who does not use the app. */
  @Property({ type: 'boolean' })
  onBehalf: boolean = false;

  @Property({ type: 'datetime', length: 3, nullable: true })
  statusChangedAt?: Date | null;
}
