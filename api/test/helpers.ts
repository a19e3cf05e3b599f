import { MikroORM } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { Test } from '@nestjs/testing';
import { randomBytes } from 'node:crypto';
import * as http from 'node:http';
import type { AddressInfo } from 'node:net';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Stripe from 'stripe';
import { startPaymentsFake, type PaymentsFakeHandle } from '../fakes/payments/payments-fake';
import request from 'supertest';
import TestAgent from 'supertest/lib/agent';
import { AppModule } from '../src/app.module';
import { hashPassword } from '../src/auth/passwords';
import { configureApp } from '../src/configure-app';
import { Guild } from '../src/guilds/guild.entity';
import { Membership } from '../src/guilds/membership.entity';
import type { Role } from '../src/guilds/roles';
import { User } from '../src/users/user.entity';

/** The api's e2e tests run against the real MariaDB that `npm test` starts (see api/scripts/stack.ts). */
export const ORIGIN = process.env.APP_ORIGIN ?? 'http://127.0.0.1:3100';
export const PASSWORD = 'a-test-password-long-enough';

export interface TestApp {
  app: NestExpressApplication;
  orm: MikroORM;
  http: ReturnType<NestExpressApplication['getHttpServer']>;
  close(): Promise<void>;
}

export async function createTestApp(): Promise<TestApp> {
  {
    const moduleRef = await Test.createTestingModule({ imports: [AppModule] }).compile();
    const app = moduleRef.createNestApplication<NestExpressApplication>({ rawBody: true, logger: ['error', 'warn'] });
    const { closeSessionStore } = configureApp(app);
    await app.init();
    return {
      app,
      orm: app.get(MikroORM),
      http: app.getHttpServer(),
      async close() {
        await app.close();
        await closeSessionStore();
      },
    };
  }
}

/** A cookie-keeping client that sends our Origin on every request, as our own pages do. */
export function client(t: TestApp) {
  const agent: TestAgent = request.agent(t.http);
  agent.set('Origin', ORIGIN);
  return agent;
}

export function unique(prefix = 'u'): string {
  return `${prefix}-${Date.now().toString(36)}-${randomBytes(3).toString('hex')}`;
}

let cachedHash: Promise<string> | undefined;

export interface Person {
  user: User;
  email: string;
  membership?: Membership;
}

/** Two fresh guilds with one person per role, so tests never depend on each other's data. */
export async function createScenario(t: TestApp) {
  cachedHash ??= hashPassword(PASSWORD);
  const passwordHash = await cachedHash;
  const em = t.orm.em.fork();
  const tag = unique('g');
  const guild = em.create(Guild, { name: `Guild ${tag}`, town: 'Testville' });
  const otherGuild = em.create(Guild, { name: `Other ${tag}`, town: 'Elsewhere' });
  const person = (key: string, g: Guild | null, roles: Role[]): Person => {
    const email = `${key}.${tag}@test.example`;
    const user = em.create(User, { email, name: `${key} ${tag}`, passwordHash });
    const membership = g ? em.create(Membership, { user, guild: g, roles }) : undefined;
    return { user, email, membership };
  };
  const people = {
    admin: person('admin', guild, ['admin']),
    treasurer: person('treasurer', guild, ['treasurer']),
    membershipChair: person('chair', guild, ['membership_chair']),
    showChair: person('show', guild, ['show_chair']),
    member: person('member', guild, []),
    outsider: person('outsider', otherGuild, ['admin']),
    loner: person('loner', null, []),
  };
  await em.flush();
  return { guild, otherGuild, tag, ...people };
}

export async function signIn(t: TestApp, email: string, password = PASSWORD) {
  const agent = client(t);
  const res = await agent.post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

export interface InboxMessage {
  id: string;
  subject: string;
  to: string;
  text: string;
  html: string;
  headers: Record<string, string>;
  attachments?: { filename: string; contentType: string; contentBase64: string }[];
}

/** Waits for the SMTP fake to hold a message to `to` that matches, and returns it in full. */
export async function waitForMail(to: string, match: (m: InboxMessage) => boolean = () => true, timeoutMs = 20_000) {
  const base = process.env.SMTP_FAKE_INBOX_URL;
  if (!base) throw new Error('SMTP_FAKE_INBOX_URL is not set: run the tests through npm test');
  const started = Date.now();
  for (;;) {
    const list = (await (await fetch(`${base}/messages?to=${encodeURIComponent(to)}`)).json()) as { id: string }[];
    for (const summary of list) {
      const full = (await (await fetch(`${base}/messages/${summary.id}`)).json()) as InboxMessage;
      if (match(full)) return full;
    }
    if (Date.now() - started > timeoutMs) throw new Error(`no e-mail to ${to} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

export function linkIn(text: string, pathPrefix: string): string {
  const m = text.match(new RegExp(`https?://[^\\s"<>]+${pathPrefix.replace(/[/?]/g, '\\$&')}[^\\s"<>]*`));
  if (!m) throw new Error(`no ${pathPrefix} link in:\n${text}`);
  return m[0];
}

/** An event the relay received from the payments fake, as sent (the raw JSON body). */
export interface RelayedEvent {
  id: string;
  type: string;
  body: string;
  /** What the api answered when the relay passed it on; null when it was held or refused. */
  status: number | null;
}

export interface PaymentsHarness {
  fake: PaymentsFakeHandle;
  /** The SDK pointed at the fake, with the api's key: for looking at what the service holds. */
  stripe: Stripe;
  webhookSecret: string;
  /** forward: pass events to the api; hold: answer 200 and keep them; fail: answer 503 (the fake retries). */
  mode: 'forward' | 'hold' | 'fail';
  events: RelayedEvent[];
  /** Call once the app exists: the relay forwards events to it. */
  attach(t: TestApp): void;
  /** Pays a Checkout Session the way the hosted page does; answers with the fake's JSON. */
  pay(sessionId: string, card?: string): Promise<{ status: number; body: Record<string, unknown> }>;
  /** Sends the body to the api's webhook with a fresh signature (optionally with another timestamp). */
  deliver(body: string, opts?: { timestamp?: number; secret?: string }): Promise<request.Response>;
  /** Waits until the fake has no deliveries left to make. */
  drained(timeoutMs?: number): Promise<void>;
  close(): Promise<void>;
}

/**
 * The payments fake for e2e tests, with a relay in front of the api's webhook so a test can hold,
 * refuse, reorder or repeat events. Call before createTestApp: it sets the PAYMENTS_* variables the
 * app reads when it is created.
 */
export async function startPaymentsHarness(): Promise<PaymentsHarness> {
  const webhookSecret = `whsec_test_${randomBytes(12).toString('hex')}`;
  const secretKey = 'sk_test_selvage_e2e';
  let app: TestApp | null = null;
  const relay = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      const body = Buffer.concat(chunks).toString('utf8');
      const parsed = JSON.parse(body) as { id: string; type: string };
      const entry: RelayedEvent = { id: parsed.id, type: parsed.type, body, status: null };
      harness.events.push(entry);
      if (harness.mode === 'fail' || !app) {
        res.writeHead(503).end();
        return;
      }
      if (harness.mode === 'hold') {
        res.writeHead(200).end();
        return;
      }
      request(app.http)
        .post('/api/payments/webhook')
        .set('Content-Type', 'application/json')
        .set('Stripe-Signature', String(req.headers['stripe-signature'] ?? ''))
        .send(body)
        .then((r) => {
          entry.status = r.status;
          res.writeHead(r.status).end();
        })
        .catch(() => res.writeHead(502).end());
    });
  });
  await new Promise<void>((r) => relay.listen(0, '127.0.0.1', () => r()));
  const relayPort = (relay.address() as AddressInfo).port;
  const dataDir = mkdtempSync(join(tmpdir(), 'selvage-payments-'));
  const fake = await startPaymentsFake({
    port: 0,
    dataDir,
    webhookUrl: `http://127.0.0.1:${relayPort}/webhook`,
    webhookSecret,
    webhookRetryBaseMs: 200,
    webhookRetryMaxMs: 1000,
  });
  process.env.PAYMENTS_SECRET_KEY = secretKey;
  process.env.PAYMENTS_WEBHOOK_SECRET = webhookSecret;
  process.env.PAYMENTS_API_URL = fake.url;
  const harness: PaymentsHarness = {
    fake,
    stripe: new Stripe(secretKey, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 }),
    webhookSecret,
    mode: 'forward',
    events: [],
    attach(t) {
      app = t;
    },
    async pay(sessionId, card = '4242 4242 4242 4242') {
      const res = await fetch(`${fake.url}/_fake/checkout/${sessionId}/pay`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ card }),
      });
      return { status: res.status, body: (await res.json()) as Record<string, unknown> };
    },
    deliver(body, opts = {}) {
      if (!app) throw new Error('attach the app first');
      const header = Stripe.webhooks.generateTestHeaderString({
        payload: body,
        secret: opts.secret ?? webhookSecret,
        timestamp: opts.timestamp ?? Math.floor(Date.now() / 1000),
      });
      return request(app.http).post('/api/payments/webhook').set('Content-Type', 'application/json').set('Stripe-Signature', header).send(body);
    },
    async drained(timeoutMs = 20_000) {
      const started = Date.now();
      for (;;) {
        const state = (await (await fetch(`${fake.url}/_fake/deliveries`)).json()) as { pending: unknown[] };
        if (state.pending.length === 0) return;
        if (Date.now() - started > timeoutMs) throw new Error(`${state.pending.length} webhook deliveries still pending`);
        await new Promise((r) => setTimeout(r, 100));
      }
    },
    async close() {
      await fake.close();
      await new Promise<void>((r) => relay.close(() => r()));
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
  return harness;
}

/** Polls until `check` returns a value (not undefined/false), or fails after the timeout. */
export async function eventually<T>(check: () => Promise<T | undefined | false>, timeoutMs = 20_000, what = 'condition'): Promise<T> {
  const started = Date.now();
  for (;;) {
    const value = await check();
    if (value !== undefined && value !== false) return value;
    if (Date.now() - started > timeoutMs) throw new Error(`${what} not reached within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** A PDF's text as poppler's pdftotext lays it out (the test script installs poppler when missing). */
export function pdfText(pdf: Buffer): string {
  const dir = mkdtempSync(join(tmpdir(), 'selvage-pdf-'));
  try {
    writeFileSync(join(dir, 'doc.pdf'), pdf);
    return execFileSync('pdftotext', ['-layout', join(dir, 'doc.pdf'), '-'], { encoding: 'utf8' });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
