/**
 * Part of `npm run bench`: dues under load.
 *
 * 1. Webhook acknowledgement latency for real `checkout.session.completed` events. This script runs
 *    its own api instance in-process (same build, same database) pointed at its own payments fake,
 *    which keeps its events instead of sending them. Members check out through DuesLedgerService, pay
 *    on the fake (`/_fake/checkout/:id/pay`), and the script posts each completed event the fake
 *    recorded, signed with the webhook secret, to `/api/payments/webhook`, timing every POST: each
 *    one does the real settling work (session lookup at the fake, payment row, receipt number, PDF,
 *    outbox). With the stack's own fake the events would reach the api by themselves and race ours.
 *    Once one at a time, once 10 in flight.
 * 2. The treasurer's ledger for a bench-only guild with two years of history (~1,000 payments, seeded
 *    through the entity manager): autocannon on GET /api/guilds/:id/dues/ledger at the stack's api
 *    (BENCH_URL) for BENCH_SECONDS, and SQL statements per request from MariaDB's global `Questions`
 *    counter, with the per-request cost of the session and the guild check measured on their own so
 *    the ledger's own statements can be told apart.
 *
 * Targets are printed with the results; nothing here fails on a missed target, only on errors.
 * BENCH_URL, BENCH_SECONDS, BENCH_CONNECTIONS, BENCH_WEBHOOKS, BENCH_LEDGER_MEMBERS override.
 */
import 'reflect-metadata';
import { MikroORM, RequestContext } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { NestFactory } from '@nestjs/core';
import autocannon from 'autocannon';
import { randomBytes } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import seedrandom from 'seedrandom';
import Stripe from 'stripe';
import { startPaymentsFake } from '../fakes/payments/payments-fake';
import { WRENFIELD_DUES } from '../src/database/seeders/demo-dues';

const base = process.env.BENCH_URL ?? 'http://127.0.0.1:3000';
const seconds = Number(process.env.BENCH_SECONDS ?? 10);
const connections = Number(process.env.BENCH_CONNECTIONS ?? 10);
const WEBHOOKS = Number(process.env.BENCH_WEBHOOKS ?? 100);
const LEDGER_MEMBERS = Number(process.env.BENCH_LEDGER_MEMBERS ?? 540);
const COUNTED_REQUESTS = 100;
/** Fewer for the ledger, which takes a few hundred ms each. */
const LEDGER_COUNTED = 30;
const BENCH_PASSWORD = 'harebell-bench-password-7';

const TARGETS = {
  webhookSerialP95Ms: 300,
  webhookConcurrentP95Ms: 2000,
  ledgerMinRps: 20,
  ledgerMaxP99Ms: 1000,
  ledgerMaxOwnStatements: 6,
};

// Invented people for the bench guilds.
const FIRST = ['Ada', 'Bess', 'Cora', 'Dot', 'Edie', 'Flora', 'Gwen', 'Hattie', 'Iris', 'Jo', 'Kit', 'Lena', 'Maud', 'Nina', 'Olive', 'Pearl', 'Rue', 'Sadie', 'Thea', 'Una', 'Vera', 'Winnie'];
const LAST = ['Ashgrove', 'Bramblecote', 'Calloway', 'Dunmore', 'Eskwith', 'Fallowfield', 'Gorsedge', 'Harrowby', 'Inchley', 'Juniper', 'Kettlewell', 'Larkhill', 'Mossop', 'Nettlebed', 'Orchardson', 'Pennycress', 'Quayle', 'Rushmere', 'Sorrelby', 'Thistlewood'];

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}
const ms = (n: number) => `${n.toFixed(1)} ms`;
const verdict = (ok: boolean) => (ok ? 'met' : 'NOT met');

async function pool<T>(items: T[], size: number, work: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(size, items.length) }, async () => {
      while (next < items.length) await work(items[next++]);
    }),
  );
}

async function main() {
  const health = await fetch(`${base}/api/health`).catch(() => null);
  if (!health?.ok) throw new Error(`no api at ${base}: run this through npm run bench`);

  // ---- an api instance of our own, with a payments fake that keeps its events -------------------
  const fakeDir = mkdtempSync(join(tmpdir(), 'selvage-bench-payments-'));
  process.on('exit', () => rmSync(fakeDir, { recursive: true, force: true }));
  const fake = await startPaymentsFake({ port: 0, dataDir: fakeDir, webhookUrl: null, webhookSecret: null });
  const secretKey = 'sk_test_selvage_bench';
  const webhookSecret = `whsec_bench_${randomBytes(12).toString('hex')}`;
  Object.assign(process.env, {
    PAYMENTS_SECRET_KEY: secretKey,
    PAYMENTS_WEBHOOK_SECRET: webhookSecret,
    PAYMENTS_API_URL: fake.url,
    OUTBOX_ENABLED: 'false', // the stack's api sends the receipts
    BEES_SCHEDULER_ENABLED: 'false',
    DUES_REMINDERS_ENABLED: 'false',
    LOG_LEVEL: 'warn',
    NODE_ENV: 'production',
  });
  const { AppModule } = await import('../src/app.module');
  const { configureApp } = await import('../src/configure-app');
  const { hashPassword } = await import('../src/auth/passwords');
  const { DuesLedgerService } = await import('../src/dues/dues-ledger.service');
  const { DuesInvoice } = await import('../src/dues/dues-invoice.entity');
  const { DuesPayment } = await import('../src/dues/dues-payment.entity');
  const { DuesPlan } = await import('../src/dues/dues-plan.entity');
  const { DuesRefund } = await import('../src/dues/dues-refund.entity');
  const { DuesSettingsRecord } = await import('../src/dues/dues-settings.entity');
  const { DuesStanding } = await import('../src/dues/dues-standing.entity');
  const { ReceiptCounter } = await import('../src/dues/receipt-counter.entity');
  const { todayIn } = await import('../src/dues/dues-rules');
  const { Guild } = await import('../src/guilds/guild.entity');
  const { Membership } = await import('../src/guilds/membership.entity');
  const { User } = await import('../src/users/user.entity');

  const app = await NestFactory.create<NestExpressApplication>(AppModule, { rawBody: true, logger: ['error', 'warn'] });
  const { closeSessionStore } = configureApp(app);
  await app.listen(0, '127.0.0.1');
  const own = `http://127.0.0.1:${(app.getHttpServer().address() as AddressInfo).port}`;
  const orm = app.get(MikroORM);
  const conn = orm.em.getConnection();
  const tag = Date.now().toString(36);
  const passwordHash = await hashPassword(BENCH_PASSWORD);
  const rng = seedrandom(`selvage-bench-dues`);
  const pick = <T>(list: readonly T[]) => list[Math.floor(rng() * list.length)];
  const personName = (i: number) => `${FIRST[i % FIRST.length]} ${LAST[Math.floor(i / FIRST.length) % LAST.length]}`;

  // ---- 1. webhook acknowledgement latency -------------------------------------------------------
  console.log(`\nDues: seeding ${2 * WEBHOOKS} members who will pay by card…`);
  const em = orm.em.fork() as EntityManager;
  const cardGuild = em.create(Guild, { name: `Larkmoor Quilt Circle (bench ${tag})`, town: 'Larkmoor', timeZone: 'America/Chicago', currency: 'USD' });
  const cardPlan = em.create(DuesPlan, { guild: cardGuild, name: 'Regular', kind: 'standard', yearlyCents: 3500 });
  const payers = Array.from({ length: 2 * WEBHOOKS }, (_, i) => {
    const user = em.create(User, { email: `payer${i}.${tag}@larkmoor.example`, name: personName(i), passwordHash });
    return em.create(Membership, { user, guild: cardGuild, roles: [] });
  });
  await em.flush();

  console.log('checking out through DuesLedgerService and paying on the fake…');
  const checkoutStart = performance.now();
  const ledgerService = app.get(DuesLedgerService);
  const sessions: string[] = [];
  await pool(payers, 8, async (m) => {
    const me = await orm.em.fork().findOneOrFail(Membership, { id: m.id }, { populate: ['guild', 'user'] });
    const { url } = await RequestContext.create(orm.em, () => ledgerService.checkout(me, cardPlan.id));
    const sessionId = url.split('/pay/')[1];
    const paid = await fetch(`${fake.url}/_fake/checkout/${sessionId}/pay`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ card: '4242 4242 4242 4242' }),
    });
    if (paid.status !== 200) throw new Error(`paying ${sessionId} on the fake: ${paid.status} ${await paid.text()}`);
    sessions.push(sessionId);
  });
  console.log(`  ${sessions.length} sessions paid in ${((performance.now() - checkoutStart) / 1000).toFixed(1)} s`);
  const stripe = new Stripe(secretKey, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
  const completed = await stripe.events.list({ type: 'checkout.session.completed', limit: 100 }).autoPagingToArray({ limit: 10_000 });
  const eventOf = new Map(completed.map((e) => [(e.data.object as Stripe.Checkout.Session).id, e]));
  const events = sessions.map((id) => {
    const e = eventOf.get(id);
    if (!e) throw new Error(`the fake recorded no checkout.session.completed for ${id}`);
    return e;
  });

  const post = async (event: Stripe.Event): Promise<number> => {
    const body = JSON.stringify(event);
    const signature = Stripe.webhooks.generateTestHeaderString({ payload: body, secret: webhookSecret });
    const t0 = performance.now();
    const res = await fetch(`${own}/api/payments/webhook`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'stripe-signature': signature },
      body,
    });
    const answer = (await res.json()) as { outcome?: string };
    const took = performance.now() - t0;
    if (res.status !== 200 || answer.outcome !== 'paid') throw new Error(`webhook ${event.id}: ${res.status} ${JSON.stringify(answer)}`);
    return took;
  };
  const serial: number[] = [];
  for (const e of events.slice(0, WEBHOOKS)) serial.push(await post(e));
  const concurrent: number[] = [];
  const c0 = performance.now();
  await pool(events.slice(WEBHOOKS), 10, async (e) => {
    concurrent.push(await post(e));
  });
  const concurrentWall = performance.now() - c0;
  serial.sort((x, y) => x - y);
  concurrent.sort((x, y) => x - y);
  const paidCount = await orm.em.fork().count(DuesInvoice, { guild: cardGuild.id, status: 'paid' });
  if (paidCount !== events.length) throw new Error(`${paidCount} of ${events.length} invoices are paid after their events`);

  // ---- 2. the ledger of a guild with two years of history ----------------------------------------
  console.log(`seeding two years of dues for ${LEDGER_MEMBERS} members of a bench guild…`);
  const seedStart = performance.now();
  const em2 = orm.em.fork() as EntityManager;
  const guild = em2.create(Guild, { name: `Harebell Hollow Quilters (bench ${tag})`, town: 'Harebell Hollow', timeZone: 'America/Chicago', currency: 'USD' });
  // The demo guild's rules, so the bench quotes what the demo would.
  em2.create(DuesSettingsRecord, {
    guild,
    ...WRENFIELD_DUES,
    earlyRenewalDays: WRENFIELD_DUES.earlyRenewalDays!,
  });
  const plans = {
    regular: em2.create(DuesPlan, { guild, name: 'Regular', kind: 'standard', yearlyCents: 3500 }),
    junior: em2.create(DuesPlan, { guild, name: 'Junior', kind: 'standard', yearlyCents: 1500, maxAge: 17 }),
    household: em2.create(DuesPlan, { guild, name: 'Household', kind: 'household', yearlyCents: 5000 }),
  };
  const treasurerEmail = `treasurer.${tag}@harebell.example`;
  const treasurerUser = em2.create(User, { email: treasurerEmail, name: 'Marigold Fenwick', passwordHash });
  const treasurer = em2.create(Membership, { user: treasurerUser, guild, roles: ['treasurer'] });
  const thisYear = Number(todayIn('America/Chicago').slice(0, 4));
  const years = [thisYear - 1, thisYear];
  const received: { invoice: InstanceType<typeof DuesInvoice>; paidAt: Date }[] = [];
  let payments = 0;
  for (let i = 0; i < LEDGER_MEMBERS; i++) {
    const user = em2.create(User, { email: `member${i}.${tag}@harebell.example`, name: personName(i), passwordHash });
    const membership = em2.create(Membership, { user, guild, roles: [] });
    const r = rng();
    const plan = r < 0.08 ? plans.junior : r < 0.18 ? plans.household : plans.regular;
    let paidThrough: string | null = null;
    for (const year of years) {
      const roll = rng();
      if (roll < 0.06) continue; // not a member that year, or not yet
      // Renewals from early November to late February; a few after the grace period, with the fee.
      const start = Date.UTC(year - 1, 10, 2);
      const paidAt = new Date(start + Math.floor(rng() * 118 * 86_400_000) + 15 * 3_600_000);
      if (paidAt.getTime() > Date.now()) continue;
      const late = paidAt.getTime() > Date.UTC(year, 1, 1, 6);
      const lines: { kind: 'dues' | 'late-fee'; label: string; amountCents: number }[] = [{ kind: 'dues', label: `${year} dues — ${plan.name}`, amountCents: plan.yearlyCents }];
      if (late) lines.push({ kind: 'late-fee' as const, label: `Late fee (renewed after 1 February ${year})`, amountCents: 500 });
      const total = lines.reduce((t, l) => t + l.amountCents, 0);
      const issued = new Date(paidAt.getTime() - Math.floor(rng() * 3_600_000));
      const common = {
        guild,
        membership,
        plan,
        planName: plan.name,
        yearLabel: String(year),
        coversFrom: `${year}-01-01`,
        coversThrough: `${year}-12-31`,
        lines,
        totalCents: total,
        currency: 'USD',
        createdAt: issued,
        updatedAt: paidAt,
      };
      if (roll < 0.09) {
        // An abandoned checkout, voided.
        em2.create(DuesInvoice, { ...common, status: 'void', voidedAt: paidAt });
        continue;
      }
      const method = rng() < 0.6 ? 'card' : rng() < 0.65 ? 'cash' : 'cheque';
      const chequeNumber = method === 'cheque' ? String(100 + Math.floor(rng() * 900)) : null;
      const refund = rng() < 0.02 ? (late ? 500 : total) : 0;
      const invoice = em2.create(DuesInvoice, {
        ...common,
        status: refund === 0 ? 'paid' : refund === total ? 'refunded' : 'partially_refunded',
        paidAt,
        paidOn: todayIn('America/Chicago', paidAt),
        method,
        chequeNumber,
        refundedCents: refund,
        priorPaidThrough: paidThrough,
        createdBy: method === 'card' ? null : treasurer,
      });
      const fee = method === 'card' ? Math.round(total * 0.029) + 30 : 0;
      const payment = em2.create(DuesPayment, {
        invoice,
        guild,
        method,
        amountCents: total,
        feeCents: fee,
        netCents: total - fee,
        paymentIntentId: method === 'card' ? `pi_bench_${tag}_${i}_${year}` : null,
        chargeId: method === 'card' ? `ch_bench_${tag}_${i}_${year}` : null,
        cardBrand: method === 'card' ? pick(['visa', 'mastercard', 'amex']) : null,
        cardLast4: method === 'card' ? String(1000 + Math.floor(rng() * 9000)) : null,
        chequeNumber,
        paidAt,
        refundedCents: refund,
        recordedBy: method === 'card' ? null : treasurer,
      });
      if (refund) em2.create(DuesRefund, { payment, guild, amountCents: refund, reason: 'Asked to be refunded', by: treasurer, byName: 'Marigold Fenwick' });
      received.push({ invoice, paidAt });
      payments++;
      if (refund !== total) paidThrough = `${year}-12-31`;
    }
    em2.create(DuesStanding, { membership, plan, paidThrough });
  }
  // Receipt numbers: the calendar year of the payment and a count without gaps, in payment order.
  received.sort((x, y) => x.paidAt.getTime() - y.paidAt.getTime());
  const counters = new Map<string, number>();
  for (const { invoice } of received) {
    const y = invoice.paidOn!.slice(0, 4);
    const n = (counters.get(y) ?? 0) + 1;
    counters.set(y, n);
    invoice.receiptNumber = `${y}-${String(n).padStart(4, '0')}`;
  }
  for (const [y, n] of counters) em2.create(ReceiptCounter, { guild, year: Number(y), nextNumber: n + 1 });
  await em2.flush();
  const invoiceCount = await orm.em.fork().count(DuesInvoice, { guild: guild.id });
  console.log(`  ${invoiceCount} invoices, ${payments} payments in ${((performance.now() - seedStart) / 1000).toFixed(1)} s`);

  // The stack's api, signed in as the bench guild's treasurer.
  const signIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: base },
    body: JSON.stringify({ email: treasurerEmail, password: BENCH_PASSWORD }),
  });
  if (signIn.status !== 200) throw new Error(`treasurer sign-in failed: ${signIn.status} ${await signIn.text()}`);
  const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
  const ledgerPath = `/api/guilds/${guild.id}/dues/ledger`;
  const first = await fetch(`${base}${ledgerPath}`, { headers: { cookie } });
  if (first.status !== 200) throw new Error(`${ledgerPath}: ${first.status} ${await first.text()}`);
  const ledger = (await first.json()) as { rows: unknown[]; totals: { count: number; netCents: number } };
  const ledgerBytes = JSON.stringify(ledger).length;

  // SQL statements per request: MariaDB's server-wide Questions counter around a batch of requests,
  // one at a time, minus what the server does meanwhile with nobody asking (the stack api's outbox
  // worker polls). Counted before the load test (whose last requests the api is still answering after
  // autocannon stops) and once the receipts of the payments above are sent, so that background is quiet.
  // The lowest of three batches, as background work only ever adds.
  const questions = async () => Number(((await conn.execute(`SHOW GLOBAL STATUS LIKE 'Questions'`)) as { Value: string }[])[0].Value);
  for (const until = Date.now() + 120_000; Date.now() < until; ) {
    const [{ n }] = await conn.execute<{ n: number }[]>(`SELECT COUNT(*) AS n FROM outbox_messages WHERE status IN ('pending', 'sending')`);
    if (Number(n) === 0) break;
    await new Promise((r) => setTimeout(r, 500));
  }
  const idleRate = async () => {
    const q0 = await questions();
    const t0 = performance.now();
    await new Promise((r) => setTimeout(r, 5000));
    return ((await questions()) - q0 - 1) / (performance.now() - t0);
  };
  const background = await idleRate();
  const perRequest = async (path: string, n = COUNTED_REQUESTS) => {
    const counts: number[] = [];
    for (let batch = 0; batch < 3; batch++) {
      const q0 = await questions();
      const t0 = performance.now();
      for (let i = 0; i < n; i++) {
        const res = await fetch(`${base}${path}`, { headers: { cookie } });
        if (!res.ok) throw new Error(`${path}: ${res.status}`);
        await res.arrayBuffer();
      }
      const spent = (await questions()) - q0 - 1 - background * (performance.now() - t0);
      counts.push(spent / n);
    }
    return Math.min(...counts);
  };
  const me = await perRequest('/api/auth/me');
  const guildPage = await perRequest(`/api/guilds/${guild.id}`);
  const ledgerStatements = await perRequest(ledgerPath, LEDGER_COUNTED);
  const oneYearStatements = await perRequest(`${ledgerPath}?year=${years[0]}`, LEDGER_COUNTED);
  const ownStatements = ledgerStatements - guildPage;

  // A short warm-up first: the api's database pool starts empty and opens connections on demand.
  const warm = await autocannon({ url: `${base}${ledgerPath}`, connections, duration: 3, headers: { cookie } });
  const warmFailed = warm.non2xx + warm.errors;
  const load = await autocannon({ url: `${base}${ledgerPath}`, connections, duration: seconds, headers: { cookie } });
  const failed = load.non2xx + load.errors;


  console.log(`\nWebhook acknowledgement (checkout.session.completed, ${WEBHOOKS} events each way)`);
  console.log('  method: events the payments fake recorded for sessions really paid on it, signed and posted by this');
  console.log('  script to an api instance it runs itself (same build and database; its fake sends no events of its');
  console.log('  own, so every POST settled the payment: session lookup, payment row, receipt number and PDF, outbox)');
  console.log(`  one at a time:  p50 ${ms(percentile(serial, 50))}, p95 ${ms(percentile(serial, 95))}, max ${ms(serial[serial.length - 1])}`);
  console.log(
    `  10 in flight:   p50 ${ms(percentile(concurrent, 50))}, p95 ${ms(percentile(concurrent, 95))}, max ${ms(concurrent[concurrent.length - 1])}` +
      ` (${((concurrent.length / concurrentWall) * 1000).toFixed(1)} payments/s for one guild)`,
  );
  console.log(`  target: p95 one at a time <= ${TARGETS.webhookSerialP95Ms} ms: ${verdict(percentile(serial, 95) <= TARGETS.webhookSerialP95Ms)}`);
  console.log(`  target: p95 10 in flight <= ${TARGETS.webhookConcurrentP95Ms} ms: ${verdict(percentile(concurrent, 95) <= TARGETS.webhookConcurrentP95Ms)}`);

  console.log(`\nTreasurer's ledger: ${ledger.rows.length} rows (${payments} payments over ${years.join(' and ')}), ${(ledgerBytes / 1024).toFixed(0)} KB of JSON`);
  console.log(`  GET ${ledgerPath.replace(String(guild.id), ':id')} at ${base}, ${connections} connections for ${seconds} s`);
  console.log(
    `  ${load.requests.average.toFixed(1)} req/s, p50 ${load.latency.p50} ms, p99 ${load.latency.p99} ms (${load.requests.total} requests` +
      `${failed ? `, ${failed} NOT 2xx` : ', all 2xx'}; 3 s warm-up before: ${warm.requests.total} requests, ${warmFailed} not 2xx)`,
  );
  console.log(`  SQL statements per request (MariaDB Questions, lowest of 3 batches of ${COUNTED_REQUESTS} (ledger ${LEDGER_COUNTED}), idle background ${(background * 1000).toFixed(1)}/s taken off):`);
  const statementLine = (label: string, n: number) => console.log(`    ${label.padEnd(55)} ${n.toFixed(2)}`);
  statementLine('GET /api/auth/me (session read and touch, user):', me);
  statementLine('GET /api/guilds/:id (the same and the guild check):', guildPage);
  statementLine('GET …/dues/ledger:', ledgerStatements);
  statementLine(`GET …/dues/ledger?year=${years[0]} (about half the rows):`, oneYearStatements);
  statementLine("the ledger's own (ledger minus the guild page):", ownStatements);
  console.log(`  target: every answer 2xx, >= ${TARGETS.ledgerMinRps} req/s with p99 <= ${TARGETS.ledgerMaxP99Ms} ms: ${verdict(failed === 0 && load.requests.average >= TARGETS.ledgerMinRps && load.latency.p99 <= TARGETS.ledgerMaxP99Ms)}`);
  console.log(`  target: the ledger's own statements <= ${TARGETS.ledgerMaxOwnStatements}, the same for fewer rows: ${verdict(ownStatements <= TARGETS.ledgerMaxOwnStatements + 0.5 && Math.abs(oneYearStatements - ledgerStatements) < 0.5)}`);

  await app.close();
  await closeSessionStore();
  await fake.close();
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? (e.stack ?? e.message) : e);
  process.exit(1);
});
