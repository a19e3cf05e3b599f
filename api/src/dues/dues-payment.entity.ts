import { Entity, Enum, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';
import { DuesInvoice, PAYMENT_METHODS, type PaymentMethod } from './dues-invoice.entity';

/** Money received for an invoice (one payment per invoice), with the service's fee and net for cards. */
@Entity({ tableName: 'dues_payments' })
@Unique({ properties: ['invoice'] })
export class DuesPayment extends BaseEntity<'feeCents' | 'refundedCents' | 'paymentIntentId' | 'chargeId' | 'cardBrand' | 'cardLast4' | 'chequeNumber' | 'recordedBy'> {
  @ManyToOne(() => DuesInvoice, { deleteRule: 'cascade' })
  invoice!: DuesInvoice;

  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Enum({ items: [...PAYMENT_METHODS], type: 'string', length: 8 })
  method!: PaymentMethod;

  @Property({ type: 'integer' })
  amountCents!: number;

  @Property({ type: 'integer' })
  feeCents: number = 0;

  @Property({ type: 'integer' })
  netCents!: number;

  @Property({ type: 'string', length: 255, nullable: true, unique: true })
  paymentIntentId?: string | null = null;

  @Property({ type: 'string', length: 255, nullable: true })
  chargeId?: string | null = null;

  @Property({ type: 'string', length: 32, nullable: true })
  cardBrand?: string | null = null;

  @Property({ type: 'string', length: 4, nullable: true })
  cardLast4?: string | null = null;

  @Property({ type: 'string', length: 40, nullable: true })
  chequeNumber?: string | null = null;

  @Property({ type: 'datetime', length: 3 })
  paidAt!: Date;

  @Property({ type: 'integer' })
  refundedCents: number = 0;

  @ManyToOne(() => Membership, { nullable: true, deleteRule: 'set null' })
  recordedBy?: Membership | null = null;
}
