import { MikroORM } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { Test } from '@nestjs/testing';
import { randomBytes } from 'node:crypto';
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
