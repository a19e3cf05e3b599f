import { IsolationLevel } from '@mikro-orm/core';
import { EntityManager, MikroORM } from '@mikro-orm/mariadb';
import { Inject, Injectable, Logger, OnApplicationBootstrap, OnApplicationShutdown } from '@nestjs/common';
import { createTransport, type Transporter } from 'nodemailer';
import { mailConfig, type MailConfig } from '../config/app.config';
import { MAX_ATTEMPTS, retryDelayMs } from './backoff';
import { OutboxMessage } from './outbox-message.entity';

const BATCH = 25;
/** SMTP connections kept open; a claimed batch is sent over all of them at once. */
const CONNECTIONS = 5;
const LEASE_MS = 2 * 60 * 1000;

/**
 * Sends what the outbox holds. Several api instances can run this at once: each claims rows with
 * SELECT … FOR UPDATE SKIP LOCKED and a lease, so a row goes to one sender; a sender that dies
 * mid-way leaves a lease that runs out and another picks the row up.
 */
@Injectable()
export class OutboxWorker implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger(OutboxWorker.name);
  private readonly transport: Transporter;
  private timer?: NodeJS.Timeout;
  private running?: Promise<unknown>;
  private stopped = false;
  private closing = false;

  constructor(
    private readonly orm: MikroORM,
    @Inject(mailConfig.KEY) private readonly mail: MailConfig,
  ) {
    this.transport = createTransport({
      // A few kept-open connections instead of one handshake per message.
      pool: true,
      maxConnections: CONNECTIONS,
      host: mail.host,
      port: mail.port,
      secure: mail.secure,
      ignoreTLS: !mail.secure && mail.host === '127.0.0.1',
      auth: mail.user ? { user: mail.user, pass: mail.password } : undefined,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 20_000,
    });
  }

  onApplicationBootstrap(): void {
    if (!this.mail.workerEnabled) return;
    const tick = () => {
      if (this.stopped) return;
      this.running = this.drain()
        .catch((e) => this.logger.error(`outbox tick failed: ${e instanceof Error ? e.message : e}`))
        .finally(() => {
          this.running = undefined;
          if (!this.stopped) this.timer = setTimeout(tick, this.mail.pollMs);
        });
    };
    this.timer = setTimeout(tick, 10);
  }

  /** Stops the background loop (drain() still works); for tests that need to step by hand. */
  async stopPolling(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    await this.running;
  }

  async onApplicationShutdown(): Promise<void> {
    this.closing = true;
    await this.stopPolling();
    this.transport.close();
  }

  /** Sends every message that is due, batch by batch; returns how many were attempted. */
  async drain(): Promise<number> {
    let total = 0;
    for (;;) {
      const claimed = await this.claim();
      if (claimed.length === 0) return total;
      total += claimed.length;
      await Promise.all(claimed.map((message) => this.send(message)));
      if (this.closing) return total;
    }
  }

  private async claim(): Promise<OutboxMessage[]> {
    const em = this.orm.em.fork();
    return em.transactional(async (tx: EntityManager) => {
      const now = new Date();
      const rows: { id: number }[] = await tx.getConnection().execute(
        `SELECT id FROM outbox_messages
          WHERE status IN ('pending', 'sending') AND next_attempt_at <= ?
            AND (locked_until IS NULL OR locked_until < ?)
          ORDER BY id LIMIT ${BATCH} FOR UPDATE SKIP LOCKED`,
        [now, now],
        'all',
        tx.getTransactionContext(),
      );
      if (rows.length === 0) return [];
      const ids = rows.map((r) => r.id);
      await tx.nativeUpdate(
        OutboxMessage,
        { id: { $in: ids } },
        { status: 'sending', lockedUntil: new Date(now.getTime() + LEASE_MS) },
      );
      return tx.find(OutboxMessage, { id: { $in: ids } }, { orderBy: { id: 'asc' } });
      // READ COMMITTED takes no gap locks, so claiming never deadlocks with the inserts of
      // transactions that are enqueueing new messages at the same moment.
    }, { isolationLevel: IsolationLevel.READ_COMMITTED });
  }

  private async send(message: OutboxMessage): Promise<void> {
    const em = this.orm.em.fork();
    const attempts = message.attempts + 1;
    try {
      const info = await this.transport.sendMail({
        from: this.mail.from,
        to: message.toAddress,
        subject: message.subject,
        html: message.html,
        text: message.text,
        headers: message.headers ?? undefined,
        attachments: message.attachments?.map((a) => ({
          filename: a.filename,
          contentType: a.contentType,
          content: Buffer.from(a.contentBase64, 'base64'),
        })),
        messageId: `<outbox-${message.id}-${message.idempotencyKey.replace(/[^A-Za-z0-9.-]/g, '.')}@selvage>`,
      });
      await em.nativeUpdate(
        OutboxMessage,
        { id: message.id, status: 'sending' },
        { status: 'sent', attempts, sentAt: new Date(), lockedUntil: null, lastError: null, providerMessageId: info.messageId ?? null },
      );
    } catch (e) {
      const reason = e instanceof Error ? e.message : String(e);
      const giveUp = attempts >= MAX_ATTEMPTS;
      this.logger.warn(`e-mail ${message.id} to ${message.toAddress} failed (attempt ${attempts}): ${reason}`);
      await em.nativeUpdate(
        OutboxMessage,
        { id: message.id, status: 'sending' },
        {
          status: giveUp ? 'failed' : 'pending',
          attempts,
          lockedUntil: null,
          lastError: reason.slice(0, 2000),
          nextAttemptAt: new Date(Date.now() + retryDelayMs(attempts)),
        },
      );
    }
  }
}
