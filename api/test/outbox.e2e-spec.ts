import { MikroORM } from '@mikro-orm/mariadb';
import { OutboxMessage } from '../src/outbox/outbox-message.entity';
import { OutboxService } from '../src/outbox/outbox.service';
import { OutboxWorker } from '../src/outbox/outbox.worker';
import { mailConfig } from '../src/config/app.config';
import { createTestApp, TestApp, unique, waitForMail } from './helpers';

describe('the e-mail outbox (real MariaDB, SMTP fake)', () => {
  let a: TestApp;
  let b: TestApp;

  beforeAll(async () => {
    a = await createTestApp();
    b = await createTestApp();
  });
  afterAll(async () => {
    await a.close();
    await b.close();
  });

  async function enqueue(t: TestApp, key: string, to: string) {
    const outbox = t.app.get(OutboxService);
    await t.orm.em.fork().transactional((em) =>
      outbox.enqueue(em, {
        idempotencyKey: key,
        template: 'welcome',
        to,
        context: { name: 'Test Maker', guildName: 'Outbox Guild', dashboardUrl: 'http://127.0.0.1:3100/' },
      }),
    );
  }

  it('keeps one row per idempotency key, however often it is enqueued', async () => {
    const key = unique('once');
    const to = `${key}@test.example`;
    await Promise.all([enqueue(a, key, to), enqueue(b, key, to), enqueue(a, key, to)]);
    expect(await a.orm.em.fork().count(OutboxMessage, { idempotencyKey: key })).toBe(1);
  });

  it('sends each message exactly once when two api instances drain at the same time', async () => {
    const tag = unique('pair');
    const recipients = Array.from({ length: 24 }, (_, i) => `${tag}-${i}@test.example`);
    for (const [i, to] of recipients.entries()) await enqueue(i % 2 ? a : b, `${tag}:${i}`, to);
    await Promise.all([a.app.get(OutboxWorker).drain(), b.app.get(OutboxWorker).drain(), a.app.get(OutboxWorker).drain()]);
    for (const to of recipients) await waitForMail(to);
    const base = process.env.SMTP_FAKE_INBOX_URL!;
    const all = (await (await fetch(`${base}/messages`)).json()) as { to: string }[];
    for (const to of recipients) expect(all.filter((m) => m.to.includes(to))).toHaveLength(1);
    const rows = await a.orm.em.fork().find(OutboxMessage, { idempotencyKey: { $like: `${tag}:%` } });
    expect(rows.every((r) => r.status === 'sent' && r.attempts === 1 && r.sentAt)).toBe(true);
  });

  it('never deadlocks when messages are enqueued while two instances drain', async () => {
    const tag = unique('busy');
    let draining = true;
    const drainLoop = async (t: TestApp) => {
      while (draining) {
        await t.app.get(OutboxWorker).drain();
        await new Promise((r) => setTimeout(r, 5));
      }
    };
    const loops = [drainLoop(a), drainLoop(b)];
    try {
      for (let batch = 0; batch < 10; batch++)
        await Promise.all(
          Array.from({ length: 6 }, (_, i) => enqueue(i % 2 ? a : b, `${tag}:${batch}:${i}`, `${tag}-${batch}-${i}@test.example`)),
        );
    } finally {
      draining = false;
      await Promise.all(loops);
    }
    // Rows a background tick claimed are still on their way; wait for them, then check all 60.
    let rows: OutboxMessage[] = [];
    for (let i = 0; i < 100; i++) {
      await a.app.get(OutboxWorker).drain();
      rows = await a.orm.em.fork().find(OutboxMessage, { idempotencyKey: { $like: `${tag}:%` } });
      if (rows.every((r) => r.status === 'sent')) break;
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(rows).toHaveLength(60);
    expect(rows.filter((r) => r.status !== 'sent' || r.attempts !== 1)).toEqual([]);
  });

  it('rolls the message back with the change that caused it', async () => {
    const key = unique('rollback');
    await expect(
      a.orm.em.fork().transactional(async (em) => {
        await a.app.get(OutboxService).enqueue(em, {
          idempotencyKey: key,
          template: 'welcome',
          to: `${key}@test.example`,
          context: { name: 'X', guildName: 'Y', dashboardUrl: 'http://127.0.0.1:3100/' },
        });
        throw new Error('the cause failed');
      }),
    ).rejects.toThrow('the cause failed');
    expect(await a.orm.em.fork().count(OutboxMessage, { idempotencyKey: key })).toBe(0);
  });

  it('retries with backoff when the mail server is down, and a dead sender\'s lease runs out', async () => {
    const key = unique('retry');
    const to = `${key}@test.example`;
    // Step by hand: no background sender may pick the row up first.
    await a.app.get(OutboxWorker).stopPolling();
    await b.app.get(OutboxWorker).stopPolling();
    // A worker whose SMTP server does not exist: the send fails and the row waits for a retry.
    const cfg = { ...a.app.get(mailConfig.KEY), port: 1, workerEnabled: false };
    const broken = new OutboxWorker(a.app.get(MikroORM), cfg as never);
    await a.orm.em.fork().nativeUpdate(OutboxMessage, { status: { $in: ['pending', 'sending'] } }, { nextAttemptAt: new Date(Date.now() + 3600_000) });
    await enqueue(a, key, to);
    await broken.drain();
    const em = a.orm.em.fork();
    const row = await em.findOneOrFail(OutboxMessage, { idempotencyKey: key });
    expect(row.status).toBe('pending');
    expect(row.attempts).toBe(1);
    expect(row.lastError).toBeTruthy();
    expect(row.nextAttemptAt.getTime() - Date.now()).toBeGreaterThan(20_000);

    // A sender that claimed the row and died leaves status 'sending' with a lease; once the lease
    // has run out, a healthy worker sends it.
    row.status = 'sending';
    row.lockedUntil = new Date(Date.now() - 1000);
    row.nextAttemptAt = new Date(Date.now() - 1000);
    await em.flush();
    await a.app.get(OutboxWorker).drain();
    await waitForMail(to);
    const after = await a.orm.em.fork().findOneOrFail(OutboxMessage, { idempotencyKey: key });
    expect(after.status).toBe('sent');
    expect(after.attempts).toBe(2);
    await broken.onApplicationShutdown();
  });
});
