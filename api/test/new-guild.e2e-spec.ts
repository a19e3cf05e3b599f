import { client, createScenario, createTestApp, signIn, type TestApp } from './helpers';

/** A new guild's first minutes: anyone signed in starts one and becomes its admin (real MariaDB). */
describe('starting a new guild', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const good = { name: 'Fernhollow Quilters', town: 'Fernhollow', timeZone: 'Europe/London', currency: 'GBP', unit: 'cm', yearStartMonth: 9 };

  it('creates the guild with her as its admin, and it shows on her dashboard', async () => {
    const s = await createScenario(t);
    const loner = await signIn(t, s.loner.email);
    const res = await loner.post('/api/guilds').send(good).expect(201);
    expect(res.body).toMatchObject({ name: 'Fernhollow Quilters', town: 'Fernhollow', timeZone: 'Europe/London', currency: 'GBP', unit: 'cm', yearStartMonth: 9, myRoles: ['admin'] });
    const guild = (await loner.get(`/api/guilds/${res.body.id}`).expect(200)).body;
    expect(guild.myRoles).toEqual(['admin']);
    const members = (await loner.get(`/api/guilds/${res.body.id}/members`).expect(200)).body;
    expect(members).toEqual([expect.objectContaining({ name: s.loner.user.name, roles: ['admin'] })]);
    const dashboard = (await loner.get('/api/dashboard').expect(200)).body;
    expect(dashboard.guilds.map((g: { id: number }) => g.id)).toContain(res.body.id);
    // Nobody else is in it.
    const other = await signIn(t, s.member.email);
    await other.get(`/api/guilds/${res.body.id}`).expect(404);
  });

  it('refuses bad settings field by field and writes nothing', async () => {
    const s = await createScenario(t);
    const agent = await signIn(t, s.loner.email);
    const before = await t.orm.em.fork().getConnection().execute<{ n: number }[]>('SELECT COUNT(*) AS n FROM guilds');
    const bad = await agent.post('/api/guilds').send({ name: 'X', town: '', timeZone: 'Mars/Olympus', currency: 'XYZW', unit: 'yards', yearStartMonth: 13 }).expect(400);
    expect(Object.keys(bad.body.errors).sort()).toEqual(['currency', 'name', 'timeZone', 'town', 'unit', 'yearStartMonth']);
    expect(bad.body.errors.timeZone).toEqual(['Choose the time zone from the list, like America/Chicago.']);
    await agent.post('/api/guilds').send('not json').set('Content-Type', 'application/json').expect(400);
    const after = await t.orm.em.fork().getConnection().execute<{ n: number }[]>('SELECT COUNT(*) AS n FROM guilds');
    expect(Number(after[0].n)).toBe(Number(before[0].n));
    await client(t).post('/api/guilds').send(good).expect(401);
  });

  it('lets one person start at most 5 guilds a day', async () => {
    const s = await createScenario(t);
    const agent = await signIn(t, s.loner.email);
    for (let i = 0; i < 5; i++) await agent.post('/api/guilds').send({ ...good, name: `Circle ${i}` }).expect(201);
    const sixth = await agent.post('/api/guilds').send({ ...good, name: 'Circle 6' }).expect(409);
    expect(sixth.body.message).toBe('You have started 5 guilds today. Please try again tomorrow.');
  });

  it('lets the admin hand the admin role on and step down, but never leaves the guild without one', async () => {
    const s = await createScenario(t);
    const admin = await signIn(t, s.admin.email);
    const base = `/api/guilds/${s.guild.id}/members`;
    const last = await admin.patch(`${base}/${s.admin.membership!.id}/roles`).send({ roles: [] }).expect(409);
    expect(last.body.message).toMatch(/admin/);
    await admin.patch(`${base}/${s.member.membership!.id}/roles`).send({ roles: ['admin'] }).expect(200);
    await admin.patch(`${base}/${s.admin.membership!.id}/roles`).send({ roles: [] }).expect(200);
    // She is a plain member now: roles are no longer hers to change.
    await admin.patch(`${base}/${s.member.membership!.id}/roles`).send({ roles: [] }).expect(403);
  });
});
