import { DuesInvoice } from '../src/dues/dues-invoice.entity';
import { MoneyAuditEntry } from '../src/dues/money-audit.entity';
import { Membership } from '../src/guilds/membership.entity';
import { FileStore } from '../src/storage/file-store';
import { User } from '../src/users/user.entity';
import { client, createScenario, createTestApp, PASSWORD, signIn, TestApp } from './helpers';
import { setUpShow } from './shows-helpers';

type Scenario = Awaited<ReturnType<typeof createScenario>>;

describe('leaving a guild and erasing a departed member (real MariaDB)', () => {
  let t: TestApp;
  let s: Scenario;

  beforeAll(async () => {
    t = await createTestApp();
    s = await createScenario(t);
  });
  afterAll(() => t.close());

  const base = () => `/api/guilds/${s.guild.id}`;

  async function invoice(membershipId: number, status: 'open' | 'paid', totalCents: number) {
    const em = t.orm.em.fork();
    const inv = em.create(DuesInvoice, {
      guild: s.guild.id,
      membership: membershipId,
      planName: 'Standard',
      yearLabel: '2026',
      lines: [{ kind: 'dues' as const, label: 'Dues 2026', amountCents: totalCents }],
      totalCents,
      currency: 'USD',
      status,
      ...(status === 'paid' ? { paidAt: new Date(), paidOn: '2026-01-05', method: 'cash' as const, receiptNumber: `R-${membershipId}-${totalCents}` } : {}),
    });
    await em.flush();
    return inv.id;
  }

  it('a member leaves from her profile, asking to be erased; an officer in office cannot leave until handed on', async () => {
    const member = await signIn(t, s.member.email);
    const left = await member.post(`${base()}/leave`).send({ eraseRequest: true });
    expect(left.status).toBe(200);
    expect(left.body).toMatchObject({ status: 'left' });
    expect(left.body.eraseRequestedAt).toBeTruthy();
    // Gone from the guild's pages, still signed in to her account.
    expect((await member.get(base())).status).toBe(404);
    expect((await member.get('/api/dashboard')).status).toBe(200);
    expect((await member.post(`${base()}/leave`).send({})).status).toBe(404);

    const treasurer = await signIn(t, s.treasurer.email);
    const refused = await treasurer.post(`${base()}/leave`).send({});
    expect(refused.status).toBe(409);
    expect(refused.body.message).toMatch(/Treasurer.*hand the office on/);
    expect((await treasurer.post(`${base()}/leave`).send({ eraseRequest: 'yes' })).status).toBe(400);
  });

  it('refuses to erase a member with unpaid invoices, naming them, and changes nothing', async () => {
    const admin = await signIn(t, s.admin.email);
    const m = s.member.membership!.id;
    const open = await invoice(m, 'open', 3000);
    const plan = await admin.get(`${base()}/members/${m}/erasure`).expect(200);
    expect(plan.body.refusals.map((r: { code: string }) => r.code)).toEqual(['unpaid_invoices']);
    const refused = await admin.post(`${base()}/members/${m}/erasure`).send({ confirm: true });
    expect(refused.status).toBe(409);
    expect(refused.body.message).toBe('She has an unpaid invoice (2026 dues $30.00). The treasurer must record the payment or void it first, so the books stay whole.');
    const user = await t.orm.em.fork().findOneOrFail(User, { id: s.member.user.id });
    expect(user).toMatchObject({ email: s.member.email, name: s.member.user.name, erasedAt: null });
    // The treasurer voids it; now the erasure may go ahead.
    await t.orm.em.fork().nativeUpdate(DuesInvoice, { id: open }, { status: 'void', voidedAt: new Date() });
  });

  it('refuses bad requests: no confirmation, a member still in the guild, someone from another guild, a plain member asking', async () => {
    const admin = await signIn(t, s.admin.email);
    const m = s.member.membership!.id;
    const unconfirmed = await admin.post(`${base()}/members/${m}/erasure`).send({});
    expect(unconfirmed.status).toBe(400);
    expect(unconfirmed.body.errors.confirm[0]).toMatch(/Tick the box/);
    const stillHere = await admin.post(`${base()}/members/${s.showChair.membership!.id}/erasure`).send({ confirm: true });
    expect(stillHere.status).toBe(409);
    expect(stillHere.body.message).toMatch(/still a member. Record that she has left first/);
    expect((await admin.get(`${base()}/members/${s.outsider.membership!.id}/erasure`)).status).toBe(404);
    expect((await admin.get(`${base()}/members/abc/erasure`)).status).toBe(404);
    const chair = await signIn(t, s.membershipChair.email);
    expect((await chair.post(`${base()}/members/${m}/erasure`).send({ confirm: true })).status).toBe(403);
  });

  it('erases her personal data in one go and keeps every money record under the record name', async () => {
    const admin = await signIn(t, s.admin.email);
    const m = s.member.membership!.id;
    const paid = await invoice(m, 'paid', 2500);
    // A show entry she made with a friend, with a photo on disk.
    const chair = await signIn(t, s.showChair.email);
    const { showId, medium } = await setUpShow(chair, s.guild.id);
    const files = t.app.get(FileStore);
    const photo = await files.put(Buffer.from('photo bytes'));
    // Entered before she left (she has gone now, so the row goes in directly), with a friend as co-maker.
    const em = t.orm.em.fork();
    await em.getConnection().execute(
      "INSERT INTO show_entries (created_at, updated_at, show_id, category_id, membership_id, title, width_mm, height_mm, makers, quilter, techniques, story, for_sale, status) VALUES (NOW(3), NOW(3), ?, ?, ?, 'Sunday Best', 1270, 1524, ?, ?, '', 'Made for my granddaughter.', 0, 'submitted')",
      [showId, medium, m, JSON.stringify([s.member.user.name, 'Rosa Friend']), s.member.user.name],
    );
    const entryId = Number((await em.getConnection().execute('SELECT MAX(id) AS id FROM show_entries WHERE show_id = ?', [showId]))[0].id);
    await em.getConnection().execute('UPDATE show_entries SET photo_key = ? WHERE id = ?', [photo, entryId]);
    const member = await signIn(t, s.member.email).catch(() => null);
    expect(member).not.toBeNull();

    const done = await admin.post(`${base()}/members/${m}/erasure`).send({ confirm: true });
    expect(done.status).toBe(200);
    expect(done.body).toMatchObject({ membershipId: m, name: `Former member ${m}`, photosRemoved: 1, showEntriesChanged: 1 });

    const after = await t.orm.em.fork().findOneOrFail(User, { id: s.member.user.id }, { populate: ['passwordHash'] });
    expect(after).toMatchObject({ name: `Former member ${m}`, email: null, passwordHash: null, phone: null, town: null, showEmail: false });
    expect(after.erasedAt).toBeInstanceOf(Date);
    // She is signed out everywhere and cannot sign in again.
    expect((await member!.get('/api/dashboard')).status).toBe(401);
    expect((await client(t).post('/api/auth/sign-in').send({ email: s.member.email, password: PASSWORD })).status).toBe(401);
    // Money: the paid invoice is untouched, amounts and receipt number intact; the log says what happened without her name.
    const inv = await t.orm.em.fork().findOneOrFail(DuesInvoice, { id: paid });
    expect(inv).toMatchObject({ status: 'paid', totalCents: 2500, receiptNumber: `R-${m}-2500` });
    const log = await t.orm.em.fork().find(MoneyAuditEntry, { guild: s.guild.id, action: 'member_erased' });
    expect(log).toHaveLength(1);
    expect(log[0].summary).not.toContain(s.member.user.name);
    expect(log[0].actorName).toBe(s.admin.user.name);
    // Her show entry keeps its title and her friend's name; her name, story and photo are gone.
    const [row] = await t.orm.em.fork().getConnection().execute('SELECT title, makers, quilter, story, photo_key FROM show_entries WHERE id = ?', [entryId]);
    const makers = typeof row.makers === 'string' ? JSON.parse(row.makers) : row.makers;
    expect(row).toMatchObject({ title: 'Sunday Best', quilter: `Former member ${m}`, story: '', photo_key: null });
    expect(makers).toEqual([`Former member ${m}`, 'Rosa Friend']);
    await expect(files.get(photo)).rejects.toThrow();
    // The directory shows the record name to officers; nothing of hers is left to find by e-mail.
    const roster = await admin.get(`${base()}/members`).expect(200);
    expect(JSON.stringify(roster.body)).not.toContain(s.member.email);
    expect(roster.body.find((r: { membershipId: number }) => r.membershipId === m)).toMatchObject({ name: `Former member ${m}`, status: 'left', email: null });
    // Doing it again is refused.
    const again = await admin.post(`${base()}/members/${m}/erasure`).send({ confirm: true });
    expect(again.status).toBe(409);
    expect(again.body.message).toBe('Her personal data was already erased.');
  });

  it('an officer records a departure for a member who told her; she is then refused if still a member of another guild', async () => {
    const chair = await signIn(t, s.membershipChair.email);
    const em = t.orm.em.fork();
    const both = await em.findOneOrFail(User, { id: s.outsider.user.id });
    const here = em.create(Membership, { user: both, guild: s.guild.id, roles: [] });
    await em.flush();
    const recorded = await chair.post(`${base()}/members/${here.id}/departure`).send({});
    expect(recorded.status).toBe(200);
    expect(recorded.body.status).toBe('left');
    expect((await chair.post(`${base()}/members/${here.id}/departure`).send({})).status).toBe(409);
    expect((await chair.post(`${base()}/members/${s.membershipChair.membership!.id}/departure`).send({})).status).toBe(409);
    const admin = await signIn(t, s.admin.email);
    const refused = await admin.post(`${base()}/members/${here.id}/erasure`).send({ confirm: true });
    expect(refused.status).toBe(409);
    expect(refused.body.message).toContain(`still a member of ${s.otherGuild.name}`);
    expect((await t.orm.em.fork().findOneOrFail(User, { id: both.id })).email).toBe(s.outsider.email);
  });
});
