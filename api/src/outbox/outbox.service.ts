import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { renderEmail, type EmailTemplateName } from '../mail/mail-templates';
import { OutboxMessage } from './outbox-message.entity';

export interface OutgoingEmail {
  /** Unique per real-world message, e.g. `invitation:42`; a repeat is silently ignored. */
  idempotencyKey: string;
  template: EmailTemplateName;
  to: string;
  context: Record<string, unknown>;
  headers?: Record<string, string>;
  attachments?: { filename: string; contentType: string; content: string | Buffer }[];
}

@Injectable()
export class OutboxService {
  /**
   * Writes the message with the caller's EntityManager, so it commits or rolls back with the
   * change that caused it. Call inside `em.transactional`. Returns false when the key was
   * already queued (nothing new was written).
   */
  async enqueue(em: EntityManager, email: OutgoingEmail): Promise<boolean> {
    const { subject, html, text } = renderEmail(email.template, email.context);
    const now = new Date();
    const attachments = email.attachments?.map((a) => ({
      filename: a.filename,
      contentType: a.contentType,
      contentBase64: Buffer.from(a.content).toString('base64'),
    }));
    const result = await em
      .createQueryBuilder(OutboxMessage)
      .insert({
        idempotencyKey: email.idempotencyKey,
        template: email.template,
        toAddress: email.to,
        subject,
        html,
        text,
        headers: email.headers ?? null,
        attachments: attachments ?? null,
        status: 'pending',
        attempts: 0,
        nextAttemptAt: now,
        createdAt: now,
        updatedAt: now,
      })
      .onConflict('idempotency_key')
      .ignore()
      .execute('run');
    // INSERT IGNORE reports 0 affected rows when the key was already there.
    return (result as { affectedRows?: number }).affectedRows === 1;
  }
}
