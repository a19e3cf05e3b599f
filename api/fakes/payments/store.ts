/**
 * Everything the payments fake knows, kept in memory and written to one JSON file after each
 * change (temporary file + rename, so a crash never leaves half a file behind).
 */
import { promises as fs } from 'node:fs';
import * as path from 'node:path';
import type Stripe from 'stripe';
import type { PaymentsEvent, SessionRecord } from './objects';

export const STATE_FILE = 'state.json';
export const STATE_VERSION = 1;

export interface IdempotencyRecord {
  key: string;
  method: string;
  path: string;
  /** The request's parameters in a canonical form; a reuse must match it exactly. */
  fingerprint: string;
  status: number;
  /** The JSON body exactly as first sent. */
  body: string;
  /** The request that first ran, named in the replay's Original-Request header. */
  requestId: string;
  createdAt: number;
}

export interface PendingDelivery {
  eventId: string;
  /** Attempts made so far. */
  attempts: number;
  /** When the next attempt is due, in epoch milliseconds. */
  nextAttemptAt: number;
}

export interface DeliveryAttempt {
  eventId: string;
  eventType: string;
  attempt: number;
  at: string;
  url: string;
  /** The receiver's HTTP status, or null when it could not be reached. */
  status: number | null;
  error: string | null;
  outcome: 'delivered' | 'will_retry' | 'gave_up';
}

export interface FakeState {
  version: number;
  sessions: Record<string, SessionRecord>;
  paymentIntents: Record<string, Stripe.PaymentIntent>;
  charges: Record<string, Stripe.Charge>;
  refunds: Record<string, Stripe.Refund>;
  balanceTransactions: Record<string, Stripe.BalanceTransaction>;
  /** Oldest first. */
  events: PaymentsEvent[];
  idempotency: Record<string, IdempotencyRecord>;
  deliveries: PendingDelivery[];
  /** Oldest first, trimmed to the last MAX_DELIVERY_LOG entries. */
  deliveryLog: DeliveryAttempt[];
}

export const MAX_DELIVERY_LOG = 500;

export function emptyState(): FakeState {
  return {
    version: STATE_VERSION,
    sessions: {},
    paymentIntents: {},
    charges: {},
    refunds: {},
    balanceTransactions: {},
    events: [],
    idempotency: {},
    deliveries: [],
    deliveryLog: [],
  };
}

export class StateStore {
  state: FakeState = emptyState();
  private readonly file: string;
  private writing: Promise<void> = Promise.resolve();
  private dirty = false;

  constructor(private readonly dir: string) {
    this.file = path.join(dir, STATE_FILE);
  }

  async load(): Promise<void> {
    await fs.mkdir(this.dir, { recursive: true });
    let text: string;
    try {
      text = await fs.readFile(this.file, 'utf8');
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return;
      throw err;
    }
    let parsed: Partial<FakeState>;
    try {
      parsed = JSON.parse(text) as Partial<FakeState>;
    } catch (err) {
      throw new Error(`${this.file} is not valid JSON (${(err as Error).message}); move it aside to start empty`);
    }
    if (parsed.version !== STATE_VERSION) {
      throw new Error(`${this.file} has state version ${String(parsed.version)}, expected ${STATE_VERSION}`);
    }
    this.state = { ...emptyState(), ...parsed };
  }

  /**
   * Writes the current state. Calls made while a write is running share one follow-up write, so
   * the file always ends up holding the latest state.
   */
  save(): Promise<void> {
    this.dirty = true;
    const run = this.writing.then(async () => {
      if (!this.dirty) return;
      this.dirty = false;
      const text = JSON.stringify(this.state);
      const temp = `${this.file}.${process.pid}.tmp`;
      await fs.writeFile(temp, text);
      await fs.rename(temp, this.file);
    });
    this.writing = run.catch(() => undefined);
    return run;
  }

  /** Waits for any write in progress. */
  settle(): Promise<void> {
    return this.writing;
  }
}
