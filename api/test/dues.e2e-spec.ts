import Stripe from 'stripe';
import request from 'supertest';
import { DuesInvoice } from '../src/dues/dues-invoice.entity';
import { DuesPayment } from '../src/dues/dues-payment.entity';
import { DuesRefund } from '../src/dues/dues-refund.entity';
import { todayIn } from '../src/dues/dues-rules';
import { DuesStanding } from '../src/dues/dues-standing.entity';
import { MoneyAuditEntry } from '../src/dues/money-audit.entity';
import { PaymentWebhookEvent } from '../src/dues/payment-webhook-event.entity';
import { OutboxMessage } from '../src/outbox/outbox-message.entity';
import {
  createScenario,
  createTestApp,
  eventually,
  signIn,
  startPaymentsHarness,
  waitForMail,
  type PaymentsHarness,
  type TestApp,
  pdfText,
} from './helpers';

type Agent = Awaited<ReturnType<typeof signIn>>;

/** The rules every test here uses: a calendar year due 1 January, 31 days' grace, $5 late fee. */
export const TEST_SETTINGS = {
  yearStartMonth: 1,
  dueMonth: 1,
  dueDay: 1,
  graceDays: 31,
  lateFeeCents: 500,
  // Renewal opens on 1 January, so a member paid through this year has nothing to pay until then.
  earlyRenewalDays: 0,
  // Joiners pay the full year whatever the month, so amounts do not depend on the day the tests run.
  proration: [],
};

const sessionOf = (url: string) => url.split('/pay/')[1];


describe('dues: online payment through the payments fake and its signed events (real MariaDB)', () => {
  let h: PaymentsHarness;
  let t: TestApp;
  let s: Awaited<ReturnType<typeof createScenario>>;
  let treasurer: Agent;
  let member: Agent;
  const plans: Record<string, number> = {};
  let year: number;
  let url: string;
  const db = () => t.orm.em.fork();

  beforeAll(async () => {
    h = await startPaymentsHarness();
    t = await createTestApp();
    h.attach(t);
    s = await createScenario(t);
    treasurer = await signIn(t, s.treasurer.email);
    member = await signIn(t, s.member.email);
    url = `/api/guilds/${s.guild.id}/dues`;
    year = Number(todayIn(s.guild.timeZone).slice(0, 4));
  });
  afterAll(async () => {
    await h.close();
    await t.close();
  });

  const invoiceRow = (id: number) => db().findOneOrFail(DuesInvoice, { id });

  it('lets the treasurer set the dues rules, refusing bad ones field by field', async () => {
    const bad = await treasurer
      .put(`${url}/settings`)
      .send({ ...TEST_SETTINGS, dueMonth: 2, dueDay: 31, currency: 'XYZ', proration: [{ fromMonth: 7, charge: 'half', coversNextYear: false }] });
    expect(bad.status).toBe(400);
    expect(bad.body.errors.dueDay.join(' ')).toMatch(/day of February \(1 to 29\)/);
    expect(bad.body.errors.currency.join(' ')).toMatch(/not a currency this system knows/);
    expect(bad.body.errors.proration.join(' ')).toMatch(/first proration band must start in January/);

    const typed = await treasurer.put(`${url}/settings`).send({ ...TEST_SETTINGS, lateFeeCents: -1, graceDays: 1.5, proration: [{ fromMonth: 13, charge: 'some' }] });
    expect(typed.status).toBe(400);
    expect(Object.keys(typed.body.errors).sort()).toEqual(
      ['graceDays', 'lateFeeCents', 'proration.0.charge', 'proration.0.coversNextYear', 'proration.0.fromMonth'].sort(),
    );
    expect((await member.put(`${url}/settings`).send(TEST_SETTINGS)).status).toBe(403);
    expect(await db().count(MoneyAuditEntry, { guild: s.guild.id })).toBe(0);

    const ok = await treasurer.put(`${url}/settings`).send(TEST_SETTINGS);
    expect(ok.status).toBe(200);
    // TRADE.md §4.3 (S65): a calendar year due 1 January; 31 days' grace ends on 1 February.
    expect(ok.body).toMatchObject({
      currency: 'USD',
      yearStartMonth: 1,
      lateFeeCents: 500,
      currentYear: { label: String(year), startsOn: `${year}-01-01`, endsOn: `${year}-12-31` },
      dueOn: `${year}-01-01`,
      graceEndsOn: `${year}-02-01`,
    });
    const seen = await member.get(`${url}/settings`);
    expect(seen.status).toBe(200);
    expect(seen.body.graceDays).toBe(31);
  });

  it('lets the treasurer keep plans; members see the ones on offer', async () => {
    const make = async (body: Record<string, unknown>) => {
      const res = await treasurer.post(`${url}/plans`).send(body);
      expect(res.status).toBe(201);
      plans[res.body.name] = res.body.id;
    };
    // TRADE.md §4.1–4.2: $30 regular dues, $15 juniors; lifetime and honorary members pay none.
    await make({ name: 'Regular', kind: 'standard', yearlyCents: 3000 });
    await make({ name: 'Junior', kind: 'standard', yearlyCents: 1500, maxAge: 17 });
    await make({ name: 'Household', kind: 'household', yearlyCents: 4500 });
    await make({ name: 'Lifetime', kind: 'lifetime', yearlyCents: 0 });
    await make({ name: 'Retired', kind: 'standard', yearlyCents: 2000, active: false });

    for (const [body, field] of [
      [{ name: 'Free', kind: 'standard', yearlyCents: 0 }, 'yearlyCents'],
      [{ name: 'Half', kind: 'standard', yearlyCents: 12.5 }, 'yearlyCents'],
      [{ name: 'Minus', kind: 'standard', yearlyCents: -100 }, 'yearlyCents'],
      [{ name: 'Paid lifetime', kind: 'lifetime', yearlyCents: 500 }, 'yearlyCents'],
      [{ name: 'Odd ages', kind: 'standard', yearlyCents: 100, minAge: 20, maxAge: 10 }, 'maxAge'],
      [{ name: 'Odd kind', kind: 'patron', yearlyCents: 100 }, 'kind'],
    ] as const) {
      const res = await treasurer.post(`${url}/plans`).send(body);
      expect(res.status).toBe(400);
      expect(res.body.errors[field]).toBeDefined();
    }
    expect((await treasurer.post(`${url}/plans`).send({ name: 'Regular', kind: 'standard', yearlyCents: 100 })).status).toBe(409);
    expect((await member.post(`${url}/plans`).send({ name: 'Mine', kind: 'standard', yearlyCents: 100 })).status).toBe(403);

    const mine = await member.get(`${url}/plans`);
    expect(mine.body.map((p: { name: string }) => p.name).sort()).toEqual(['Household', 'Junior', 'Lifetime', 'Regular']);
    const all = await treasurer.get(`${url}/plans`);
    expect(all.body.find((p: { name: string }) => p.name === 'Retired')).toMatchObject({ active: false, yearlyCents: 2000 });
  });

  it('shows a member who never paid as lapsed, with nothing open', async () => {
    const me = await member.get(`${url}/me`);
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ status: 'lapsed', paidThrough: null, plan: null, quote: null, openInvoice: null, history: [] });
    // Each plan she could choose, quoted as a joiner: something to pay, never a late fee.
    const quoted = me.body.quotes as { planId: number; quote: { totalCents: number; lines: { kind: string }[] } }[];
    expect(quoted.map((q) => q.planId).sort()).toEqual([plans.Household, plans.Junior, plans.Regular].sort());
    for (const { quote } of quoted) {
      expect(quote.totalCents).toBeGreaterThan(0);
      expect(quote.lines.map((l) => l.kind)).not.toContain('late-fee');
    }
  });

  it('refuses plans she cannot pay for, with a reason, and records nothing', async () => {
    const outsider = await signIn(t, s.outsider.email);
    const foreign = await outsider.post(`/api/guilds/${s.otherGuild.id}/dues/plans`).send({ name: 'Theirs', kind: 'standard', yearlyCents: 2500 });
    expect(foreign.status).toBe(201);
    const cases: [unknown, number, RegExp][] = [
      [foreign.body.id, 404, /No such plan/],
      [999999, 404, /No such plan/],
      [plans.Retired, 409, /no longer offered/],
      [plans.Lifetime, 409, /given by the guild/],
      [plans.Junior, 409, /aged 17 and under.*date of birth/],
      [plans.Household, 409, /household/],
      ['abc', 400, /check the highlighted/],
    ];
    for (const [planId, status, message] of cases) {
      const res = await member.post(`${url}/checkout`).send({ planId });
      expect([planId, res.status]).toEqual([planId, status]);
      expect(res.body.message).toMatch(message);
    }
    const set = await treasurer.patch(`${url}/members/${s.member.membership!.id}`).send({ birthDate: '1961-05-20' });
    expect(set.status).toBe(200);
    const junior = await member.post(`${url}/checkout`).send({ planId: plans.Junior });
    expect(junior.status).toBe(409);
    expect(junior.body.message).toMatch(/aged 17 and under. Choose another plan/);
    expect(await db().count(DuesInvoice, { guild: s.guild.id })).toBe(0);
  });

  let invoiceId: number;
  let sessionId: string;

  it('makes one invoice and one Checkout Session for a double click', async () => {
    const [a, b] = await Promise.all([
      member.post(`${url}/checkout`).send({ planId: plans.Regular }),
      member.post(`${url}/checkout`).send({ planId: plans.Regular }),
    ]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body).toEqual(b.body);
    expect(a.body.url).toContain(`${h.fake.url}/pay/cs_test_`);
    invoiceId = a.body.invoiceId;
    sessionId = sessionOf(a.body.url);
    const rows = await db().find(DuesInvoice, { membership: s.member.membership!.id });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ status: 'open', totalCents: 3000, checkoutAttempts: 1, checkoutSessionId: sessionId, currency: 'USD' });
    // A later click reuses the session while it is open.
    const again = await member.post(`${url}/checkout`).send({ planId: plans.Regular });
    expect(again.body).toEqual(a.body);
    const session = await h.stripe.checkout.sessions.retrieve(sessionId);
    expect(session).toMatchObject({ amount_total: 3000, currency: 'usd', metadata: { invoiceId: String(invoiceId), guildId: String(s.guild.id) } });
    expect(session.success_url).toBe(`${process.env.APP_ORIGIN ?? 'http://127.0.0.1:3100'}/guilds/${s.guild.id}/dues/return?invoice=${invoiceId}&session={CHECKOUT_SESSION_ID}`);
    expect((await member.get(`${url}/me`)).body.openInvoice).toEqual({ id: invoiceId });
  });

  it('leaves the invoice open, with the reason, when the card is declined', async () => {
    const declined = await h.pay(sessionId, '4000 0000 0000 0002');
    expect(declined.status).toBe(402);
    const row = await eventually(async () => {
      const r = await invoiceRow(invoiceId);
      return r.paymentNote ? r : undefined;
    }, 20_000, 'the payment_failed note');
    expect(row.status).toBe('open');
    expect(row.paymentNote).toMatch(/declined/i);
  });

  it('marks it paid from the completed event: fee and net, receipt number, paid through, e-mail with the PDF', async () => {
    const paid = await h.pay(sessionId);
    expect(paid.status).toBe(200);
    const row = await eventually(async () => {
      const r = await invoiceRow(invoiceId);
      return r.status === 'paid' ? r : undefined;
    }, 20_000, 'the invoice paid by the event');
    expect(row.receiptNumber).toBe(`${year}-0001`);
    expect(row.method).toBe('card');
    const payment = await db().findOneOrFail(DuesPayment, { invoice: invoiceId });
    // The fake's fee: 2.9% + 30 cents (87 + 30 on $30.00).
    expect(payment).toMatchObject({ amountCents: 3000, feeCents: 117, netCents: 2883, method: 'card', cardLast4: '4242', refundedCents: 0 });
    const standing = await db().findOneOrFail(DuesStanding, { membership: s.member.membership!.id }, { populate: ['plan'] });
    expect(standing.paidThrough).toBe(`${year}-12-31`);
    expect(standing.plan?.id).toBe(plans.Regular);

    const me = await member.get(`${url}/me`);
    expect(me.body).toMatchObject({ status: 'current', paidThrough: `${year}-12-31`, openInvoice: null, plan: { name: 'Regular' } });
    expect(me.body.history[0]).toMatchObject({ invoiceId, status: 'paid', receiptNumber: `${year}-0001`, totalCents: 3000, method: 'card' });

    const mail = await waitForMail(s.member.email, (m) => m.subject.includes(`${year}-0001`));
    expect(mail.subject).toBe(`Receipt ${year}-0001: $30.00 dues paid to ${s.guild.name}`);
    expect(mail.text).toContain('Visa card ending 4242');
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments![0]).toMatchObject({ filename: `receipt-${year}-0001.pdf`, contentType: 'application/pdf' });
    const text = pdfText(Buffer.from(mail.attachments![0].contentBase64, 'base64'));
    for (const expected of ['Receipt', `No. ${year}-0001`, '$30.00', s.member.user.name, s.guild.name, 'Visa card ending 4242', `31 December ${year}`])
      expect(text).toContain(expected);

    const pdf = await member.get(`${url}/invoices/${invoiceId}/receipt.pdf`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(pdfText(pdf.body as Buffer)).toContain(`No. ${year}-0001`);

    const again = await member.post(`${url}/checkout`).send({ planId: plans.Regular });
    expect(again.status).toBe(409);
    expect(again.body.message).toMatch(new RegExp(`^Your dues are paid through 31 December ${year}\\.`));
  });

  it('makes one payment from the same event delivered five times at once', async () => {
    await h.drained();
    const completed = h.events.find((e) => e.type === 'checkout.session.completed' && e.body.includes(sessionId))!;
    expect(completed.status).toBe(200);
    const answers = await Promise.all(Array.from({ length: 5 }, () => h.deliver(completed.body)));
    expect(answers.map((r) => r.status)).toEqual([200, 200, 200, 200, 200]);
    expect(await db().count(DuesPayment, { invoice: invoiceId })).toBe(1);
    expect(await db().count(PaymentWebhookEvent, { eventId: completed.id })).toBe(1);
    expect(await db().count(OutboxMessage, { idempotencyKey: `receipt:${invoiceId}` })).toBe(1);
    expect((await invoiceRow(invoiceId)).receiptNumber).toBe(`${year}-0001`);
  });

  it('refuses a changed body, a wrong secret and a stale timestamp with 400, recording nothing', async () => {
    const completed = h.events.find((e) => e.type === 'checkout.session.completed' && e.body.includes(sessionId))!;
    const forged = completed.body.replace(completed.id, 'evt_forged_0001');
    const header = (body: string, secret = h.webhookSecret, timestamp = Math.floor(Date.now() / 1000)) =>
      Stripe.webhooks.generateTestHeaderString({ payload: body, secret, timestamp });
    const send = (body: string, signature?: string) => {
      const req = request(t.http).post('/api/payments/webhook').set('Content-Type', 'application/json');
      return (signature ? req.set('Stripe-Signature', signature) : req).send(body);
    };
    const tampered = await send(forged.replace('"amount_total": 3000', '"amount_total": 1'), header(forged));
    expect(tampered.status).toBe(400);
    expect(tampered.body.message).toMatch(/signature could not be verified/);
    expect((await h.deliver(forged, { secret: 'whsec_someone_else' })).status).toBe(400);
    const stale = await h.deliver(forged, { timestamp: Math.floor(Date.now() / 1000) - 3600 });
    expect(stale.status).toBe(400);
    expect(stale.body.message).toMatch(/stale timestamp/);
    expect((await send(forged)).status).toBe(400);
    expect((await send('not json', header('not json'))).status).toBe(400);
    expect(await db().count(PaymentWebhookEvent, { eventId: 'evt_forged_0001' })).toBe(0);
    expect(await db().count(DuesPayment, { invoice: invoiceId })).toBe(1);
  });

  it('settles events that come out of order: a refund before the payment, a failure after it', async () => {
    const admin = await signIn(t, s.admin.email);
    const started = await admin.post(`${url}/checkout`).send({ planId: plans.Regular });
    expect(started.status).toBe(201);
    const adminInvoice = started.body.invoiceId as number;
    const adminSession = sessionOf(started.body.url);
    h.mode = 'hold';
    const paid = await h.pay(adminSession);
    const pi = (paid.body.payment_intent as { id: string }).id;
    await h.stripe.refunds.create({ payment_intent: pi, amount: 500 });
    const held = await eventually(async () => {
      const mine = h.events.filter((e) => e.body.includes(pi) || e.body.includes(adminSession));
      const want = ['checkout.session.completed', 'charge.refunded', 'payment_intent.succeeded'];
      return want.every((w) => mine.some((e) => e.type === w)) ? mine : undefined;
    }, 20_000, 'the held events');
    await h.drained();
    h.mode = 'forward';
    const byType = (type: string) => held.find((e) => e.type === type)!;
    expect((await invoiceRow(adminInvoice)).status).toBe('open');

    expect((await h.deliver(byType('charge.refunded').body)).status).toBe(200);
    let row = await invoiceRow(adminInvoice);
    expect(row).toMatchObject({ status: 'partially_refunded', refundedCents: 500, receiptNumber: `${year}-0002` });
    const payment = await db().findOneOrFail(DuesPayment, { invoice: adminInvoice });
    expect(payment).toMatchObject({ amountCents: 3000, refundedCents: 500, feeCents: 117, paymentIntentId: pi });
    expect(await db().find(DuesRefund, { payment: payment.id })).toEqual([expect.objectContaining({ amountCents: 500, byName: 'Payment service' })]);

    expect((await h.deliver(byType('checkout.session.completed').body)).status).toBe(200);
    expect((await h.deliver(byType('payment_intent.succeeded').body)).status).toBe(200);
    expect((await h.deliver(byType('charge.refunded').body)).status).toBe(200);
    const failure = JSON.parse(byType('payment_intent.succeeded').body);
    failure.id = `evt_late_failure_${adminInvoice}`;
    failure.type = 'payment_intent.payment_failed';
    failure.data.object.last_payment_error = { message: 'Your card was declined.' };
    expect((await h.deliver(JSON.stringify(failure))).status).toBe(200);

    row = await invoiceRow(adminInvoice);
    expect(row).toMatchObject({ status: 'partially_refunded', refundedCents: 500, paymentNote: null });
    expect(await db().count(DuesPayment, { invoice: adminInvoice })).toBe(1);
    expect(await db().count(DuesRefund, { payment: payment.id })).toBe(1);
    expect(await db().count(OutboxMessage, { idempotencyKey: `receipt:${adminInvoice}` })).toBe(1);
  });

  it('shows the return page a paid invoice even when no event arrives', async () => {
    const chair = await signIn(t, s.membershipChair.email);
    const started = await chair.post(`${url}/checkout`).send({ planId: plans.Regular });
    const chairInvoice = started.body.invoiceId as number;
    h.mode = 'fail';
    expect((await h.pay(sessionOf(started.body.url))).status).toBe(200);
    await new Promise((r) => setTimeout(r, 300));
    expect((await invoiceRow(chairInvoice)).status).toBe('open');
    const view = await chair.get(`${url}/invoices/${chairInvoice}`);
    expect(view.status).toBe(200);
    expect(view.body).toMatchObject({ id: chairInvoice, status: 'paid', receiptNumber: `${year}-0003`, method: 'card', totalCents: 3000, label: String(year) });
    h.mode = 'forward';
    await fetch(`${h.fake.url}/_fake/deliveries/flush`, { method: 'POST' });
    await h.drained();
    expect(await db().count(DuesPayment, { invoice: chairInvoice })).toBe(1);
    expect((await invoiceRow(chairInvoice)).receiptNumber).toBe(`${year}-0003`);
  });

  it("keeps another member's invoice and receipt out of sight", async () => {
    const other = await signIn(t, s.showChair.email);
    expect((await other.get(`${url}/invoices/${invoiceId}`)).status).toBe(404);
    expect((await other.get(`${url}/invoices/${invoiceId}/receipt.pdf`)).status).toBe(404);
    const outsider = await signIn(t, s.outsider.email);
    expect((await outsider.get(`/api/guilds/${s.otherGuild.id}/dues/invoices/${invoiceId}`)).status).toBe(404);
    const seen = await treasurer.get(`${url}/invoices/${invoiceId}`);
    expect(seen.body).toMatchObject({ memberName: s.member.user.name, status: 'paid' });
  });

  it('refunds a card payment in part, refuses too much, then refunds the rest', async () => {
    for (const amountCents of [0, -5, 12.5, 'ten']) {
      const res = await treasurer.post(`${url}/invoices/${invoiceId}/refunds`).send({ amountCents });
      expect(res.status).toBe(400);
      expect(res.body.errors.amountCents).toBeDefined();
    }
    expect((await member.post(`${url}/invoices/${invoiceId}/refunds`).send({ amountCents: 100 })).status).toBe(403);
    const part = await treasurer.post(`${url}/invoices/${invoiceId}/refunds`).send({ amountCents: 1000, reason: 'Moved away in the spring' });
    expect(part.status).toBe(201);
    expect(part.body).toMatchObject({ status: 'partially_refunded', refundedCents: 1000 });
    const tooMuch = await treasurer.post(`${url}/invoices/${invoiceId}/refunds`).send({ amountCents: 2500 });
    expect(tooMuch.status).toBe(400);
    expect(tooMuch.body.errors.amountCents[0]).toBe('You can refund at most $20.00 on this payment.');
    const payment = await db().findOneOrFail(DuesPayment, { invoice: invoiceId });
    expect(await db().count(DuesRefund, { payment: payment.id })).toBe(1);

    const rest = await treasurer.post(`${url}/invoices/${invoiceId}/refunds`).send({ amountCents: 2000 });
    expect(rest.status).toBe(201);
    expect(rest.body).toMatchObject({ status: 'refunded', refundedCents: 3000 });
    await h.drained();
    expect(await db().findOneOrFail(DuesPayment, { invoice: invoiceId })).toMatchObject({ refundedCents: 3000 });
    expect(await db().count(DuesRefund, { payment: payment.id })).toBe(2);
    const service = await h.stripe.refunds.list({ payment_intent: payment.paymentIntentId! });
    expect(service.data.map((r) => r.amount).sort()).toEqual([1000, 2000]);
    // A full refund takes back the year it paid for.
    expect((await member.get(`${url}/me`)).body).toMatchObject({ status: 'lapsed', paidThrough: null });
    expect((await treasurer.post(`${url}/invoices/${invoiceId}/refunds`).send({ amountCents: 1 })).status).toBe(409);
  });

  it('voids an open invoice and expires its session; never a paid one', async () => {
    const show = await signIn(t, s.showChair.email);
    const started = await show.post(`${url}/checkout`).send({ planId: plans.Regular });
    const id = started.body.invoiceId as number;
    expect((await show.post(`${url}/invoices/${id}/void`).send({})).status).toBe(403);
    const voided = await treasurer.post(`${url}/invoices/${id}/void`).send({});
    expect(voided.status).toBe(200);
    expect(voided.body.status).toBe('void');
    expect((await h.stripe.checkout.sessions.retrieve(sessionOf(started.body.url))).status).toBe('expired');
    expect((await treasurer.post(`${url}/invoices/${id}/void`).send({})).status).toBe(409);
    const paid = await treasurer.post(`${url}/invoices/${invoiceId}/void`).send({});
    expect(paid.status).toBe(409);
    expect(paid.body.message).toMatch(/Only open invoices can be voided; this one is refunded in full/);
    expect((await treasurer.post(`${url}/invoices/999999/void`).send({})).status).toBe(404);
  });

  it('keeps the invoice open when its session expires, and the next click makes a new session', async () => {
    const payer = treasurer;
    const first = await payer.post(`${url}/checkout`).send({ planId: plans.Regular });
    expect(first.status).toBe(201);
    const id = first.body.invoiceId as number;
    await h.stripe.checkout.sessions.expire(sessionOf(first.body.url));
    await eventually(async () => ((await invoiceRow(id)).checkoutSessionId === null ? true : undefined), 20_000, 'the expired session forgotten');
    expect((await invoiceRow(id)).status).toBe('open');
    const second = await payer.post(`${url}/checkout`).send({ planId: plans.Regular });
    expect(second.status).toBe(201);
    expect(second.body.invoiceId).toBe(id);
    expect(second.body.url).not.toBe(first.body.url);
    expect(await invoiceRow(id)).toMatchObject({ checkoutAttempts: 2, checkoutSessionId: sessionOf(second.body.url) });
    expect((await treasurer.post(`${url}/invoices/${id}/void`).send({})).status).toBe(200);
  });

  it('never changes an invoice when a plan amount changes', async () => {
    const changed = await treasurer.patch(`${url}/plans/${plans.Regular}`).send({ yearlyCents: 3500 });
    expect(changed.status).toBe(200);
    expect(changed.body.yearlyCents).toBe(3500);
    const inv = await treasurer.get(`${url}/invoices/${invoiceId}`);
    expect(inv.body).toMatchObject({ totalCents: 3000, lines: [expect.objectContaining({ amountCents: 3000 })] });
    expect((await treasurer.patch(`${url}/plans/999999`).send({ yearlyCents: 1 })).status).toBe(404);
    const bad = await treasurer.patch(`${url}/plans/${plans.Regular}`).send({ yearlyCents: 12.5, name: '', minAge: -1 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.errors).sort()).toEqual(['minAge', 'name', 'yearlyCents']);
  });

  it('keeps an append-only audit log of every money event, newest first', async () => {
    const audit = await treasurer.get(`${url}/audit`);
    expect(audit.status).toBe(200);
    const actions = audit.body.map((a: { action: string }) => a.action);
    for (const a of ['settings_changed', 'plan_created', 'payment', 'refund', 'void', 'plan_changed']) expect(actions).toContain(a);
    expect(audit.body[0].action).toBe('plan_changed');
    expect(audit.body[0].summary).toMatch(/\$30\.00 → \$35\.00/);
    const times = audit.body.map((a: { at: string }) => a.at);
    expect([...times].sort().reverse()).toEqual(times);
    expect(audit.body.find((a: { action: string }) => a.action === 'payment')).toMatchObject({ actor: 'Payment service' });
    expect((await member.get(`${url}/audit`)).status).toBe(403);
    await expect(db().execute('UPDATE dues_audit_log SET summary = ? WHERE guild_id = ?', ['rewritten', s.guild.id])).rejects.toThrow(/append-only/);
    await expect(db().execute('DELETE FROM dues_audit_log WHERE guild_id = ?', [s.guild.id])).rejects.toThrow(/append-only/);
  });
});
