import request from 'supertest';
import { SignInFailure } from '../src/auth/sign-in-attempt.entity';
import { SessionRecord } from '../src/sessions/session-record.entity';
import { client, createScenario, createTestApp, ORIGIN, PASSWORD, signIn, TestApp, unique } from './helpers';

describe('sign-in, sessions, rate limit and CSRF (real MariaDB)', () => {
  let t: TestApp;
  let s: Awaited<ReturnType<typeof createScenario>>;

  beforeAll(async () => {
    t = await createTestApp();
    s = await createScenario(t);
  });
  afterAll(() => t.close());

  it('signs in, sets an httpOnly SameSite=Lax cookie, and knows who is there', async () => {
    const agent = client(t);
    const res = await agent.post('/api/auth/sign-in').send({ email: s.member.email.toUpperCase(), password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({ id: s.member.user.id, email: s.member.email, name: s.member.user.name });
    const cookie = res.headers['set-cookie'][0] as string;
    expect(cookie).toMatch(/^selvage\.sid=/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(cookie).not.toMatch(/Secure/); // served over http in tests
    const me = await agent.get('/api/auth/me');
    expect(me.body.user.email).toBe(s.member.email);
  });

  it('rotates the session id on sign-in, so a planted id is worthless', async () => {
    const agent = await signIn(t, s.member.email);
    const first = (await agent.get('/api/auth/me')).request.cookies;
    const again = await agent.post('/api/auth/sign-in').send({ email: s.treasurer.email, password: PASSWORD });
    const second = again.headers['set-cookie'][0].split(';')[0];
    expect(second).not.toBe(first);
    const old = await request(t.http).get('/api/dashboard').set('Cookie', first);
    expect(old.status).toBe(401);
  });

  it('keeps a remembered session for 30 days and a normal one for 2 hours of idleness', async () => {
    const short = await client(t).post('/api/auth/sign-in').send({ email: s.member.email, password: PASSWORD });
    const long = await client(t)
      .post('/api/auth/sign-in')
      .send({ email: s.member.email, password: PASSWORD, remember: true });
    const expires = (c: string) => new Date(/Expires=([^;]+)/.exec(c)![1]).getTime() - Date.now();
    expect(expires(short.headers['set-cookie'][0])).toBeGreaterThan(1.9 * 3600_000);
    expect(expires(short.headers['set-cookie'][0])).toBeLessThanOrEqual(2 * 3600_000);
    expect(expires(long.headers['set-cookie'][0])).toBeGreaterThan(29 * 24 * 3600_000);
  });

  it('ends a session that has been idle for over 2 hours, and one older than 12 hours', async () => {
    for (const field of ['lastSeenAt', 'signedInAt'] as const) {
      const agent = await signIn(t, s.member.email);
      expect((await agent.get('/api/dashboard')).status).toBe(200);
      // Age the stored session in the database itself, as time would.
      const em = t.orm.em.fork();
      const cookie = (await agent.get('/api/auth/me')).request.cookies as unknown as string;
      const sid = /selvage\.sid=s:([^.;]+)/.exec(decodeURIComponent(cookie))![1];
      const row = await em.findOneOrFail(SessionRecord, { sessionId: sid });
      const data = JSON.parse(row.data!);
      data[field] = Date.now() - (field === 'lastSeenAt' ? 2 * 3600_000 + 60_000 : 12 * 3600_000 + 60_000);
      if (field === 'signedInAt') data.lastSeenAt = Date.now();
      row.data = JSON.stringify(data);
      await em.flush();
      expect((await agent.get('/api/dashboard')).status).toBe(401);
    }
  });

  it('answers a wrong password and an unknown e-mail with the same message, in similar time', async () => {
    const time = async (email: string) => {
      const started = process.hrtime.bigint();
      const res = await client(t).post('/api/auth/sign-in').send({ email, password: 'wrong-password-here' });
      return { res, ms: Number(process.hrtime.bigint() - started) / 1e6 };
    };
    const wrong = await time(s.showChair.email);
    const unknown = await time(`${unique('nobody')}@test.example`);
    expect(wrong.res.status).toBe(401);
    expect(unknown.res.status).toBe(401);
    expect(unknown.res.body.message).toBe(wrong.res.body.message);
    // Both run one argon2 verification; an unknown address must not answer noticeably faster.
    expect(unknown.ms).toBeGreaterThan(wrong.ms * 0.3);
  });

  it('gives the 11th failed attempt on one account within 15 minutes a 429, even with the right password', async () => {
    const email = s.loner.email;
    for (let i = 1; i <= 10; i++) {
      const res = await client(t).post('/api/auth/sign-in').send({ email, password: `wrong-${i}-password` });
      expect(res.status).toBe(401);
    }
    const eleventh = await client(t).post('/api/auth/sign-in').send({ email, password: 'wrong-11-password' });
    expect(eleventh.status).toBe(429);
    expect(eleventh.body.message).toMatch(/wait 15 minutes/);
    const right = await client(t).post('/api/auth/sign-in').send({ email, password: PASSWORD });
    expect(right.status).toBe(429);
    // Another account from the same address is not affected by this one's lock.
    expect((await client(t).post('/api/auth/sign-in').send({ email: s.admin.email, password: PASSWORD })).status).toBe(200);
  });

  it('refuses cookie-authenticated writes that do not come from our own origin', async () => {
    const agent = await signIn(t, s.admin.email);
    const url = `/api/guilds/${s.guild.id}/invitations`;
    const body = { email: `${unique('csrf')}@test.example` };
    const evil = await agent.post(url).set('Origin', 'https://evil.example').send(body);
    expect(evil.status).toBe(403);
    expect(evil.body.message).toMatch(/Cross-site request refused/);
    const crossSite = await agent.post(url).set('Sec-Fetch-Site', 'cross-site').send(body);
    expect(crossSite.status).toBe(403);
    const cookie = (await agent.get('/api/auth/me')).request.cookies as unknown as string;
    const noOrigin = await request(t.http).post(url).set('Cookie', cookie).send(body);
    expect(noOrigin.status).toBe(403);
    // Nothing was written by the refused requests.
    const pending = await agent.get(url);
    expect(pending.body.map((i: { email: string }) => i.email)).not.toContain(body.email);
    const sameOrigin = await agent.post(url).set('Sec-Fetch-Site', 'same-origin').send(body);
    expect(sameOrigin.status).toBe(201);
    expect(ORIGIN).toMatch(/^http/);
  });

  it('signs out, and the old cookie no longer works', async () => {
    const agent = await signIn(t, s.member.email);
    const cookie = (await agent.get('/api/auth/me')).request.cookies as unknown as string;
    expect((await agent.post('/api/auth/sign-out')).status).toBe(204);
    expect((await agent.get('/api/auth/me')).body.user).toBeNull();
    expect((await request(t.http).get('/api/dashboard').set('Cookie', cookie)).status).toBe(401);
  });

  it('reports the database in /api/health', async () => {
    const res = await request(t.http).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body.details.database.status).toBe('up');
  });

  it('counts failures in the database, so a second api instance sees the first one\'s', async () => {
    const second = await createTestApp();
    try {
      const email = `${unique('shared')}@test.example`;
      for (let i = 0; i < 6; i++)
        expect((await client(t).post('/api/auth/sign-in').send({ email, password: 'nope-nope-nope' })).status).toBe(401);
      for (let i = 0; i < 4; i++)
        expect((await client(second).post('/api/auth/sign-in').send({ email, password: 'nope-nope-nope' })).status).toBe(401);
      const res = await client(second).post('/api/auth/sign-in').send({ email, password: 'nope-nope-nope' });
      expect(res.status).toBe(429);
    } finally {
      await second.close();
    }
  });

  it('applies a looser limit (100 failures) per address, across accounts', async () => {
    const em = t.orm.em.fork();
    const already = await em.count(SignInFailure, { address: { $like: '%127.0.0.1' } });
    let status = 0;
    let tries = 0;
    while (tries < 120) {
      tries++;
      const res = await client(t).post('/api/auth/sign-in').send({ email: `${unique('many')}@test.example`, password: 'nope-nope' });
      status = res.status;
      if (status !== 401) break;
    }
    expect(status).toBe(429);
    expect(already + tries - 1).toBe(100);
    // A member at the same meeting is now turned away too, until the window passes.
    expect((await client(t).post('/api/auth/sign-in').send({ email: s.admin.email, password: PASSWORD })).status).toBe(429);
    // Leave the address clean for the test files that follow.
    await em.nativeDelete(SignInFailure, { address: { $like: '%127.0.0.1' } });
  });

  it('serves the OpenAPI document', async () => {
    const res = await request(t.http).get('/api/docs-json');
    expect(res.status).toBe(200);
    expect(Object.keys(res.body.paths)).toContain('/api/auth/sign-in');
  });
});
