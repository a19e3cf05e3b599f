import { Entity, PrimaryKey, Property } from '@mikro-orm/core';

/** Each payment-service event we acted on, written in the same transaction as its effect. */
@Entity({ tableName: 'payment_webhook_events' })
export class PaymentWebhookEvent {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @Property({ type: 'string', length: 255, unique: true })
  eventId!: string;

  @Property({ type: 'string', length: 100 })
  type!: string;

  @Property({ type: 'integer', nullable: true })
  invoiceId?: number | null = null;

  @Property({ type: 'datetime', length: 3 })
  receivedAt: Date = new Date();
}
