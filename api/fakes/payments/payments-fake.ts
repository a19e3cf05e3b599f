/**
 * A local stand-in for the hosted card-payment service.
 *
 * It speaks the service's REST API for the small subset Selvage uses, in the same shapes, so the
 * official `stripe` SDK works against it unchanged (point the client at this host and port):
 *
 *   POST /v1/checkout/sessions               create a Checkout Session (mode=payment, price_data line items)
 *   GET  /v1/checkout/sessions/:id           with expand[]=payment_intent, line_items, payment_intent.latest_charge…
 *   GET  /v1/checkout/sessions/:id/line_items
 *   POST /v1/checkout/sessions/:id/expire
 *   GET  /v1/payment_intents/:id             expand[]=latest_charge, latest_charge.balance_transaction
 *   GET  /v1/charges/:id
 *   GET  /v1/balance_transactions/:id
 *   POST /v1/refunds                         full or partial, by payment_intent or charge
 *   GET  /v1/refunds/:id, GET /v1/refunds    (list: ?payment_intent= or ?charge=)
 *   GET  /v1/events/:id, GET /v1/events      (list: newest first, limit, starting_after, ending_before, type)
 *
 * People pay on a plain hosted page, GET/POST /pay/:sessionId, with the test cards in objects.ts.
 * Events go to one webhook endpoint, signed like the real service's (see webhooks.ts), retried
 * with backoff. Everything is kept in one JSON file in `dataDir`, so it survives restarts.
 *
 * Fake-only helpers for tests and people (not part of the real API):
 *
 *   GET  /_fake/health                       200 { status: "ok" }
 *   POST /_fake/checkout/:sessionId/pay      JSON { card, email? }: pays like the page does, answers JSON
 *   GET  /_fake/deliveries                   pending deliveries and the attempt log (newest first)
 *   POST /_fake/deliveries/flush             retries every pending delivery now and reports
 */
import { createHash } from 'node:crypto';
import * as http from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { renderCheckoutPage, renderMessagePage } from './checkout-page';
import { FormParseError, parseForm, type FormObject, type FormValue } from './form-body';
import { formatAmount } from './money';
import {
  buildCharge,
  buildChargeTransaction,
  buildEvent,
  buildPaymentIntent,
  buildRefund,
  buildRefundTransaction,
  buildSession,
  findTestCard,
  ID_PREFIX,
  newId,
  type EventObject,
  type LineItemInput,
  type PaymentsEventType,
  type SessionRecord,
} from './objects';
import {
  ApiError,
  expandList,
  invalid,
  isObject,
  metadata,
  missing,
  noSuch,
  onlyKeys,
  optionalArray,
  optionalEmail,
  optionalInteger,
  optionalObject,
  optionalString,
  optionalUrl,
  requiredInteger,
  requiredString,
} from './params';
import { StateStore } from './store';
import { Deliverer } from './webhooks';

export interface PaymentsFakeOptions {
  /** Interface to bind to. Defaults to 127.0.0.1. */
  host?: string;
  /** HTTP port; 0 picks any free port. */
  port: number;
  /** Folder for the state file; created when missing, kept across restarts. */
  dataDir: string;
  /** Where events are POSTed. Without it events are only kept (GET /v1/events). */
  webhookUrl?: string | null;
  /** Signing secret for the webhook endpoint (`whsec_…`); required with webhookUrl. */
  webhookSecret?: string | null;
  /** Base URL people's browsers reach the fake at, for Checkout `url`s. Defaults to http://host:port. */
  publicUrl?: string | null;
  /** Shown as the payee on the hosted page. Defaults to "Selvage". */
  merchantName?: string;
  /** `api_version` on events and the default `Stripe-Version`. Defaults to the installed SDK's version. */
  apiVersion?: string;
  /** First retry delay for failed webhook deliveries; each later one doubles. Default 1000 ms. */
  webhookRetryBaseMs?: number;
  /** Longest delay between delivery attempts. Default 60 000 ms. */
  webhookRetryMaxMs?: number;
  /** Delivery attempts per event, the first included. Default 8. */
  webhookMaxAttempts?: number;
  /** How long one delivery attempt may take. Default 10 000 ms. */
  webhookTimeoutMs?: number;
  /** How often open sessions past `expires_at` are expired. Default 10 000 ms. */
  expirySweepMs?: number;
  /** Clock in epoch milliseconds, for tests. Defaults to Date.now. */
  now?: () => number;
}

export interface PaymentsFakeHandle {
  port: number;
  /** Base URL of the fake, e.g. "http://127.0.0.1:12111". */
  url: string;
  close(): Promise<void>;
}

export const DEFAULT_PORT = 12111;
const MAX_BODY_BYTES = 1024 * 1024;
const IDEMPOTENCY_TTL_MS = 24 * 60 * 60 * 1000;
const MIN_SESSION_SECONDS = 30 * 60;
const MAX_SESSION_SECONDS = 24 * 60 * 60;
/** Smallest total a session may ask for, in minor units (50 cents for USD). */
const MIN_AMOUNT = 50;
const MAX_AMOUNT = 99_999_999;
const MAX_LINE_ITEMS = 100;
const REFUND_REASONS = ['duplicate', 'fraudulent', 'requested_by_customer'] as const;

/** Parameters of the real session endpoint that the fake accepts and ignores, since they change nothing here. */
const IGNORED_SESSION_PARAMS = ['locale', 'submit_type', 'payment_method_types', 'billing_address_collection', 'customer_creation'];

/** Which fields of each object `expand` may follow. */
const EXPANDABLE: Record<string, readonly string[]> = {
  'checkout.session': ['payment_intent', 'line_items'],
  payment_intent: ['latest_charge'],
  charge: ['balance_transaction', 'payment_intent'],
  refund: ['balance_transaction', 'charge', 'payment_intent'],
  balance_transaction: ['source'],
};
const MAX_EXPAND_DEPTH = 4;

type Json = Record<string, unknown>;

interface ApiContext {
  params: FormObject;
  match: string[];
  requestId: string;
  idempotencyKey: string | null;
}

interface ApiResult {
  status?: number;
  body: unknown;
}

interface Route {
  method: 'GET' | 'POST';
  pattern: RegExp;
  handler(ctx: ApiContext): ApiResult;
}

export type PayOutcome =
  | { outcome: 'succeeded'; record: SessionRecord; paymentIntent: Stripe.PaymentIntent; charge: Stripe.Charge; redirectUrl: string | null }
  | {
      outcome: 'declined';
      record: SessionRecord;
      paymentIntent: Stripe.PaymentIntent;
      charge: Stripe.Charge;
      declineCode: string;
      message: string;
    }
  | { outcome: 'invalid_card' | 'invalid_email'; record: SessionRecord; message: string }
  | { outcome: 'not_open'; record: SessionRecord; message: string };

class BodyTooLarge extends Error {}

function readBody(req: http.IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > MAX_BODY_BYTES) {
        reject(new BodyTooLarge(`Request body over ${MAX_BODY_BYTES} bytes`));
        req.destroy();
        return;
      }
      chunks.push(chunk);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

function sendJson(res: http.ServerResponse, status: number, body: unknown, extra: http.OutgoingHttpHeaders = {}): void {
  sendRawJson(res, status, JSON.stringify(body, null, 2), extra);
}

function sendRawJson(res: http.ServerResponse, status: number, payload: string, extra: http.OutgoingHttpHeaders = {}): void {
  res.writeHead(status, {
    'content-type': 'application/json; charset=utf-8',
    'content-length': Buffer.byteLength(payload),
    'cache-control': 'no-cache, no-store',
    ...extra,
  });
  res.end(payload);
}

const HTML_HEADERS: http.OutgoingHttpHeaders = {
  'content-type': 'text/html; charset=utf-8',
  'cache-control': 'no-store',
  'x-content-type-options': 'nosniff',
  'referrer-policy': 'no-referrer',
  // No form-action: browsers apply it to the redirect after paying, which leaves for success_url.
  'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; base-uri 'none'; frame-ancestors 'none'",
};

function sendHtml(res: http.ServerResponse, status: number, html: string, extra: http.OutgoingHttpHeaders = {}): void {
  res.writeHead(status, { ...HTML_HEADERS, 'content-length': Buffer.byteLength(html), ...extra });
  res.end(html);
}

/** Parameters in a canonical form (keys sorted), so an idempotent retry can be compared exactly. */
function fingerprint(method: string, path: string, params: FormObject): string {
  const canonical = (value: FormValue): unknown => {
    if (typeof value === 'string') return value;
    if (Array.isArray(value)) return value.map(canonical);
    return Object.keys(value)
      .sort()
      .map((k) => [k, canonical(value[k])]);
  };
  return createHash('sha256')
    .update(JSON.stringify([method, path, canonical(params)]))
    .digest('hex');
}

function bearerKey(req: http.IncomingMessage): string | null {
  const header = req.headers.authorization;
  if (!header) return null;
  const bearer = /^Bearer\s+(\S+)\s*$/i.exec(header);
  if (bearer) return bearer[1];
  const basic = /^Basic\s+(\S+)\s*$/i.exec(header);
  if (basic) return Buffer.from(basic[1], 'base64').toString('utf8').split(':')[0] || null;
  return null;
}

function maskKey(key: string): string {
  return key.length > 12 ? `${key.slice(0, 8)}${'*'.repeat(4)}${key.slice(-4)}` : key.replace(/./g, '*');
}

function listen(server: http.Server, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (err: Error): void => reject(err);
    server.once('error', onError);
    server.listen(port, host, () => {
      server.off('error', onError);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

export async function startPaymentsFake(opts: PaymentsFakeOptions): Promise<PaymentsFakeHandle> {
  const host = opts.host ?? '127.0.0.1';
  const now = opts.now ?? Date.now;
  const nowSeconds = (): number => Math.floor(now() / 1000);
  const merchantName = opts.merchantName ?? 'Selvage';
  const defaultApiVersion = opts.apiVersion ?? Stripe.API_VERSION;
  const webhookUrl = opts.webhookUrl || null;
  const webhookSecret = opts.webhookSecret || null;
  if (webhookUrl) {
    const parsed = new URL(webhookUrl); // throws on a malformed URL
    if (parsed.protocol !== 'http:' && parsed.protocol !== 'https:') throw new Error(`webhookUrl must be http or https, got ${webhookUrl}`);
    if (!webhookSecret) throw new Error('webhookSecret is required when webhookUrl is set');
  }

  const store = new StateStore(opts.dataDir);
  await store.load();
  const state = store.state;

  const deliverer = webhookUrl
    ? new Deliverer({
        store,
        url: webhookUrl,
        secret: webhookSecret!,
        now,
        retryBaseMs: opts.webhookRetryBaseMs ?? 1000,
        retryMaxMs: opts.webhookRetryMaxMs ?? 60_000,
        maxAttempts: opts.webhookMaxAttempts ?? 8,
        timeoutMs: opts.webhookTimeoutMs ?? 10_000,
      })
    : null;

  let publicUrl = '';
  const inflightKeys = new Set<string>();

  // ---- state changes -------------------------------------------------------------------------

  /** Events with no API request behind them (a payment on the page, an expiry) carry a request of nulls. */
  const NO_REQUEST: Stripe.Event.Request = { id: null, idempotency_key: null };

  function emit<T extends PaymentsEventType>(type: T, object: EventObject<T>, request: Stripe.Event.Request = NO_REQUEST): void {
    const event = buildEvent({
      type,
      object,
      created: nowSeconds(),
      apiVersion: defaultApiVersion,
      pendingWebhooks: deliverer ? 1 : 0,
      request,
    });
    state.events.push(event);
    deliverer?.enqueue(event.id);
  }

  /** Saves the state and sends any new events. */
  async function commit(): Promise<void> {
    await store.save();
    deliverer?.kick();
  }

  function expireSession(record: SessionRecord, request: Stripe.Event.Request = NO_REQUEST): void {
    const session = record.session;
    session.status = 'expired';
    session.url = null;
    if (typeof session.payment_intent === 'string') {
      const pi = state.paymentIntents[session.payment_intent];
      if (pi && pi.status !== 'succeeded' && pi.status !== 'canceled') {
        pi.status = 'canceled';
        pi.canceled_at = nowSeconds();
        pi.cancellation_reason = 'abandoned';
        emit('payment_intent.canceled', pi, request);
      }
    }
    emit('checkout.session.expired', session, request);
  }

  /** Expires an open session whose time is up; true when it did. */
  function expireIfDue(record: SessionRecord): boolean {
    if (record.session.status !== 'open' || record.session.expires_at > nowSeconds()) return false;
    expireSession(record);
    return true;
  }

  function pruneIdempotency(): void {
    const cutoff = now() - IDEMPOTENCY_TTL_MS;
    for (const [key, rec] of Object.entries(state.idempotency)) {
      if (rec.createdAt < cutoff) delete state.idempotency[key];
    }
  }

  /** One payment attempt on a session, as the hosted page and /_fake make it. Changes state synchronously. */
  function pay(record: SessionRecord, cardText: string, emailText: string): PayOutcome {
    expireIfDue(record);
    const session = record.session;
    if (session.status === 'complete') {
      return { outcome: 'not_open', record, message: 'This payment has already been made. Nothing more to pay.' };
    }
    if (session.status !== 'open') {
      return { outcome: 'not_open', record, message: 'This checkout has expired, so it can no longer be paid. Go back and start again.' };
    }
    if (cardText.trim() === '') return { outcome: 'invalid_card', record, message: 'Enter a card number.' };
    const card = findTestCard(cardText);
    if (!card) {
      return {
        outcome: 'invalid_card',
        record,
        message: 'That card number is not a test card. Use one of the test cards listed, such as 4242 4242 4242 4242.',
      };
    }
    const typedEmail = emailText.trim();
    if (!session.customer_email && typedEmail !== '' && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(typedEmail)) {
      return { outcome: 'invalid_email', record, message: 'Enter a valid email address, or leave the email empty.' };
    }
    const email = session.customer_email ?? (typedEmail || null);
    const created = nowSeconds();

    let pi = typeof session.payment_intent === 'string' ? state.paymentIntents[session.payment_intent] : undefined;
    if (!pi) {
      pi = buildPaymentIntent(record, created, null);
      state.paymentIntents[pi.id] = pi;
      session.payment_intent = pi.id;
    }
    const paymentMethodId = newId(ID_PREFIX.paymentMethod);
    pi.payment_method = paymentMethodId;

    if (card.outcome.kind === 'approved') {
      const txnId = newId(ID_PREFIX.balanceTransaction);
      const charge = buildCharge({
        paymentIntent: pi,
        card,
        created,
        email,
        statementDescriptor: merchantName.toUpperCase().slice(0, 22),
        balanceTransactionId: txnId,
        paymentMethodId,
      });
      state.charges[charge.id] = charge;
      state.balanceTransactions[txnId] = buildChargeTransaction(txnId, charge);
      pi.status = 'succeeded';
      pi.amount_received = pi.amount;
      pi.latest_charge = charge.id;
      pi.last_payment_error = null;
      session.status = 'complete';
      session.payment_status = 'paid';
      session.url = null;
      session.customer_details = {
        address: null,
        business_name: null,
        email,
        individual_name: null,
        name: null,
        phone: null,
        tax_exempt: 'none',
        tax_ids: [],
      };
      emit('charge.succeeded', charge);
      emit('payment_intent.succeeded', pi);
      emit('checkout.session.completed', session);
      const redirectUrl = session.success_url ? session.success_url.split('{CHECKOUT_SESSION_ID}').join(session.id) : null;
      return { outcome: 'succeeded', record, paymentIntent: pi, charge, redirectUrl };
    }

    const { declineCode, message } = card.outcome;
    const charge = buildCharge({
      paymentIntent: pi,
      card,
      created,
      email,
      statementDescriptor: merchantName.toUpperCase().slice(0, 22),
      balanceTransactionId: null,
      paymentMethodId,
    });
    state.charges[charge.id] = charge;
    pi.status = 'requires_payment_method';
    pi.latest_charge = charge.id;
    pi.last_payment_error = {
      type: 'card_error',
      code: 'card_declined',
      decline_code: declineCode,
      message,
      charge: charge.id,
      payment_method_type: 'card',
    };
    emit('charge.failed', charge);
    emit('payment_intent.payment_failed', pi);
    return { outcome: 'declined', record, paymentIntent: pi, charge, declineCode, message };
  }

  // ---- lookups and expansion -----------------------------------------------------------------

  function sessionRecord(id: string, param = 'session'): SessionRecord {
    const record = Object.prototype.hasOwnProperty.call(state.sessions, id) ? state.sessions[id] : undefined;
    if (!record) throw noSuch('checkout.session', id, param);
    return record;
  }

  function get<T>(collection: Record<string, T>, kind: string, id: string, param: string): T {
    const found = Object.prototype.hasOwnProperty.call(collection, id) ? collection[id] : undefined;
    if (!found) throw noSuch(kind, id, param);
    return found;
  }

  /** The stored object with this id, found by its prefix. */
  function byId(id: string): Json | undefined {
    const own = <T>(c: Record<string, T>): T | undefined => (Object.prototype.hasOwnProperty.call(c, id) ? c[id] : undefined);
    if (id.startsWith(ID_PREFIX.paymentIntent)) return own(state.paymentIntents) as Json | undefined;
    if (id.startsWith(ID_PREFIX.charge)) return own(state.charges) as Json | undefined;
    if (id.startsWith(ID_PREFIX.refund)) return own(state.refunds) as Json | undefined;
    if (id.startsWith(ID_PREFIX.balanceTransaction)) return own(state.balanceTransactions) as Json | undefined;
    if (id.startsWith('cs_')) return own(state.sessions)?.session as Json | undefined;
    return undefined;
  }

  function lineItemsList(record: SessionRecord, params: FormObject = {}): Stripe.ApiList<Stripe.LineItem> {
    return pageOf(record.lineItems, params, `/v1/checkout/sessions/${record.session.id}/line_items`, false);
  }

  /** Follows one dotted path on a copy of `obj`, replacing ids with the objects they name. */
  function expandPath(obj: Json, path: string[], full: string): void {
    const [field, ...rest] = path;
    const kind = String(obj.object);
    if (!(EXPANDABLE[kind] ?? []).includes(field)) throw invalid('expand', `This property cannot be expanded (${full}).`);
    let value = obj[field];
    if (kind === 'checkout.session' && field === 'line_items') {
      if (rest.length > 0) throw invalid('expand', `This property cannot be expanded (${full}).`);
      obj.line_items = lineItemsList(sessionRecord(String(obj.id)));
      return;
    }
    if (typeof value === 'string') {
      const found = byId(value);
      if (!found) return; // an id the fake does not keep (e.g. pm_…) stays as it is
      value = structuredClone(found);
      obj[field] = value;
    }
    if (rest.length > 0 && value && typeof value === 'object') expandPath(value as Json, rest, full);
  }

  function expanded<T>(object: T, paths: string[]): T {
    if (paths.length === 0) return object;
    const copy = structuredClone(object) as Json;
    for (const full of paths) {
      const parts = full.split('.');
      if (parts.length > MAX_EXPAND_DEPTH) throw invalid('expand', `You cannot expand more than ${MAX_EXPAND_DEPTH} levels of a property (${full}).`);
      expandPath(copy, parts, full);
    }
    return copy as T;
  }

  /** A page of a list, newest first unless `newestFirst` is false; `data.` expansions apply to each item. */
  function pageOf<T extends { id: string }>(all: T[], params: FormObject, url: string, newestFirst = true): Stripe.ApiList<T> {
    const limit = optionalInteger(params.limit, 'limit') ?? 10;
    if (limit < 1 || limit > 100) throw invalid('limit', 'Invalid limit: must be between 1 and 100.', 'parameter_invalid_integer');
    const startingAfter = optionalString(params.starting_after, 'starting_after');
    const endingBefore = optionalString(params.ending_before, 'ending_before');
    if (startingAfter && endingBefore) {
      throw invalid('ending_before', 'You may only specify one of these parameters: starting_after, ending_before.', 'parameters_exclusive');
    }
    const ordered = newestFirst ? [...all].reverse() : all;
    let data: T[];
    let hasMore: boolean;
    if (startingAfter) {
      const at = ordered.findIndex((item) => item.id === startingAfter);
      if (at === -1) throw noSuch('object', startingAfter, 'starting_after');
      data = ordered.slice(at + 1, at + 1 + limit);
      hasMore = at + 1 + limit < ordered.length;
    } else if (endingBefore) {
      const at = ordered.findIndex((item) => item.id === endingBefore);
      if (at === -1) throw noSuch('object', endingBefore, 'ending_before');
      data = ordered.slice(Math.max(0, at - limit), at);
      hasMore = at - limit > 0;
    } else {
      data = ordered.slice(0, limit);
      hasMore = limit < ordered.length;
    }
    const itemPaths = expandList(params.expand)
      .filter((p) => p.startsWith('data.'))
      .map((p) => p.slice('data.'.length));
    return { object: 'list', data: data.map((item) => expanded(item, itemPaths)), has_more: hasMore, url };
  }

  function singleExpand(params: FormObject): string[] {
    return expandList(params.expand);
  }

  // ---- API routes ----------------------------------------------------------------------------

  function createSession(ctx: ApiContext): ApiResult {
    const p = ctx.params;
    onlyKeys(p, [
      'mode',
      'line_items',
      'success_url',
      'cancel_url',
      'customer_email',
      'client_reference_id',
      'metadata',
      'payment_intent_data',
      'expires_at',
      'expand',
      ...IGNORED_SESSION_PARAMS,
    ]);
    const mode = requiredString(p.mode, 'mode');
    if (mode === 'setup' || mode === 'subscription') {
      throw invalid('mode', `The local payments fake supports only mode=payment, not mode=${mode}.`, 'parameter_invalid');
    }
    if (mode !== 'payment') throw invalid('mode', `Invalid mode: must be one of payment, setup, or subscription.`, 'parameter_invalid');

    const rawItems = optionalArray(p.line_items, 'line_items');
    if (!rawItems || rawItems.length === 0) throw invalid('line_items', 'line_items is required in payment mode.', 'parameter_missing');
    if (rawItems.length > MAX_LINE_ITEMS) throw invalid('line_items', `At most ${MAX_LINE_ITEMS} line items are allowed.`, 'parameter_invalid');
    const items: LineItemInput[] = rawItems.map((raw, i) => {
      const at = `line_items[${i}]`;
      if (!isObject(raw)) throw invalid(at, `Invalid object: ${at} must be a hash.`, 'parameter_invalid_object');
      if (raw.price !== undefined) {
        throw invalid(`${at}[price]`, 'The local payments fake keeps no price catalogue: send price_data instead of price.', 'parameter_unknown');
      }
      onlyKeys(raw, ['price_data', 'quantity', 'metadata'], at);
      const priceData = optionalObject(raw.price_data, `${at}[price_data]`);
      if (!priceData) throw missing(`${at}[price_data]`);
      onlyKeys(priceData, ['currency', 'unit_amount', 'product_data'], `${at}[price_data]`);
      const currency = requiredString(priceData.currency, `${at}[price_data][currency]`).toLowerCase();
      if (!/^[a-z]{3}$/.test(currency)) {
        throw invalid(`${at}[price_data][currency]`, `Invalid currency: ${currency}. Use a three-letter ISO code such as usd.`, 'parameter_invalid');
      }
      const unitAmount = requiredInteger(priceData.unit_amount, `${at}[price_data][unit_amount]`);
      if (unitAmount < 0 || unitAmount > MAX_AMOUNT) {
        throw invalid(`${at}[price_data][unit_amount]`, `unit_amount must be between 0 and ${MAX_AMOUNT}.`, 'parameter_invalid_integer');
      }
      const productData = optionalObject(priceData.product_data, `${at}[price_data][product_data]`);
      if (!productData) throw missing(`${at}[price_data][product_data]`);
      onlyKeys(productData, ['name', 'description', 'metadata'], `${at}[price_data][product_data]`);
      const name = requiredString(productData.name, `${at}[price_data][product_data][name]`, 250);
      const quantity = requiredInteger(raw.quantity, `${at}[quantity]`);
      if (quantity < 1 || quantity > 999_999) {
        throw invalid(`${at}[quantity]`, 'quantity must be between 1 and 999999.', 'parameter_invalid_integer');
      }
      return {
        name,
        description: optionalString(productData.description, `${at}[price_data][product_data][description]`, 1000),
        productMetadata: metadata(productData.metadata, `${at}[price_data][product_data][metadata]`),
        currency,
        unitAmount,
        quantity,
        metadata: metadata(raw.metadata, `${at}[metadata]`),
      };
    });
    const currency = items[0].currency;
    if (items.some((item) => item.currency !== currency)) {
      throw invalid('line_items', 'All line items must use the same currency.', 'parameter_invalid');
    }
    const total = items.reduce((sum, item) => sum + item.unitAmount * item.quantity, 0);
    if (total < MIN_AMOUNT) {
      throw invalid(
        'line_items',
        `The Checkout Session's total amount due must add up to at least ${formatAmount(MIN_AMOUNT, currency)}.`,
        'amount_too_small',
      );
    }
    if (total > MAX_AMOUNT) {
      throw invalid('line_items', `The Checkout Session's total amount due must be at most ${formatAmount(MAX_AMOUNT, currency)}.`, 'amount_too_large');
    }

    const created = nowSeconds();
    const expiresAt = optionalInteger(p.expires_at, 'expires_at') ?? created + MAX_SESSION_SECONDS;
    if (expiresAt < created + MIN_SESSION_SECONDS || expiresAt > created + MAX_SESSION_SECONDS) {
      throw invalid('expires_at', 'expires_at must be between 30 minutes and 24 hours from now.', 'parameter_invalid_integer');
    }
    const pid = optionalObject(p.payment_intent_data, 'payment_intent_data');
    if (pid) onlyKeys(pid, ['metadata', 'description'], 'payment_intent_data');

    const record = buildSession({
      created,
      expiresAt,
      currency,
      lineItems: items,
      successUrl: optionalUrl(p.success_url, 'success_url'),
      cancelUrl: optionalUrl(p.cancel_url, 'cancel_url'),
      customerEmail: optionalEmail(p.customer_email, 'customer_email'),
      clientReferenceId: optionalString(p.client_reference_id, 'client_reference_id', 200),
      metadata: metadata(p.metadata, 'metadata'),
      paymentIntentMetadata: metadata(pid?.metadata, 'payment_intent_data[metadata]'),
      paymentIntentDescription: optionalString(pid?.description, 'payment_intent_data[description]', 1000),
      publicUrl,
    });
    const expand = singleExpand(p); // validate before storing anything
    state.sessions[record.session.id] = record;
    return { body: expanded(record.session, expand) };
  }

  function retrieveSession(ctx: ApiContext): ApiResult {
    const record = sessionRecord(ctx.match[1]);
    expireIfDue(record);
    return { body: expanded(record.session, singleExpand(ctx.params)) };
  }

  function expireSessionRoute(ctx: ApiContext): ApiResult {
    onlyKeys(ctx.params, ['expand']);
    const record = sessionRecord(ctx.match[1]);
    const expand = singleExpand(ctx.params);
    if (!expireIfDue(record)) {
      if (record.session.status !== 'open') {
        throw invalid(
          undefined,
          `Only an open Checkout Session can be expired; ${record.session.id} is ${record.session.status}.`,
        );
      }
      expireSession(record, { id: ctx.requestId, idempotency_key: ctx.idempotencyKey });
    }
    return { body: expanded(record.session, expand) };
  }

  function listSessionLineItems(ctx: ApiContext): ApiResult {
    const record = sessionRecord(ctx.match[1]);
    return { body: lineItemsList(record, ctx.params) };
  }

  function retrievePaymentIntent(ctx: ApiContext): ApiResult {
    const pi = get(state.paymentIntents, 'payment_intent', ctx.match[1], 'intent');
    return { body: expanded(pi, singleExpand(ctx.params)) };
  }

  function retrieveCharge(ctx: ApiContext): ApiResult {
    return { body: expanded(get(state.charges, 'charge', ctx.match[1], 'charge'), singleExpand(ctx.params)) };
  }

  function retrieveBalanceTransaction(ctx: ApiContext): ApiResult {
    return { body: expanded(get(state.balanceTransactions, 'balance_transaction', ctx.match[1], 'id'), singleExpand(ctx.params)) };
  }

  function createRefund(ctx: ApiContext): ApiResult {
    const p = ctx.params;
    onlyKeys(p, ['payment_intent', 'charge', 'amount', 'reason', 'metadata', 'expand']);
    const piId = optionalString(p.payment_intent, 'payment_intent');
    const chargeId = optionalString(p.charge, 'charge');
    if (!piId && !chargeId) {
      throw invalid('payment_intent', 'One of the following params should be provided for this request: payment_intent or charge.', 'parameter_missing');
    }
    let charge: Stripe.Charge;
    if (chargeId) {
      charge = get(state.charges, 'charge', chargeId, 'charge');
      if (piId && charge.payment_intent !== piId) {
        get(state.paymentIntents, 'payment_intent', piId, 'payment_intent');
        throw invalid('charge', `The charge ${chargeId} does not belong to the PaymentIntent ${piId}.`, 'parameter_invalid');
      }
    } else {
      const pi = get(state.paymentIntents, 'payment_intent', piId!, 'payment_intent');
      const latest = typeof pi.latest_charge === 'string' ? state.charges[pi.latest_charge] : undefined;
      if (pi.status !== 'succeeded' || !latest) {
        throw invalid('payment_intent', `This PaymentIntent (${pi.id}) does not have a successful charge to refund.`, 'charge_not_refundable');
      }
      charge = latest;
    }
    if (charge.status !== 'succeeded') {
      throw invalid('charge', `The charge ${charge.id} did not succeed, so there is nothing to refund.`, 'charge_not_refundable');
    }
    const remaining = charge.amount - charge.amount_refunded;
    if (remaining <= 0) throw invalid('charge', `Charge ${charge.id} has already been refunded.`, 'charge_already_refunded');
    const amount = optionalInteger(p.amount, 'amount') ?? remaining;
    if (amount < 1) throw invalid('amount', 'Refund amount must be at least 1.', 'amount_too_small');
    if (amount > remaining) {
      throw invalid(
        'amount',
        `Refund amount (${formatAmount(amount, charge.currency)}) is greater than unrefunded amount on charge (${formatAmount(remaining, charge.currency)}).`,
        'amount_too_large',
      );
    }
    const reasonText = optionalString(p.reason, 'reason');
    if (reasonText !== null && !(REFUND_REASONS as readonly string[]).includes(reasonText)) {
      throw invalid('reason', `Invalid reason: must be one of ${REFUND_REASONS.join(', ')}.`, 'parameter_invalid');
    }
    const meta = metadata(p.metadata, 'metadata');
    const expand = singleExpand(p);

    const txnId = newId(ID_PREFIX.balanceTransaction);
    const refund = buildRefund({
      charge,
      amount,
      reason: reasonText as Stripe.Refund.Reason | null,
      metadata: meta,
      created: nowSeconds(),
      balanceTransactionId: txnId,
    });
    state.refunds[refund.id] = refund;
    state.balanceTransactions[txnId] = buildRefundTransaction(txnId, refund);
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded === charge.amount;
    const request = { id: ctx.requestId, idempotency_key: ctx.idempotencyKey };
    emit('refund.created', refund, request);
    emit('charge.refunded', charge, request);
    return { body: expanded(refund, expand) };
  }

  function retrieveRefund(ctx: ApiContext): ApiResult {
    return { body: expanded(get(state.refunds, 'refund', ctx.match[1], 'id'), singleExpand(ctx.params)) };
  }

  function listRefunds(ctx: ApiContext): ApiResult {
    const p = ctx.params;
    const piId = optionalString(p.payment_intent, 'payment_intent');
    const chargeId = optionalString(p.charge, 'charge');
    const all = Object.values(state.refunds).filter(
      (r) => (!piId || r.payment_intent === piId) && (!chargeId || r.charge === chargeId),
    );
    return { body: pageOf(all, p, '/v1/refunds') };
  }

  function retrieveEvent(ctx: ApiContext): ApiResult {
    const event = state.events.find((e) => e.id === ctx.match[1]);
    if (!event) throw noSuch('event', ctx.match[1], 'id');
    return { body: event };
  }

  function listEvents(ctx: ApiContext): ApiResult {
    const type = optionalString(ctx.params.type, 'type');
    const matches = (t: string): boolean => {
      if (!type) return true;
      if (type.endsWith('.*')) return t.startsWith(type.slice(0, -1));
      return t === type;
    };
    return { body: pageOf(state.events.filter((e) => matches(e.type)), ctx.params, '/v1/events') };
  }

  const ID = '([^/]+)';
  const routes: Route[] = [
    { method: 'POST', pattern: /^\/v1\/checkout\/sessions$/, handler: createSession },
    { method: 'GET', pattern: new RegExp(`^/v1/checkout/sessions/${ID}$`), handler: retrieveSession },
    { method: 'POST', pattern: new RegExp(`^/v1/checkout/sessions/${ID}/expire$`), handler: expireSessionRoute },
    { method: 'GET', pattern: new RegExp(`^/v1/checkout/sessions/${ID}/line_items$`), handler: listSessionLineItems },
    { method: 'GET', pattern: new RegExp(`^/v1/payment_intents/${ID}$`), handler: retrievePaymentIntent },
    { method: 'GET', pattern: new RegExp(`^/v1/charges/${ID}$`), handler: retrieveCharge },
    { method: 'GET', pattern: new RegExp(`^/v1/balance_transactions/${ID}$`), handler: retrieveBalanceTransaction },
    { method: 'POST', pattern: /^\/v1\/refunds$/, handler: createRefund },
    { method: 'GET', pattern: /^\/v1\/refunds$/, handler: listRefunds },
    { method: 'GET', pattern: new RegExp(`^/v1/refunds/${ID}$`), handler: retrieveRefund },
    { method: 'GET', pattern: /^\/v1\/events$/, handler: listEvents },
    { method: 'GET', pattern: new RegExp(`^/v1/events/${ID}$`), handler: retrieveEvent },
  ];

  async function handleApi(req: http.IncomingMessage, res: http.ServerResponse, url: URL): Promise<void> {
    const method = req.method ?? 'GET';
    const requestId = newId(ID_PREFIX.request, 14);
    const apiVersion = (req.headers['stripe-version'] as string | undefined) || defaultApiVersion;
    const headers: http.OutgoingHttpHeaders = { 'request-id': requestId, 'stripe-version': apiVersion };
    const rawKey = req.headers['idempotency-key'];
    const idempotencyKey = method === 'POST' && typeof rawKey === 'string' && rawKey !== '' ? rawKey : null;
    if (idempotencyKey) headers['idempotency-key'] = idempotencyKey;
    let claimedKey: string | null = null;
    const eventsBefore = state.events.length;
    try {
      const apiKey = bearerKey(req);
      if (!apiKey) {
        throw new ApiError(401, {
          type: 'invalid_request_error',
          message:
            "You did not provide an API key. Send your secret key in the Authorization header using Bearer auth (e.g. 'Authorization: Bearer sk_test_...').",
        });
      }
      if (!/^sk_test_[A-Za-z0-9_]+$/.test(apiKey)) {
        throw new ApiError(401, {
          type: 'invalid_request_error',
          code: 'api_key_invalid',
          message: `Invalid API Key provided: ${maskKey(apiKey)}. The local payments fake accepts only test secret keys (sk_test_...).`,
        });
      }

      let route: Route | undefined;
      let match: RegExpExecArray | null = null;
      for (const r of routes) {
        if (r.method !== method) continue;
        match = r.pattern.exec(url.pathname);
        if (match) {
          route = r;
          break;
        }
      }
      if (!route || !match) throw new ApiError(404, { type: 'invalid_request_error', message: `Unrecognized request URL (${method}: ${url.pathname}).` });

      let params: FormObject;
      try {
        if (method === 'POST') {
          const body = await readBody(req);
          const type = String(req.headers['content-type'] ?? '');
          if (body.trim() !== '' && !type.toLowerCase().startsWith('application/x-www-form-urlencoded')) {
            throw invalid(undefined, 'Send parameters form-encoded, with Content-Type: application/x-www-form-urlencoded.');
          }
          params = parseForm(body);
        } else {
          params = parseForm(url.search.slice(1));
        }
      } catch (err) {
        if (err instanceof FormParseError) throw invalid(err.param, err.message, 'parameter_invalid');
        if (err instanceof BodyTooLarge) throw new ApiError(413, { type: 'invalid_request_error', message: err.message });
        throw err;
      }
      let matchParts: string[];
      try {
        matchParts = match.map((part) => decodeURIComponent(part));
      } catch {
        throw new ApiError(404, { type: 'invalid_request_error', message: `Unrecognized request URL (${method}: ${url.pathname}).` });
      }

      if (idempotencyKey) {
        if (idempotencyKey.length > 255) throw invalid(undefined, 'Idempotency-Key must be at most 255 characters.', 'parameter_invalid');
        pruneIdempotency();
        const print = fingerprint(method, url.pathname, params);
        const previous = Object.prototype.hasOwnProperty.call(state.idempotency, idempotencyKey) ? state.idempotency[idempotencyKey] : undefined;
        if (previous) {
          if (previous.fingerprint !== print) {
            throw new ApiError(400, {
              type: 'idempotency_error',
              message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idempotencyKey}' if you meant to execute a different request.`,
            });
          }
          return sendRawJson(res, previous.status, previous.body, { ...headers, 'idempotent-replayed': 'true', 'original-request': previous.requestId });
        }
        if (inflightKeys.has(idempotencyKey)) {
          throw new ApiError(409, {
            type: 'invalid_request_error',
            code: 'idempotency_key_in_use',
            message: `There is currently another in-progress request using this Idempotency-Key (${idempotencyKey}). Try again later.`,
          });
        }
        inflightKeys.add(idempotencyKey);
        claimedKey = idempotencyKey;
      }

      const result = route.handler({ params, match: matchParts, requestId, idempotencyKey });
      const status = result.status ?? 200;
      const payload = JSON.stringify(result.body, null, 2);
      if (idempotencyKey && status < 300) {
        state.idempotency[idempotencyKey] = {
          key: idempotencyKey,
          method,
          path: url.pathname,
          fingerprint: fingerprint(method, url.pathname, params),
          status,
          body: payload,
          requestId,
          createdAt: now(),
        };
      }
      // A GET changes nothing, unless it found a session past its time and expired it.
      if (method === 'POST' || state.events.length !== eventsBefore) await commit();
      sendRawJson(res, status, payload, headers);
    } catch (err) {
      // Looking a session up may have expired it before the request failed; keep that.
      if (state.events.length !== eventsBefore) await commit().catch(() => undefined);
      if (err instanceof ApiError) {
        const extra: http.OutgoingHttpHeaders = err.status === 401 ? { 'www-authenticate': 'Bearer realm="payments-fake"' } : {};
        sendJson(res, err.status, { error: { ...err.error, request_log_url: null } }, { ...headers, ...extra });
      } else {
        console.error('payments fake: unexpected error', err);
        sendJson(res, 500, { error: { type: 'api_error', message: 'The payments fake hit an unexpected error.' } }, headers);
      }
    } finally {
      if (claimedKey) inflightKeys.delete(claimedKey);
    }
  }

  // ---- hosted page ---------------------------------------------------------------------------

  async function handlePage(req: http.IncomingMessage, res: http.ServerResponse, sessionId: string): Promise<void> {
    const method = req.method ?? 'GET';
    const record = Object.prototype.hasOwnProperty.call(state.sessions, sessionId) ? state.sessions[sessionId] : undefined;
    if (method !== 'GET' && method !== 'HEAD' && method !== 'POST') {
      return sendHtml(res, 405, renderMessagePage('Not allowed', 'This page only shows a checkout and takes its form.'), { allow: 'GET, POST' });
    }
    if (!record) {
      return sendHtml(res, 404, renderMessagePage('Checkout not found', 'There is no checkout at this address. Go back and start again.'));
    }

    if (method !== 'POST') {
      if (expireIfDue(record)) await commit();
      return sendHtml(res, ...pageFor(record));
    }

    let form: FormObject;
    try {
      form = parseForm(await readBody(req));
    } catch (err) {
      const message = err instanceof BodyTooLarge ? 'The form was too large.' : 'The form could not be read. Please try again.';
      return sendHtml(res, 400, renderMessagePage('Something went wrong', message));
    }
    const text = (v: FormValue | undefined): string => (typeof v === 'string' ? v : '');
    const card = text(form.card);
    const email = text(form.email);
    const result = pay(record, card, email);
    await commit();
    switch (result.outcome) {
      case 'succeeded':
        if (result.redirectUrl) {
          res.writeHead(303, { location: result.redirectUrl, 'cache-control': 'no-store', 'content-length': 0 });
          return void res.end();
        }
        return sendHtml(res, 200, renderMessagePage('Payment received', `Thank you. ${merchantName} has your payment.`));
      case 'declined':
        return sendHtml(res, 402, renderCheckoutPage({ record, merchantName, error: `${result.message} Try another card.`, card, email }));
      case 'invalid_card':
      case 'invalid_email':
        return sendHtml(res, 400, renderCheckoutPage({ record, merchantName, error: result.message, card, email }));
      case 'not_open':
        return sendHtml(res, 409, pageFor(record)[1]);
    }
  }

  /** What GET /pay/:id shows for the session as it stands. */
  function pageFor(record: SessionRecord): [number, string] {
    const session = record.session;
    if (session.status === 'complete') {
      return [
        200,
        renderMessagePage(
          'Already paid',
          'This payment has already been made. Nothing more to pay.',
          session.success_url ? { href: session.success_url.split('{CHECKOUT_SESSION_ID}').join(session.id), text: 'Continue' } : undefined,
        ),
      ];
    }
    if (session.status === 'expired') {
      return [
        410,
        renderMessagePage(
          'Checkout expired',
          'This checkout has expired, so it can no longer be paid. Go back and start again.',
          session.cancel_url ? { href: session.cancel_url, text: 'Go back' } : undefined,
        ),
      ];
    }
    return [200, renderCheckoutPage({ record, merchantName })];
  }

  // ---- fake-only helpers ---------------------------------------------------------------------

  async function handleFake(req: http.IncomingMessage, res: http.ServerResponse, pathname: string): Promise<void> {
    const method = req.method ?? 'GET';
    const notAllowed = (allow: string): void =>
      sendJson(res, 405, { error: { type: 'invalid_request_error', message: 'Method not allowed' } }, { allow });

    if (pathname === '/_fake/health') {
      if (method !== 'GET' && method !== 'HEAD') return notAllowed('GET');
      return sendJson(res, 200, { status: 'ok' });
    }

    if (pathname === '/_fake/deliveries') {
      if (method !== 'GET') return notAllowed('GET');
      const typeOf = (id: string): string | null => state.events.find((e) => e.id === id)?.type ?? null;
      return sendJson(res, 200, {
        webhook_url: webhookUrl,
        pending: state.deliveries.map((d) => ({ ...d, eventType: typeOf(d.eventId), nextAttemptAt: new Date(d.nextAttemptAt).toISOString() })),
        attempts: [...state.deliveryLog].reverse(),
      });
    }

    if (pathname === '/_fake/deliveries/flush') {
      if (method !== 'POST') return notAllowed('POST');
      const result = deliverer ? await deliverer.flush() : { attempted: 0, delivered: 0, pending: 0 };
      return sendJson(res, 200, result);
    }

    const payMatch = /^\/_fake\/checkout\/([^/]+)\/pay$/.exec(pathname);
    if (payMatch) {
      if (method !== 'POST') return notAllowed('POST');
      let body: { card?: unknown; email?: unknown };
      try {
        const text = await readBody(req);
        body = text.trim() === '' ? {} : (JSON.parse(text) as typeof body);
        if (typeof body !== 'object' || body === null || Array.isArray(body)) throw new Error('not an object');
      } catch {
        return sendJson(res, 400, { error: { type: 'invalid_request_error', message: 'Send a JSON object such as {"card":"4242 4242 4242 4242"}.' } });
      }
      let sessionId: string;
      try {
        sessionId = decodeURIComponent(payMatch[1]);
      } catch {
        sessionId = payMatch[1];
      }
      const record = Object.prototype.hasOwnProperty.call(state.sessions, sessionId) ? state.sessions[sessionId] : undefined;
      if (!record) return sendJson(res, 404, { error: noSuch('checkout.session', sessionId, 'session').error });
      const result = pay(record, typeof body.card === 'string' ? body.card : '', typeof body.email === 'string' ? body.email : '');
      await commit();
      switch (result.outcome) {
        case 'succeeded':
          return sendJson(res, 200, {
            outcome: 'succeeded',
            redirect_url: result.redirectUrl,
            session: result.record.session,
            payment_intent: result.paymentIntent,
            charge: result.charge,
          });
        case 'declined':
          return sendJson(res, 402, {
            outcome: 'declined',
            decline_code: result.declineCode,
            message: result.message,
            session: result.record.session,
            payment_intent: result.paymentIntent,
            charge: result.charge,
          });
        case 'invalid_card':
        case 'invalid_email':
          return sendJson(res, 400, { outcome: result.outcome, message: result.message });
        case 'not_open':
          return sendJson(res, 409, { outcome: 'not_open', session_status: result.record.session.status, message: result.message });
      }
    }

    return sendJson(res, 404, { error: { type: 'invalid_request_error', message: `Unknown fake helper: ${method} ${pathname}` } });
  }

  // ---- server --------------------------------------------------------------------------------

  const server = http.createServer((req, res) => {
    const handle = async (): Promise<void> => {
      const url = new URL(req.url ?? '/', 'http://fake.invalid');
      const pathname = url.pathname;
      if (pathname === '/v1' || pathname.startsWith('/v1/')) return handleApi(req, res, url);
      const page = /^\/pay\/([^/]+)\/?$/.exec(pathname);
      if (page) {
        let id: string;
        try {
          id = decodeURIComponent(page[1]);
        } catch {
          id = page[1];
        }
        return handlePage(req, res, id);
      }
      if (pathname.startsWith('/_fake/')) return handleFake(req, res, pathname.replace(/\/+$/, ''));
      return sendJson(res, 404, { error: { type: 'invalid_request_error', message: `Unrecognized request URL (${req.method}: ${pathname}).` } });
    };
    handle().catch((err: unknown) => {
      console.error('payments fake: unexpected error', err);
      if (!res.headersSent) sendJson(res, 500, { error: { type: 'api_error', message: 'The payments fake hit an unexpected error.' } });
      else res.destroy();
    });
  });

  const port = await listen(server, opts.port, host);
  const ownUrl = `http://${host === '0.0.0.0' || host === '::' ? '127.0.0.1' : host}:${port}`;
  publicUrl = (opts.publicUrl || ownUrl).replace(/\/+$/, '');

  // Sessions past their time, and idempotency keys past 24 hours.
  const sweep = setInterval(() => {
    let changed = false;
    for (const record of Object.values(state.sessions)) changed = expireIfDue(record) || changed;
    const keysBefore = Object.keys(state.idempotency).length;
    pruneIdempotency();
    changed = changed || Object.keys(state.idempotency).length !== keysBefore;
    if (changed) commit().catch((err: unknown) => console.error('payments fake: could not save state', err));
  }, opts.expirySweepMs ?? 10_000);
  sweep.unref();

  // Deliveries left pending by an earlier run.
  deliverer?.kick();

  let closing: Promise<void> | undefined;
  return {
    port,
    url: ownUrl,
    close() {
      closing ??= (async () => {
        clearInterval(sweep);
        await new Promise<void>((resolve) => {
          server.close(() => resolve());
          server.closeAllConnections();
        });
        await deliverer?.close();
        await store.save();
        await store.settle();
      })();
      return closing;
    },
  };
}
