import { Entity, ManyToOne, Property } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';
import { DuesPayment } from './dues-payment.entity';

/** Money given back on a payment; card refunds carry the payment service's refund id. */
@Entity({ tableName: 'dues_refunds' })
export class DuesRefund extends BaseEntity<'providerRefundId' | 'reason' | 'by'> {
  @ManyToOne(() => DuesPayment, { deleteRule: 'cascade' })
  payment!: DuesPayment;

  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Property({ type: 'integer' })
  amountCents!: number;

  @Property({ type: 'string', length: 255, nullable: true, unique: true })
  providerRefundId?: string | null = null;

  @Property({ type: 'string', length: 500, nullable: true })
  reason?: string | null = null;

  /** The treasurer who made it; null when it came from the payment service's side. */
  @ManyToOne(() => Membership, { nullable: true, deleteRule: 'set null' })
  by?: Membership | null = null;

  @Property({ type: 'string', length: 120 })
  byName!: string;
}
