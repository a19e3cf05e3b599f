import request from 'supertest';
import { Invitation } from '../src/invitations/invitation.entity';
import { client, createScenario, createTestApp, ORIGIN, signIn, TestApp } from './helpers';

describe('bad input gets a clear 4xx and writes nothing (real MariaDB)', () => {
  let t: TestApp;
  let s: Awaited<ReturnType<typeof createScenario>>;

  beforeAll(async () => {
    t = await createTestApp();
    s = await createScenario(t);
  });
  afterAll(() => t.close());

  it('answers malformed JSON with 400 and a plain message', async () => {
    const res = await request(t.http)
      .post('/api/auth/sign-in')
      .set('Origin', ORIGIN)
      .set('Content-Type', 'application/json')
      .send('{"email": "x@y.org", ');
    expect(res.status).toBe(400);
    expect(res.body.message).toBe('The request body is not valid JSON.');
  });

  it('keys wrong types, unknown fields and over-long strings by field', async () => {
    const admin = await signIn(t, s.admin.email);
    const url = `/api/guilds/${s.guild.id}/invitations`;
    const cases: [unknown, string][] = [
      [{ email: 42 }, 'email'],
      [{ email: 'ok@test.example', roles: 'admin' }, 'roles'],
      [{ email: 'ok@test.example', roles: ['admin', 'queen'] }, 'roles'],
      [{ email: 'ok@test.example', isAdmin: true }, 'isAdmin'],
      [{ email: `${'a'.repeat(250)}@test.example` }, 'email'],
      [{}, 'email'],
    ];
    for (const [body, field] of cases) {
      const res = await admin.post(url).send(body as object);
      expect(res.status).toBe(400);
      expect(res.body.message).toBe('Please check the highlighted fields.');
      expect(Object.keys(res.body.errors)).toContain(field);
    }
    const arrayBody = await admin.post(url).send([{ email: 'ok@test.example' }]);
    expect(arrayBody.status).toBe(400);
    expect(await t.orm.em.fork().count(Invitation, { guild: s.guild.id })).toBe(0);
  });

  it('refuses an over-long name and a too-short password on the profile', async () => {
    const agent = await signIn(t, s.member.email);
    const long = await agent.patch('/api/profile').send({ name: 'x'.repeat(121) });
    expect(long.status).toBe(400);
    expect(long.body.errors.name).toEqual(['Use at most 120 characters.']);
    const short = await agent.post('/api/profile/password').send({ currentPassword: 'x', newPassword: 'short' });
    expect(short.body.errors.newPassword[0]).toMatch(/at least 10 characters/);
  });

  it('validates the sign-in form before checking any password', async () => {
    const res = await client(t).post('/api/auth/sign-in').send({ email: 'not-an-address', password: '', remember: 'yes' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.errors).sort()).toEqual(['email', 'password', 'remember']);
    const extra = await client(t).post('/api/auth/sign-in').send({ email: s.member.email, password: 'x', admin: true });
    expect(extra.status).toBe(400);
  });

  it('rejects a body that is far too large with 413', async () => {
    const res = await client(t)
      .post('/api/auth/forgot-password')
      .send({ email: 'a@b.org', padding: 'x'.repeat(200_000) });
    expect(res.status).toBe(413);
  });

  it('refuses null where a field can only be left out, and names of spaces only, without a 500', async () => {
    const admin = await signIn(t, s.admin.email);
    const g = `/api/guilds/${s.guild.id}`;
    const bee = (await admin.post(`${g}/bees`).send({ name: 'Tuesday Bee', handover: 'mail', startMonth: '2031-01', months: 6 }).expect(201)).body;
    for (const field of ['name', 'description', 'handover']) {
      const r = await admin.patch(`${g}/bees/${bee.id}`).send({ [field]: null });
      expect([r.status, field, Object.keys(r.body.errors ?? {})]).toEqual([400, field, [field]]);
    }
    await admin.patch(`${g}/bees/${bee.id}`).send({ name: '   ' }).expect(400);
    expect((await admin.get(`${g}/bees/${bee.id}`).expect(200)).body.name).toBe('Tuesday Bee');

    const paper = (await admin.post(`${g}/members`).send({ name: 'Nell Quarry' }).expect(201)).body;
    const memberId = paper.membershipId ?? paper.id;
    for (const field of ['name', 'showPhone', 'showTown', 'showEmail']) {
      const r = await admin.patch(`${g}/members/${memberId}/details`).send({ [field]: null });
      expect([r.status, field]).toEqual([400, field]);
    }
    await admin.patch(`${g}/members/${memberId}/details`).send({ name: '  ' }).expect(400);

    await admin.post('/api/guilds').send({ name: '   ', town: '   ', timeZone: 'America/Chicago', currency: 'USD', unit: 'in' }).expect(400);
    const member = await signIn(t, s.member.email);
    await member.patch('/api/profile').send({ name: '   ' }).expect(400);
    expect((await member.get('/api/profile').expect(200)).body.name).toBe(s.member.user.name);

    // The layout planner: a null inch field is "not given", a word is a 400.
    const layout = { blockCount: 12, blockWidth: '12 1/2', blockHeight: '12 1/2' };
    await member.post('/api/layout-plans').send({ ...layout, sashing: null, bindingWidth: null }).expect(200);
    expect((await member.post('/api/layout-plans').send({ ...layout, sashing: 'wide' }).expect(400)).body.message).toBeTruthy();

    // Bodies that are not forms.
    const list = await client(t).post('/api/auth/sign-in').send([{ email: 'x@y.org' }]).expect(400);
    expect(list.body.message).toContain('JSON object');
  });

  it('answers unknown API paths with a JSON 404, not the web app', async () => {
    const res = await request(t.http).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.statusCode).toBe(404);
  });
});
