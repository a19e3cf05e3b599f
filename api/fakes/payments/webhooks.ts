/**
 * Webhook delivery for the payments fake: each event is POSTed as JSON to one endpoint, signed the
 * way the card-payment service documents, and retried with exponential backoff until the endpoint
 * answers 2xx or the attempts run out. Pending deliveries live in the saved state, so they survive
 * a restart.
 *
 * Signature header: `Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<body>">`,
 * keyed with the endpoint's signing secret. Every attempt is signed afresh with the current time,
 * so a late retry still passes the receiver's timestamp tolerance.
 */
import { createHmac } from 'node:crypto';
import * as http from 'node:http';
import * as https from 'node:https';
import { MAX_DELIVERY_LOG, type PendingDelivery, type StateStore } from './store';

export function signPayload(payload: string, secret: string, timestamp: number): string {
  const signature = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${signature}`;
}

export interface DelivererOptions {
  store: StateStore;
  url: string;
  secret: string;
  now: () => number;
  /** Delay before the first retry; each later retry doubles it. */
  retryBaseMs: number;
  /** Longest delay between two attempts. */
  retryMaxMs: number;
  /** Attempts in all, the first included, before the fake gives up on an event. */
  maxAttempts: number;
  /** How long to wait for the endpoint to answer one attempt. */
  timeoutMs: number;
}

interface PostResult {
  status: number | null;
  error: string | null;
  aborted: boolean;
}

const MAX_TIMER_MS = 2 ** 31 - 1;

function post(url: URL, payload: string, headers: http.OutgoingHttpHeaders, timeoutMs: number, signal: AbortSignal): Promise<PostResult> {
  return new Promise((resolve) => {
    const transport = url.protocol === 'https:' ? https : http;
    let settled = false;
    const done = (result: PostResult): void => {
      if (settled) return;
      settled = true;
      resolve(result);
    };
    const req = transport.request(
      url,
      {
        method: 'POST',
        agent: false,
        signal,
        timeout: timeoutMs,
        headers: { ...headers, 'content-length': Buffer.byteLength(payload) },
      },
      (res) => {
        res.on('error', () => undefined);
        res.resume(); // the body does not matter; drain it so the socket closes
        res.on('end', () => done({ status: res.statusCode ?? null, error: null, aborted: false }));
        res.on('close', () => done({ status: res.statusCode ?? null, error: null, aborted: false }));
      },
    );
    req.on('timeout', () => req.destroy(new Error(`no answer within ${timeoutMs} ms`)));
    req.on('error', (err) => done({ status: null, error: err.message, aborted: signal.aborted }));
    req.end(payload);
  });
}

/** Sends pending deliveries in the order they fall due, one at a time. */
export class Deliverer {
  private timer: NodeJS.Timeout | undefined;
  private loop: Promise<void> | null = null;
  private again = false;
  private closed = false;
  private readonly abort = new AbortController();
  private readonly url: URL;
  /** Attempts made by this process, for flush() to report. */
  private readonly counts = { attempted: 0, delivered: 0 };

  constructor(private readonly opts: DelivererOptions) {
    this.url = new URL(opts.url);
  }

  /** Queues an event for delivery (the caller saves the state). */
  enqueue(eventId: string): void {
    this.opts.store.state.deliveries.push({ eventId, attempts: 0, nextAttemptAt: this.opts.now() });
  }

  /** Starts a pass over due deliveries now, or right after the running one. */
  kick(): void {
    if (this.closed) return;
    if (this.loop) {
      this.again = true;
      return;
    }
    clearTimeout(this.timer);
    this.timer = undefined;
    this.loop = this.pass()
      .catch((err: unknown) => {
        console.error('payments fake: webhook delivery failed unexpectedly:', err);
      })
      .finally(() => {
        this.loop = null;
        if (this.again) {
          this.again = false;
          this.kick();
        } else {
          this.arm();
        }
      });
  }

  /** Makes every pending delivery due now and waits until one attempt has been made at each. */
  async flush(): Promise<{ attempted: number; delivered: number; pending: number }> {
    const state = this.opts.store.state;
    const before = { ...this.counts };
    for (const d of state.deliveries) d.nextAttemptAt = this.opts.now();
    this.kick();
    while (this.loop) await this.loop;
    return {
      attempted: this.counts.attempted - before.attempted,
      delivered: this.counts.delivered - before.delivered,
      pending: state.deliveries.length,
    };
  }

  async close(): Promise<void> {
    this.closed = true;
    clearTimeout(this.timer);
    this.abort.abort();
    while (this.loop) await this.loop;
  }

  private arm(): void {
    const pending = this.opts.store.state.deliveries;
    if (this.closed || pending.length === 0) return;
    const next = Math.min(...pending.map((d) => d.nextAttemptAt));
    const delay = Math.min(Math.max(0, next - this.opts.now()), MAX_TIMER_MS);
    this.timer = setTimeout(() => this.kick(), delay);
    this.timer.unref();
  }

  private nextDue(): PendingDelivery | undefined {
    const now = this.opts.now();
    let best: PendingDelivery | undefined;
    for (const d of this.opts.store.state.deliveries) {
      if (d.nextAttemptAt <= now && (!best || d.nextAttemptAt < best.nextAttemptAt)) best = d;
    }
    return best;
  }

  private async pass(): Promise<void> {
    for (let due = this.nextDue(); due && !this.closed; due = this.nextDue()) {
      await this.attempt(due);
    }
  }

  private async attempt(delivery: PendingDelivery): Promise<void> {
    const { store, now } = this.opts;
    const state = store.state;
    const event = state.events.find((e) => e.id === delivery.eventId);
    if (!event) {
      state.deliveries = state.deliveries.filter((d) => d !== delivery);
      await store.save();
      return;
    }

    const payload = JSON.stringify(event, null, 2);
    const timestamp = Math.floor(now() / 1000);
    const result = await post(
      this.url,
      payload,
      {
        'content-type': 'application/json; charset=utf-8',
        'user-agent': 'Selvage-PaymentsFake/1.0',
        'stripe-signature': signPayload(payload, this.opts.secret, timestamp),
      },
      this.opts.timeoutMs,
      this.abort.signal,
    );
    // Shutting down mid-attempt: leave the delivery as it was, to be tried after a restart.
    if (result.aborted || this.closed) return;

    delivery.attempts += 1;
    const ok = result.status !== null && result.status >= 200 && result.status < 300;
    this.counts.attempted += 1;
    if (ok) this.counts.delivered += 1;
    const gaveUp = !ok && delivery.attempts >= this.opts.maxAttempts;
    if (ok || gaveUp) {
      state.deliveries = state.deliveries.filter((d) => d !== delivery);
      event.pending_webhooks = 0;
    } else {
      const delay = Math.min(this.opts.retryBaseMs * 2 ** (delivery.attempts - 1), this.opts.retryMaxMs);
      delivery.nextAttemptAt = now() + delay;
    }
    state.deliveryLog.push({
      eventId: event.id,
      eventType: event.type,
      attempt: delivery.attempts,
      at: new Date(now()).toISOString(),
      url: this.url.toString(),
      status: result.status,
      error: result.error ?? (ok ? null : `HTTP ${result.status}`),
      outcome: ok ? 'delivered' : gaveUp ? 'gave_up' : 'will_retry',
    });
    if (state.deliveryLog.length > MAX_DELIVERY_LOG) state.deliveryLog.splice(0, state.deliveryLog.length - MAX_DELIVERY_LOG);
    await store.save();
  }
}
