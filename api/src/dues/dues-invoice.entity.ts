import { Entity, Enum, Index, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';
import { DuesPlan } from './dues-plan.entity';

export const INVOICE_STATUSES = ['open', 'paid', 'void', 'refunded', 'partially_refunded'] as const;
export type InvoiceStatus = (typeof INVOICE_STATUSES)[number];
export const PAYMENT_METHODS = ['card', 'cash', 'cheque'] as const;
export type PaymentMethod = (typeof PAYMENT_METHODS)[number];

/** What an invoice is for: the yearly dues, or a member's entry fees for one quilt show. */
export const INVOICE_PURPOSES = ['dues', 'show_entry'] as const;
export type InvoicePurpose = (typeof INVOICE_PURPOSES)[number];

export interface InvoiceLine {
  kind: 'dues' | 'proration' | 'late-fee' | 'adjustment' | 'entry-fee';
  label: string;
  amountCents: number;
}

/** What a member owes for one membership year, its lines copied from the quote when it was made. */
@Entity({ tableName: 'dues_invoices' })
@Index({ properties: ['guild', 'status'] })
@Unique({ properties: ['guild', 'receiptNumber'] })
export class DuesInvoice extends BaseEntity<
  'purpose' | 'showId' | 'status' | 'refundedCents' | 'checkoutAttempts' | 'openKey' | 'checkoutSessionId' | 'checkoutUrl' | 'paymentNote' | 'paidAt' | 'paidOn' | 'method' | 'chequeNumber' | 'receiptNumber' | 'priorPaidThrough' | 'createdBy' | 'voidedAt' | 'coversFrom' | 'coversThrough' | 'plan'
> {
  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @ManyToOne(() => Membership, { deleteRule: 'restrict' })
  membership!: Membership;

  @ManyToOne(() => DuesPlan, { nullable: true, deleteRule: 'set null' })
  plan?: DuesPlan | null = null;

  @Enum({ items: [...INVOICE_PURPOSES], type: 'string', length: 12 })
  purpose: InvoicePurpose = 'dues';

  /** For show entry fees: the show (a plain id, so the dues tables do not depend on the shows feature). */
  @Property({ type: 'integer', nullable: true, unsigned: true })
  showId?: number | null = null;

  @Property({ type: 'string', length: 80 })
  planName!: string;

  /** The membership year paid for, e.g. "2027", "2026–27", or "2026–27 and 2027–28" for a joiner. */
  @Property({ type: 'string', length: 40 })
  yearLabel!: string;

  @Property({ type: 'date', nullable: true })
  coversFrom?: string | null = null;

  @Property({ type: 'date', nullable: true })
  coversThrough?: string | null = null;

  @Property({ type: 'json' })
  lines!: InvoiceLine[];

  @Property({ type: 'integer' })
  totalCents!: number;

  @Property({ type: 'string', length: 3, columnType: 'char(3)' })
  currency!: string;

  @Enum({ items: [...INVOICE_STATUSES], type: 'string', length: 20 })
  status: InvoiceStatus = 'open';

  /** "membership:year:plan" while the invoice is open, null after: one open invoice per year and plan. */
  @Property({ type: 'string', length: 64, nullable: true, unique: true })
  openKey?: string | null = null;

  @Property({ type: 'string', length: 255, nullable: true, unique: true })
  checkoutSessionId?: string | null = null;

  @Property({ type: 'text', nullable: true })
  checkoutUrl?: string | null = null;

  /** Checkout Sessions made for this invoice so far; part of each session's idempotency key. */
  @Property({ type: 'integer' })
  checkoutAttempts: number = 0;

  /** Why the last card attempt failed, in the payment service's words. */
  @Property({ type: 'string', length: 500, nullable: true })
  paymentNote?: string | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  paidAt?: Date | null = null;

  /** The guild-local date the money came in. */
  @Property({ type: 'date', nullable: true })
  paidOn?: string | null = null;

  @Enum({ items: [...PAYMENT_METHODS], type: 'string', length: 8, nullable: true })
  method?: PaymentMethod | null = null;

  @Property({ type: 'string', length: 40, nullable: true })
  chequeNumber?: string | null = null;

  /** "2026-0007": the calendar year of paidOn and a number without gaps inside it. */
  @Property({ type: 'string', length: 16, nullable: true })
  receiptNumber?: string | null = null;

  @Property({ type: 'integer' })
  refundedCents: number = 0;

  /** paidThrough before this invoice advanced it, so a full refund can put it back. */
  @Property({ type: 'date', nullable: true })
  priorPaidThrough?: string | null = null;

  @ManyToOne(() => Membership, { nullable: true, deleteRule: 'set null' })
  createdBy?: Membership | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  voidedAt?: Date | null = null;
}
