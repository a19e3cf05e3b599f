import { Entity, Enum, Index, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';

export type OutboxStatus = 'pending' | 'sending' | 'sent' | 'failed';

@Entity({ tableName: 'outbox_messages' })
@Index({ properties: ['status', 'nextAttemptAt'] })
export class OutboxMessage extends BaseEntity<'status' | 'attempts' | 'nextAttemptAt'> {
  /** What makes this message unique (e.g. `invitation:42`); a second insert is refused. */
  @Property({ type: 'string', length: 191 })
  @Unique()
  idempotencyKey!: string;

  @Property({ type: 'string', length: 64 })
  template!: string;

  @Property({ type: 'string', length: 254 })
  toAddress!: string;

  @Property({ type: 'string', length: 300 })
  subject!: string;

  @Property({ type: 'text', columnType: 'mediumtext' })
  html!: string;

  @Property({ type: 'text', columnType: 'mediumtext' })
  text!: string;

  @Property({ type: 'json', nullable: true })
  headers?: Record<string, string> | null;

  /** Small attachments (calendar files), base64; large files are linked, not attached. */
  @Property({ type: 'json', nullable: true })
  attachments?: { filename: string; contentType: string; contentBase64: string }[] | null;

  @Enum({ items: ['pending', 'sending', 'sent', 'failed'], type: 'string', length: 16 })
  status: OutboxStatus = 'pending';

  @Property({ type: 'integer' })
  attempts: number = 0;

  @Property({ type: 'datetime', length: 3 })
  nextAttemptAt: Date = new Date();

  @Property({ type: 'datetime', length: 3, nullable: true })
  lockedUntil?: Date | null;

  @Property({ type: 'text', nullable: true })
  lastError?: string | null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  sentAt?: Date | null;

  @Property({ type: 'string', length: 255, nullable: true })
  providerMessageId?: string | null;
}
