import { EntityManager } from '@mikro-orm/mariadb';
import { Inject, Injectable } from '@nestjs/common';
import { appConfig, type AppConfig } from '../config/app.config';
import { renderEmail, type EmailTemplateName } from '../mail/mail-templates';
import { OPTIONAL_TEMPLATES, unsubscribeToken } from '../mail-preferences/unsubscribe-token';
import { OutboxMessage } from './outbox-message.entity';

export interface OutgoingEmail {
  /** Unique per real-world message, e.g. `invitation:42`; a repeat is silently ignored. */
  idempotencyKey: string;
  template: EmailTemplateName;
  /** Null for a member kept on paper (no e-mail address): nothing is queued for her. */
  to: string | null;
  context: Record<string, unknown>;
  headers?: Record<string, string>;
  attachments?: { filename: string; contentType: string; content: string | Buffer }[];
}

@Injectable()
export class OutboxService {
  constructor(@Inject(appConfig.KEY) private readonly app: AppConfig) {}

  /**
   * Writes the message with the caller's EntityManager, so it commits or rolls back with the
   * change that caused it. Call inside `em.transactional`. Returns false when the key was
   * already queued (nothing new was written).
   */
  async enqueue(em: EntityManager, email: OutgoingEmail): Promise<boolean> {
    if (!email.to) return false;
    let context = email.context;
    let headers = email.headers ?? null;
    let footer = '';
    if ((OPTIONAL_TEMPLATES as readonly string[]).includes(email.template)) {
      // Reminders go only to those who want them, each with a one-click way to stop them (RFC 8058).
      const rows: { id: number; reminders_off: number | boolean }[] = await em.execute('SELECT id, reminders_off FROM users WHERE email = ?', [email.to]);
      if (rows[0] && Boolean(Number(rows[0].reminders_off))) return false;
      if (rows[0]) {
        const query = `u=${rows[0].id}&t=${unsubscribeToken(this.app.sessionSecret, Number(rows[0].id))}`;
        const page = `${this.app.origin}/unsubscribe?${query}`;
        context = { ...context, unsubscribeUrl: page };
        headers = { ...(headers ?? {}), 'List-Unsubscribe': `<${this.app.origin}/api/unsubscribe?${query}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' };
        footer = `\n\nTo stop reminder e-mails like this one: ${page}\n`;
      }
    }
    const rendered = renderEmail(email.template, context);
    const { subject, html } = rendered;
    const text = footer ? `${rendered.text.trimEnd()}${footer}` : rendered.text;
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
        headers,
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
