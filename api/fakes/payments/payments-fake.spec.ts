import { promises as fs } from 'node:fs';
import * as http from 'node:http';
import type { AddressInfo } from 'node:net';
import * as os from 'node:os';
import * as path from 'node:path';
import Stripe from 'stripe';
import { startPaymentsFake, type PaymentsFakeHandle, type PaymentsFakeOptions } from './payments-fake';
import type { DeliveryAttempt, PendingDelivery } from './store';

const SECRET_KEY = 'sk_test_selvage_local_0001';
const WEBHOOK_SECRET = 'whsec_selvage_local_test';
const APP = 'http://app.selvage.example';

/** A tiny webhook endpoint that keeps what it gets and can be told to fail. */
class Receiver {
  readonly received: { body: string; signature: string; status: number }[] = [];
  /** Status codes to answer with, in order, to deliveries whose body contains `planFor`; then 200 again. */
  plan: number[] = [];
  planFor = '';
  private server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      const body = Buffer.concat(chunks).toString('utf8');
      const status = (body.includes(this.planFor) && this.plan.shift()) || 200;
      this.received.push({ body, signature: String(req.headers['stripe-signature']), status });
      res.writeHead(status).end(status === 200 ? 'ok' : 'no');
    });
  });
  port = 0;

  async start(): Promise<void> {
    await new Promise<void>((resolve) => this.server.listen(0, '127.0.0.1', () => resolve()));
    this.port = (this.server.address() as AddressInfo).port;
  }

  get url(): string {
    return `http://127.0.0.1:${this.port}/webhooks/payments`;
  }

  /** Verified events the endpoint accepted (answered 200), in arrival order. */
  events(): Stripe.Event[] {
    return this.received.filter((r) => r.status === 200).map((r) => Stripe.webhooks.constructEvent(r.body, r.signature, WEBHOOK_SECRET));
  }

  of<T extends Stripe.Event['type']>(type: T): Extract<Stripe.Event, { type: T }>[] {
    return this.events().filter((e): e is Extract<Stripe.Event, { type: T }> => e.type === type);
  }

  close(): Promise<void> {
    return new Promise((resolve) => {
      this.server.close(() => resolve());
      this.server.closeAllConnections();
    });
  }
}

async function waitFor<T>(check: () => T | undefined | false | Promise<T | undefined | false>, what: string, timeoutMs = 5000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value) return value;
    if (Date.now() > until) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

function client(fake: PaymentsFakeHandle, key = SECRET_KEY): Stripe {
  return new Stripe(key, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
}

function sessionParams(extra: Partial<Stripe.Checkout.SessionCreateParams> = {}): Stripe.Checkout.SessionCreateParams {
  return {
    mode: 'payment',
    line_items: [
      { quantity: 1, price_data: { currency: 'usd', unit_amount: 2500, product_data: { name: 'Annual dues 2027' } } },
    ],
    success_url: `${APP}/dues/paid?session_id={CHECKOUT_SESSION_ID}`,
    cancel_url: `${APP}/dues`,
    customer_email: 'june@wrenfield.example',
    client_reference_id: 'membership-7',
    metadata: { invoiceId: '12', guildId: '1' },
    payment_intent_data: { metadata: { invoiceId: '12' } },
    ...extra,
  };
}

async function payByForm(session: Stripe.Checkout.Session, card: string, email?: string): Promise<Response> {
  const body = new URLSearchParams({ card, ...(email ? { email } : {}) });
  return fetch(session.url!, {
    method: 'POST',
    body: body.toString(),
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    redirect: 'manual',
  });
}

async function payByHelper(fake: PaymentsFakeHandle, sessionId: string, card: string): Promise<{ status: number; body: any }> {
  const res = await fetch(`${fake.url}/_fake/checkout/${sessionId}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ card }),
  });
  return { status: res.status, body: await res.json() };
}

async function deliveries(fake: PaymentsFakeHandle): Promise<{ pending: PendingDelivery[]; attempts: DeliveryAttempt[] }> {
  return (await fetch(`${fake.url}/_fake/deliveries`)).json() as Promise<{ pending: PendingDelivery[]; attempts: DeliveryAttempt[] }>;
}

function expectStripeError(err: unknown, fields: Record<string, unknown>): void {
  expect(err).toBeInstanceOf(Stripe.errors.StripeError);
  expect(err).toMatchObject(fields);
}

async function caught(promise: Promise<unknown>): Promise<unknown> {
  try {
    await promise;
  } catch (err) {
    return err;
  }
  throw new Error('expected the call to fail');
}

describe('payments fake', () => {
  let dir: string;
  let receiver: Receiver;
  let fake: PaymentsFakeHandle;
  let stripe: Stripe;
  const options = (): PaymentsFakeOptions => ({
    port: 0,
    dataDir: path.join(dir, 'payments'),
    webhookUrl: receiver.url,
    webhookSecret: WEBHOOK_SECRET,
    webhookRetryBaseMs: 40,
    webhookRetryMaxMs: 200,
    webhookMaxAttempts: 6,
  });

  let paid: Stripe.Checkout.Session;

  beforeAll(async () => {
    dir = await fs.mkdtemp(path.join(os.tmpdir(), 'selvage-payments-fake-'));
    receiver = new Receiver();
    await receiver.start();
    fake = await startPaymentsFake(options());
    stripe = client(fake);
  });

  afterAll(async () => {
    await fake?.close();
    await receiver?.close();
    await fs.rm(dir, { recursive: true, force: true });
  });

  it('answers /_fake/health and refuses API calls without a test secret key', async () => {
    const health = await fetch(`${fake.url}/_fake/health`);
    expect(health.status).toBe(200);
    expect(await health.json()).toEqual({ status: 'ok' });

    const bare = await fetch(`${fake.url}/v1/checkout/sessions`, { method: 'POST' });
    expect(bare.status).toBe(401);
    const body = (await bare.json()) as { error: { type: string; message: string } };
    expect(body.error.type).toBe('invalid_request_error');
    expect(body.error.message).toMatch(/did not provide an API key/);

    const live = await caught(client(fake, 'sk_live_not_here_1234').checkout.sessions.create(sessionParams()));
    expectStripeError(live, { type: 'StripeAuthenticationError', statusCode: 401 });
    expect((live as Error).message).not.toContain('not_here');
  });

  it('creates a Checkout Session in the SDK shape', async () => {
    const before = Math.floor(Date.now() / 1000);
    const session = await stripe.checkout.sessions.create(
      sessionParams({
        line_items: [
          { quantity: 1, price_data: { currency: 'usd', unit_amount: 2500, product_data: { name: 'Annual dues 2027' } } },
          { quantity: 2, price_data: { currency: 'usd', unit_amount: 1000, product_data: { name: 'Raffle ticket' } } },
        ],
      }),
    );
    expect(session.id).toMatch(/^cs_test_[A-Za-z0-9]{20,}$/);
    expect(session).toMatchObject({
      object: 'checkout.session',
      livemode: false,
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_subtotal: 4500,
      amount_total: 4500,
      currency: 'usd',
      customer_email: 'june@wrenfield.example',
      client_reference_id: 'membership-7',
      metadata: { invoiceId: '12', guildId: '1' },
      payment_intent: null,
      success_url: `${APP}/dues/paid?session_id={CHECKOUT_SESSION_ID}`,
      cancel_url: `${APP}/dues`,
    });
    expect(session.url).toBe(`${fake.url}/pay/${session.id}`);
    expect(session.created).toBeGreaterThanOrEqual(before);
    expect(session.expires_at).toBe(session.created + 24 * 60 * 60);
    expect(session.lastResponse.headers['request-id']).toMatch(/^req_/);

    const items = await stripe.checkout.sessions.listLineItems(session.id);
    expect(items.data.map((i) => [i.description, i.quantity, i.amount_total, i.price?.unit_amount])).toEqual([
      ['Annual dues 2027', 1, 2500, 2500],
      ['Raffle ticket', 2, 2000, 1000],
    ]);

    const page = await fetch(session.url!);
    expect(page.status).toBe(200);
    expect(page.headers.get('content-type')).toMatch(/^text\/html/);
    const html = await page.text();
    expect(html).toContain('<meta name="viewport" content="width=device-width, initial-scale=1">');
    expect(html).toContain('Annual dues 2027');
    expect(html).toContain('Raffle ticket');
    expect(html).toContain('$45.00');
    expect(html).toContain('<label for="card">Card number</label>');
    expect(html).toMatch(/<input id="card" name="card"/);
    expect(html).toContain('Pay $45.00');
    expect(html).toContain(`<a class="back" href="${APP}/dues">Cancel and go back</a>`);
  });

  it('refuses bad parameters with code and param', async () => {
    const noMode = await caught(stripe.checkout.sessions.create({ ...sessionParams(), mode: undefined }));
    expectStripeError(noMode, { statusCode: 400, code: 'parameter_missing', param: 'mode' });

    const raw = await fetch(`${fake.url}/v1/checkout/sessions`, {
      method: 'POST',
      headers: { authorization: `Bearer ${SECRET_KEY}`, 'content-type': 'application/x-www-form-urlencoded' },
      body:
        'mode=payment&line_items[0][quantity]=1&line_items[0][price_data][currency]=usd' +
        '&line_items[0][price_data][unit_amount]=25.00&line_items[0][price_data][product_data][name]=Dues',
    });
    expect(raw.status).toBe(400);
    expect(((await raw.json()) as { error: unknown }).error).toMatchObject({
      type: 'invalid_request_error',
      code: 'parameter_invalid_integer',
      param: 'line_items[0][price_data][unit_amount]',
    });

    const unknown = await caught(
      stripe.checkout.sessions.create({ ...sessionParams(), shipping_address_collection: { allowed_countries: ['US'] } }),
    );
    expectStripeError(unknown, { statusCode: 400, code: 'parameter_unknown', param: 'shipping_address_collection' });

    const noName = await caught(
      stripe.checkout.sessions.create(
        sessionParams({ line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 100, product_data: { description: 'no name' } as never } }] }),
      ),
    );
    expectStripeError(noName, { code: 'parameter_missing', param: 'line_items[0][price_data][product_data][name]' });

    const tooSmall = await caught(
      stripe.checkout.sessions.create(
        sessionParams({ line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 49, product_data: { name: 'Pin' } } }] }),
      ),
    );
    expectStripeError(tooSmall, { code: 'amount_too_small' });

    const badUrl = await caught(stripe.checkout.sessions.create(sessionParams({ success_url: 'not a url' })));
    expectStripeError(badUrl, { code: 'url_invalid', param: 'success_url' });

    const badExpand = await caught(stripe.checkout.sessions.create({ ...sessionParams(), expand: ['customer'] }));
    expectStripeError(badExpand, { statusCode: 400, param: 'expand' });
  });

  it('declines the two decline cards, keeps the session open and sends payment_failed', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());

    const declined = await payByForm(session, '4000 0000 0000 0002');
    expect(declined.status).toBe(402);
    const html = await declined.text();
    expect(html).toContain('role="alert"');
    expect(html).toContain('Your card was declined.');
    expect(html).toContain('aria-invalid="true"');

    const unknownCard = await payByForm(session, '4111 1111 1111 1111');
    expect(unknownCard.status).toBe(400);
    expect(await unknownCard.text()).toContain('not a test card');

    const poor = await payByHelper(fake, session.id, '4000-0000-0000-9995');
    expect(poor.status).toBe(402);
    expect(poor.body).toMatchObject({ outcome: 'declined', decline_code: 'insufficient_funds', message: 'Your card has insufficient funds.' });

    const after = await stripe.checkout.sessions.retrieve(session.id, { expand: ['payment_intent.latest_charge'] });
    expect(after.status).toBe('open');
    expect(after.payment_status).toBe('unpaid');
    const pi = after.payment_intent as Stripe.PaymentIntent;
    expect(pi.id).toMatch(/^pi_/);
    expect(pi.status).toBe('requires_payment_method');
    expect(pi.last_payment_error).toMatchObject({ type: 'card_error', code: 'card_declined', decline_code: 'insufficient_funds' });
    const charge = pi.latest_charge as Stripe.Charge;
    expect(charge).toMatchObject({ object: 'charge', status: 'failed', paid: false, failure_code: 'card_declined', balance_transaction: null });
    expect(charge.outcome?.reason).toBe('insufficient_funds');

    const failed = await waitFor(() => {
      const events = receiver.of('payment_intent.payment_failed').filter((e) => e.data.object.id === pi.id);
      return events.length === 2 && events;
    }, 'two payment_failed events');
    expect(failed.map((e) => e.data.object.last_payment_error?.decline_code)).toEqual(['generic_decline', 'insufficient_funds']);
    expect(failed[0].data.object.metadata).toEqual({ invoiceId: '12' });
  });

  it('pays with the good card: 303 to success_url, complete session, charge, fee and net', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const res = await payByForm(session, ' 4242 4242 4242 4242 ');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`${APP}/dues/paid?session_id=${session.id}`);

    paid = await stripe.checkout.sessions.retrieve(session.id, { expand: ['payment_intent.latest_charge.balance_transaction'] });
    expect(paid).toMatchObject({ status: 'complete', payment_status: 'paid', url: null, amount_total: 2500 });
    expect(paid.customer_details?.email).toBe('june@wrenfield.example');
    const pi = paid.payment_intent as Stripe.PaymentIntent;
    expect(pi).toMatchObject({
      object: 'payment_intent',
      status: 'succeeded',
      amount: 2500,
      amount_received: 2500,
      currency: 'usd',
      metadata: { invoiceId: '12' },
      last_payment_error: null,
      livemode: false,
    });
    const charge = pi.latest_charge as Stripe.Charge;
    expect(charge.id).toMatch(/^ch_/);
    expect(charge).toMatchObject({
      object: 'charge',
      status: 'succeeded',
      paid: true,
      captured: true,
      amount: 2500,
      amount_refunded: 0,
      refunded: false,
      payment_intent: pi.id,
      metadata: { invoiceId: '12' },
    });
    expect(charge.payment_method_details?.card?.last4).toBe('4242');
    const txn = charge.balance_transaction as Stripe.BalanceTransaction;
    expect(txn.id).toMatch(/^txn_/);
    // 2.9 % of 2500 is 72.5, rounded half-up to 73, plus 30.
    expect(txn).toMatchObject({ object: 'balance_transaction', amount: 2500, fee: 103, net: 2397, currency: 'usd', type: 'charge', source: charge.id });

    const viaIntent = await stripe.paymentIntents.retrieve(pi.id, { expand: ['latest_charge.balance_transaction'] });
    expect(((viaIntent.latest_charge as Stripe.Charge).balance_transaction as Stripe.BalanceTransaction).net).toBe(2397);
    const plain = await stripe.paymentIntents.retrieve(pi.id);
    expect(plain.latest_charge).toBe(charge.id);

    const completed = await waitFor(
      () => receiver.of('checkout.session.completed').find((e) => e.data.object.id === session.id),
      'checkout.session.completed',
    );
    expect(completed).toMatchObject({
      object: 'event',
      livemode: false,
      api_version: Stripe.API_VERSION,
      data: { object: { payment_status: 'paid', payment_intent: pi.id, metadata: { invoiceId: '12', guildId: '1' }, client_reference_id: 'membership-7' } },
    });
    expect(completed.id).toMatch(/^evt_/);
    expect(completed.request).toEqual({ id: null, idempotency_key: null });
    await waitFor(() => receiver.of('payment_intent.succeeded').find((e) => e.data.object.id === pi.id), 'payment_intent.succeeded');
    await waitFor(() => receiver.of('charge.succeeded').find((e) => e.data.object.id === charge.id), 'charge.succeeded');

    const again = await payByForm(session, '4242424242424242');
    expect(again.status).toBe(409);
    expect(await again.text()).toContain('already been made');
    const againJson = await payByHelper(fake, session.id, '4242424242424242');
    expect(againJson).toMatchObject({ status: 409, body: { outcome: 'not_open', session_status: 'complete' } });
    const page = await fetch(`${fake.url}/pay/${session.id}`);
    expect(await page.text()).toContain('already been made');
  });

  it('pays through the /_fake helper with the same logic', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams({ customer_email: undefined }));
    const result = await payByHelper(fake, session.id, '4242424242424242');
    expect(result.status).toBe(200);
    expect(result.body).toMatchObject({
      outcome: 'succeeded',
      redirect_url: `${APP}/dues/paid?session_id=${session.id}`,
      session: { status: 'complete', payment_status: 'paid' },
      payment_intent: { status: 'succeeded' },
      charge: { paid: true },
    });
    const missing = await payByHelper(fake, 'cs_test_nothing_here', '4242424242424242');
    expect(missing.status).toBe(404);
  });

  it('signs every delivery so constructEvent accepts it, and rejects a tampered body', async () => {
    const delivery = receiver.received.find((r) => r.status === 200)!;
    expect(delivery.signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    const event = Stripe.webhooks.constructEvent(delivery.body, delivery.signature, WEBHOOK_SECRET);
    expect(event.id).toMatch(/^evt_/);

    const tampered = delivery.body.replace('"livemode": false', '"livemode": true');
    expect(tampered).not.toBe(delivery.body);
    expect(() => Stripe.webhooks.constructEvent(tampered, delivery.signature, WEBHOOK_SECRET)).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
    expect(() => Stripe.webhooks.constructEvent(delivery.body, delivery.signature, 'whsec_someone_else')).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
  });

  it('retries a delivery with backoff after the endpoint answers 500 twice', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    receiver.planFor = session.id;
    receiver.plan = [500, 500];
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired).toMatchObject({ status: 'expired', url: null });

    const hits = await waitFor(() => {
      const forSession = receiver.received.filter((r) => r.body.includes(session.id));
      return forSession.length >= 3 && forSession;
    }, 'three delivery attempts');
    expect(hits.map((h) => h.status)).toEqual([500, 500, 200]);
    const ids = hits.map((h) => (JSON.parse(h.body) as Stripe.Event).id);
    expect(new Set(ids).size).toBe(1);
    const event = Stripe.webhooks.constructEvent(hits[2].body, hits[2].signature, WEBHOOK_SECRET);
    expect(event.type).toBe('checkout.session.expired');

    const log = await deliveries(fake);
    const attempts = log.attempts.filter((a) => a.eventId === ids[0]).reverse();
    expect(attempts.map((a) => [a.attempt, a.status, a.outcome])).toEqual([
      [1, 500, 'will_retry'],
      [2, 500, 'will_retry'],
      [3, 200, 'delivered'],
    ]);
    // The second retry waited about twice as long as the first (40 ms, then 80 ms).
    const gaps = [1, 2].map((i) => Date.parse(attempts[i].at) - Date.parse(attempts[i - 1].at));
    expect(gaps[0]).toBeGreaterThanOrEqual(35);
    expect(gaps[1]).toBeGreaterThanOrEqual(75);
    expect(log.pending.find((p) => p.eventId === ids[0])).toBeUndefined();

    const stored = await stripe.events.retrieve(ids[0]);
    expect(stored.pending_webhooks).toBe(0);
  });

  it('expires only open sessions and shows an expired page', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired.status).toBe('expired');
    const again = await caught(stripe.checkout.sessions.expire(session.id));
    expectStripeError(again, { statusCode: 400, type: 'StripeInvalidRequestError' });
    expect((again as Error).message).toMatch(/Only an open Checkout Session can be expired.*expired/);
    const completeToo = await caught(stripe.checkout.sessions.expire(paid.id));
    expect((completeToo as Error).message).toMatch(/is complete/);

    const page = await fetch(session.url!);
    expect(page.status).toBe(410);
    expect(await page.text()).toContain('has expired');
    const pay = await payByForm(session, '4242424242424242');
    expect(pay.status).toBe(409);
    expect(await pay.text()).toContain('has expired');
    await waitFor(() => receiver.of('checkout.session.expired').find((e) => e.data.object.id === session.id), 'expired event');
  });

  it('refunds in part, then in full, and refuses more', async () => {
    const pi = paid.payment_intent as Stripe.PaymentIntent;
    const charge = pi.latest_charge as Stripe.Charge;

    const partial = await stripe.refunds.create({
      payment_intent: pi.id,
      amount: 1000,
      reason: 'requested_by_customer',
      metadata: { note: 'Left the guild' },
    }, { idempotencyKey: 'refund-partial-1' });
    expect(partial.id).toMatch(/^re_/);
    expect(partial).toMatchObject({
      object: 'refund',
      amount: 1000,
      status: 'succeeded',
      charge: charge.id,
      payment_intent: pi.id,
      reason: 'requested_by_customer',
      metadata: { note: 'Left the guild' },
      currency: 'usd',
    });
    const refundTxn = await stripe.balanceTransactions.retrieve(partial.balance_transaction as string);
    expect(refundTxn).toMatchObject({ amount: -1000, fee: 0, net: -1000, type: 'refund', source: partial.id });
    expect(await stripe.charges.retrieve(charge.id)).toMatchObject({ amount_refunded: 1000, refunded: false });

    const over = await caught(stripe.refunds.create({ payment_intent: pi.id, amount: 2000 }));
    expectStripeError(over, { statusCode: 400, param: 'amount', code: 'amount_too_large' });
    expect((over as Error).message).toContain('$15.00');

    const rest = await stripe.refunds.create({ charge: charge.id }, { idempotencyKey: 'refund-rest-1' });
    expect(rest.amount).toBe(1500);
    expect(await stripe.charges.retrieve(charge.id)).toMatchObject({ amount_refunded: 2500, refunded: true });

    const more = await caught(stripe.refunds.create({ payment_intent: pi.id, amount: 1 }));
    expectStripeError(more, { statusCode: 400, code: 'charge_already_refunded' });

    expect((await stripe.refunds.retrieve(partial.id)).amount).toBe(1000);
    const listed = await stripe.refunds.list({ payment_intent: pi.id });
    expect(listed.data.map((r) => r.id)).toEqual([rest.id, partial.id]);

    const refunded = await waitFor(() => {
      const events = receiver.of('charge.refunded').filter((e) => e.data.object.id === charge.id);
      return events.length === 2 && events;
    }, 'two charge.refunded events');
    expect(refunded.map((e) => [e.data.object.amount_refunded, e.data.object.refunded])).toEqual([
      [1000, false],
      [2500, true],
    ]);
    expect(refunded[0].request).toMatchObject({ idempotency_key: 'refund-partial-1' });
    await waitFor(() => receiver.of('refund.created').find((e) => e.data.object.id === rest.id), 'refund.created');
  });

  it('replays an idempotent request and refuses the key with other parameters', async () => {
    const first = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'dues-invoice-12' });
    const second = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'dues-invoice-12' });
    expect(second.id).toBe(first.id);
    expect(second.url).toBe(first.url);
    expect(second.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(first.lastResponse.headers['idempotent-replayed']).toBeUndefined();

    const changed = await caught(
      stripe.checkout.sessions.create(sessionParams({ metadata: { invoiceId: '13' } }), { idempotencyKey: 'dues-invoice-12' }),
    );
    expectStripeError(changed, { type: 'StripeIdempotencyError', statusCode: 400, rawType: 'idempotency_error' });

    // A replayed refund creates no second refund.
    const pi = (paid.payment_intent as Stripe.PaymentIntent).id;
    const refunds = await stripe.refunds.list({ payment_intent: pi });
    const replay = await stripe.refunds.create(
      { payment_intent: pi, amount: 1000, reason: 'requested_by_customer', metadata: { note: 'Left the guild' } },
      { idempotencyKey: 'refund-partial-1' },
    );
    expect(replay.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect((await stripe.refunds.list({ payment_intent: pi })).data).toHaveLength(refunds.data.length);
  });

  it('answers unknown ids with 404 resource_missing and unknown routes with 404', async () => {
    expectStripeError(await caught(stripe.checkout.sessions.retrieve('cs_test_nope')), {
      statusCode: 404,
      code: 'resource_missing',
      param: 'session',
    });
    expectStripeError(await caught(stripe.paymentIntents.retrieve('pi_nope')), { statusCode: 404, code: 'resource_missing', param: 'intent' });
    expectStripeError(await caught(stripe.refunds.retrieve('re_nope')), { statusCode: 404, code: 'resource_missing' });
    expectStripeError(await caught(stripe.events.retrieve('evt_nope')), { statusCode: 404, code: 'resource_missing' });
    expectStripeError(await caught(stripe.refunds.create({ payment_intent: 'pi_nope' })), {
      statusCode: 404,
      code: 'resource_missing',
      param: 'payment_intent',
    });

    const route = await fetch(`${fake.url}/v1/customers`, { headers: { authorization: `Bearer ${SECRET_KEY}` } });
    expect(route.status).toBe(404);
    expect(((await route.json()) as { error: { message: string } }).error.message).toMatch(/Unrecognized request URL/);
    expect((await fetch(`${fake.url}/pay/cs_test_nope`)).status).toBe(404);
  });

  it('lists events newest first and fetches one', async () => {
    const page = await stripe.events.list({ limit: 3 });
    expect(page.object).toBe('list');
    expect(page.data).toHaveLength(3);
    expect(page.has_more).toBe(true);
    const created = page.data.map((e) => e.created);
    expect([...created].sort((a, b) => b - a)).toEqual(created);
    const next = await stripe.events.list({ limit: 3, starting_after: page.data[2].id });
    expect(next.data[0].id).not.toBe(page.data[2].id);
    const one = await stripe.events.retrieve(page.data[0].id);
    expect(one).toMatchObject({ id: page.data[0].id, object: 'event', type: page.data[0].type });
    const refundsOnly = await stripe.events.list({ type: 'refund.created' });
    expect(refundsOnly.data.length).toBe(2);
    expect(refundsOnly.data.every((e) => e.type === 'refund.created')).toBe(true);
  });

  it('keeps state and pending deliveries across a restart', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    receiver.planFor = session.id;
    receiver.plan = Array(50).fill(503);
    await stripe.checkout.sessions.expire(session.id);
    await waitFor(() => receiver.received.some((r) => r.body.includes(session.id) && r.status === 503), 'a failed attempt');
    await fake.close();

    const file = JSON.parse(await fs.readFile(path.join(dir, 'payments', 'state.json'), 'utf8')) as { deliveries: PendingDelivery[] };
    expect(file.deliveries.length).toBeGreaterThan(0);

    receiver.plan = [];
    fake = await startPaymentsFake(options());
    stripe = client(fake);

    const back = await stripe.checkout.sessions.retrieve(paid.id, { expand: ['payment_intent'] });
    expect(back).toMatchObject({ status: 'complete', payment_status: 'paid' });
    expect((back.payment_intent as Stripe.PaymentIntent).status).toBe('succeeded');
    const replay = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'dues-invoice-12' });
    expect(replay.lastResponse.headers['idempotent-replayed']).toBe('true');

    await waitFor(() => receiver.of('checkout.session.expired').find((e) => e.data.object.id === session.id), 'delivery after restart');
    const flushed = (await (await fetch(`${fake.url}/_fake/deliveries/flush`, { method: 'POST' })).json()) as { pending: number };
    expect(flushed.pending).toBe(0);
    expect((await deliveries(fake)).pending).toEqual([]);
  });

  it('flush retries pending deliveries at once', async () => {
    await fake.close();
    fake = await startPaymentsFake({ ...options(), webhookRetryBaseMs: 60_000, webhookRetryMaxMs: 60_000 });
    stripe = client(fake);
    const session = await stripe.checkout.sessions.create(sessionParams());
    receiver.planFor = session.id;
    receiver.plan = [500];
    await stripe.checkout.sessions.expire(session.id);
    const failed = await waitFor(async () => {
      const log = await deliveries(fake);
      return log.attempts.find((a) => a.status === 500 && a.outcome === 'will_retry' && log.pending.some((p) => p.eventId === a.eventId));
    }, 'the failed attempt to be logged');
    expect(failed.eventType).toBe('checkout.session.expired');
    const res = await fetch(`${fake.url}/_fake/deliveries/flush`, { method: 'POST' });
    const flushed = (await res.json()) as { attempted: number; delivered: number; pending: number };
    expect(flushed).toEqual({ attempted: 1, delivered: 1, pending: 0 });
    expect(receiver.of('checkout.session.expired').some((e) => e.data.object.id === session.id)).toBe(true);
  });

  it('expires a session on its own once expires_at has passed', async () => {
    let clock = Date.now();
    const timed = await startPaymentsFake({
      port: 0,
      dataDir: path.join(dir, 'timed'),
      expirySweepMs: 20,
      now: () => clock,
    });
    try {
      const timedStripe = client(timed);
      const session = await timedStripe.checkout.sessions.create(
        sessionParams({ expires_at: Math.floor(clock / 1000) + 60 * 60 }),
      );
      expect(session.expires_at).toBe(Math.floor(clock / 1000) + 3600);
      clock += 3601 * 1000;
      const list = await waitFor(async () => {
        const l = await timedStripe.events.list({ type: 'checkout.session.expired' });
        return l.data.length > 0 && l;
      }, 'checkout.session.expired');
      expect(list.data[0].data.object).toMatchObject({ id: session.id, status: 'expired' });
      expect(list.data[0].pending_webhooks).toBe(0);
      expect((await timedStripe.checkout.sessions.retrieve(session.id)).status).toBe('expired');
    } finally {
      await timed.close();
    }
  });
});
