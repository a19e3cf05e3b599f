/**
 * Fan-out of one round to 5,000 makers (BENCH_MAKERS overrides), against its own MariaDB and SMTP
 * fake: time to queue, relay rate to the SMTP fake, and SQL statements per queued message.
 * Run through `npm run bench`, which starts the database and passes the DB_* variables.
 */
import 'reflect-metadata';
import { MikroORM } from '@mikro-orm/mariadb';
import { NestFactory } from '@nestjs/core';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startSmtpFake } from '../fakes/smtp/smtp-fake';

const MAKERS = Number(process.env.BENCH_MAKERS ?? 5000);

async function main() {
  const smtp = await startSmtpFake({ smtpPort: 0, httpPort: 0, dataDir: mkdtempSync(join(tmpdir(), 'selvage-bench-mail-')) });
  Object.assign(process.env, {
    SMTP_PORT: String(smtp.smtpPort),
    SMTP_FAKE_INBOX_URL: '',
    OUTBOX_POLL_MS: '50',
    BEES_SCHEDULER_ENABLED: 'false',
    LOG_LEVEL: 'warn',
    NODE_ENV: 'production',
  });
  const { AppModule } = await import('../src/app.module');
  const { RoundMailer } = await import('../src/rounds/round-mailer.service');
  const { OutboxWorker } = await import('../src/outbox/outbox.worker');
  const app = await NestFactory.createApplicationContext(AppModule, { logger: ['error', 'warn'] });
  await app.get(OutboxWorker).stopPolling();
  const orm = app.get(MikroORM);
  const conn = orm.em.getConnection();

  console.log(`seeding a bee of ${MAKERS} makers…`);
  const tag = Date.now().toString(36);
  await conn.execute(`INSERT INTO guilds (created_at, updated_at, name, town, time_zone, currency, unit, year_start_month)
    VALUES (NOW(3), NOW(3), 'Bench guild ${tag}', 'Benchtown', 'America/Chicago', 'USD', 'in', 1)`);
  const [{ id: guildId }] = await conn.execute(`SELECT MAX(id) AS id FROM guilds`);
  // Build the rows in SQL, in batches, so seeding stays fast and out of the measurement.
  for (let start = 0; start <= MAKERS; start += 1000) {
    const values: string[] = [];
    for (let i = start; i < Math.min(start + 1000, MAKERS + 1); i++)
      values.push(`(NOW(3), NOW(3), 'maker${i}.${tag}@bench.example', 'Maker ${i}', 'x')`);
    await conn.execute(`INSERT INTO users (created_at, updated_at, email, name, password_hash) VALUES ${values.join(',')}`);
  }
  await conn.execute(`INSERT INTO memberships (created_at, updated_at, user_id, guild_id, roles, status, joined_at)
    SELECT NOW(3), NOW(3), id, ${guildId}, '[]', 'active', NOW(3) FROM users WHERE email LIKE '%.${tag}@bench.example'`);
  const [{ first }] = await conn.execute(`SELECT MIN(id) AS first FROM memberships WHERE guild_id = ${guildId}`);
  await conn.execute(`INSERT INTO bees (created_at, updated_at, guild_id, name, organiser_id, handover, start_month, months, skipped_months, rotation_order)
    VALUES (NOW(3), NOW(3), ${guildId}, 'Bench bee', ${first}, 'mail', '2030-01', 1, '[]', '[]')`);
  const [{ id: beeId }] = await conn.execute(`SELECT MAX(id) AS id FROM bees`);
  await conn.execute(`INSERT INTO bee_members (created_at, updated_at, bee_id, membership_id, status, joined_at)
    SELECT NOW(3), NOW(3), ${beeId}, id, 'active', NOW(3) FROM memberships WHERE guild_id = ${guildId}`);
  await conn.execute(`INSERT INTO bee_slots (created_at, updated_at, bee_id, month, queen_id, skipped) VALUES (NOW(3), NOW(3), ${beeId}, '2030-01', ${first}, 0)`);
  await conn.execute(`INSERT INTO rounds (created_at, updated_at, bee_id, month, queen_id, title, instructions, finished_width_mm, finished_height_mm,
      seam_allowance_mm, tolerance_mm, trim_mode, swatches, background, fabric_source, due_date, send_at, delivery_method, delivery_address,
      status, published_at, changed_fields, change_batch)
    VALUES (NOW(3), NOW(3), ${beeId}, '2030-01', ${first}, 'Bench star', 'Use **bright** solids.', 304.8, 304.8, 6.35, 3.175, 'trim',
      '[{"name":"Marigold","hex":"#E8A33D"}]', NULL, 'stash', '2030-02-15', '2020-01-01 08:00:00', 'mail', '1 Bench Lane', 'published', NOW(3), '[]', 0)`);
  const [{ id: roundId }] = await conn.execute(`SELECT MAX(id) AS id FROM rounds`);

  const questions = async () => Number((await conn.execute(`SHOW GLOBAL STATUS LIKE 'Questions'`))[0].Value);
  const q0 = await questions();
  const t0 = performance.now();
  const queued = await orm.em.fork().transactional((em) => app.get(RoundMailer).fanOut(em as never, roundId));
  const queueMs = performance.now() - t0;
  const statements = (await questions()) - q0;

  const t1 = performance.now();
  const worker = app.get(OutboxWorker);
  await worker.drain();
  const relayMs = performance.now() - t1;
  const [{ sent }] = await conn.execute(`SELECT COUNT(*) AS sent FROM outbox_messages WHERE idempotency_key LIKE 'round-assignment:${roundId}:%' AND status = 'sent'`);

  console.log(`\nFan-out of one round to ${queued} makers`);
  console.log(`  time to queue:            ${(queueMs / 1000).toFixed(2)} s (${((queued / queueMs) * 1000).toFixed(0)} messages/s)`);
  console.log(`  statements per message:   ${(statements / queued).toFixed(2)} (${statements} in all, server-wide count)`);
  console.log(`  relay to the SMTP fake:   ${Number(sent)} sent in ${(relayMs / 1000).toFixed(1)} s (${((Number(sent) / relayMs) * 1000).toFixed(0)} messages/s)`);
  await app.close();
  await smtp.close();
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
