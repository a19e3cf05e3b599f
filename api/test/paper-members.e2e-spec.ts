import { monthsFrom } from '../src/bees/rotation';
import { DuesPayment } from '../src/dues/dues-payment.entity';
import { todayIn } from '../src/dues/dues-rules';
import { Membership } from '../src/guilds/membership.entity';
import { OutboxMessage } from '../src/outbox/outbox-message.entity';
import { BeesScheduler } from '../src/rounds/bees-scheduler.service';
import { RoundBlock } from '../src/rounds/round-block.entity';
import { Round } from '../src/rounds/round.entity';
import { User } from '../src/users/user.entity';
import { createBee, roundInput, type BeeSetup } from './bees-helpers';
import { client, createScenario, createTestApp, pdfText, signIn, type TestApp } from './helpers';
import { setUpShow, signedInMembers } from './shows-helpers';

type Agent = Awaited<ReturnType<typeof signIn>>;

/**
 * Members kept on paper (no e-mail, no password): an officer adds her, and every officer who acts for
 * her (dues, bee blocks, show entries) is on the record; the printed roster and bee schedule. Real MariaDB.
 */
describe('members kept on paper', () => {
  let t: TestApp;
  let s: Awaited<ReturnType<typeof createScenario>>;
  let chair: Agent;
  let members: string;
  let mabelId: number;
  let noraId: number;
  let noraEmail: string;
  let bee: BeeSetup;
  const db = () => t.orm.em.fork();
  const count = async (sql: string) => Number((await db().getConnection().execute<{ n: number }[]>(sql))[0].n);

  beforeAll(async () => {
    t = await createTestApp();
    s = await createScenario(t);
    chair = await signIn(t, s.membershipChair.email);
    members = `/api/guilds/${s.guild.id}/members`;
    noraEmail = `nora.${s.tag}@test.example`;
  });
  afterAll(() => t.close());

  it('adds a member with no e-mail address: no account to sign in with, an active membership from the day given', async () => {
    const res = await chair
      .post(members)
      .send({ name: '  Mabel Thornbury ', phone: '555 0199', town: 'Little Wrenfield', memberSince: '2019-09-01', showPhone: true, showTown: false })
      .expect(201);
    expect(res.body).toMatchObject({ name: 'Mabel Thornbury', email: null, signsIn: false, phone: '555 0199', town: 'Little Wrenfield', status: 'active', roles: [] });
    mabelId = res.body.membershipId;
    const m = await db().findOneOrFail(Membership, mabelId, { populate: ['user', 'user.passwordHash'] });
    expect(m.user.email).toBeNull();
    expect(m.user.passwordHash).toBeNull();
    expect(m.joinedAt.toISOString().slice(0, 10)).toBe('2019-09-01');
    expect(m.guild.id).toBe(s.guild.id);

    // One with an e-mail address, to be invited later; she cannot sign in until she chooses a password.
    const nora = await chair.post(members).send({ name: 'Nora Pilkington', email: noraEmail.toUpperCase(), phone: '555 0123', town: 'Saltmere', showTown: true }).expect(201);
    expect(nora.body).toMatchObject({ email: noraEmail, signsIn: false });
    noraId = nora.body.membershipId;
    const attempt = await client(t).post('/api/auth/sign-in').send({ email: noraEmail, password: 'any-password-at-all' });
    expect(attempt.status).toBe(401);

    const list = (await chair.get(members).expect(200)).body as { membershipId: number; signsIn: boolean; email: string | null }[];
    expect(list.find((r) => r.membershipId === mabelId)).toMatchObject({ email: null, signsIn: false });
    expect(list.find((r) => r.membershipId === s.member.membership!.id)).toMatchObject({ signsIn: true });
  });

  it('refuses bad input with a clear 4xx and writes nothing', async () => {
    const users = () => count('SELECT COUNT(*) AS n FROM users');
    const memberships = () => count('SELECT COUNT(*) AS n FROM memberships');
    const before = [await users(), await memberships()];
    const noName = await chair.post(members).send({ phone: '555 0100' }).expect(400);
    expect(noName.body.errors.name).toEqual(['Enter her name.']);
    const blank = await chair.post(members).send({ name: '   ' }).expect(400);
    expect(blank.body.errors.name).toEqual(['Enter her name.']);
    const badEmail = await chair.post(members).send({ name: 'Ivy Marsh', email: 'ivy at home' }).expect(400);
    expect(badEmail.body.errors.email[0]).toMatch(/e-mail address/);
    const badPhone = await chair.post(members).send({ name: 'Ivy Marsh', phone: 'call the shop' }).expect(400);
    expect(badPhone.body.errors.phone[0]).toMatch(/phone number/);
    const future = await chair.post(members).send({ name: 'Ivy Marsh', memberSince: '2999-01-01' }).expect(400);
    expect(future.body.errors.memberSince).toEqual(['The date she joined cannot be after today.']);
    const unreal = await chair.post(members).send({ name: 'Ivy Marsh', memberSince: '2021-02-30' }).expect(400);
    expect(unreal.body.errors.memberSince).toEqual(['That date does not exist.']);
    const long = await chair.post(members).send({ name: 'x'.repeat(121) }).expect(400);
    expect(long.body.errors.name).toEqual(['Use at most 120 characters.']);
    const account = await chair.post(members).send({ name: 'Loner', email: s.loner.email }).expect(409);
    expect(account.body.message).toBe(`${s.loner.email} already has an account; invite her instead.`);
    const already = await chair.post(members).send({ name: 'Member', email: s.member.email }).expect(409);
    expect(already.body.message).toBe(`${s.member.email} is already a member of ${s.guild.name}.`);
    // Only the roster officers may add members.
    await (await signIn(t, s.member.email)).post(members).send({ name: 'Ivy Marsh' }).expect(403);
    await (await signIn(t, s.treasurer.email)).post(members).send({ name: 'Ivy Marsh' }).expect(403);
    expect([await users(), await memberships()]).toEqual(before);
  });

  it('lets the officers keep her details, but not those of a member who signs in', async () => {
    const url = (id: number) => `${members}/${id}/details`;
    const changed = await chair.patch(url(mabelId)).send({ phone: '555 0198' }).expect(200);
    expect(changed.body).toMatchObject({ phone: '555 0198', town: 'Little Wrenfield', email: null });
    const own = await chair.patch(url(s.member.membership!.id)).send({ phone: '555 0000' }).expect(409);
    expect(own.body.message).toBe('She keeps her own details on her profile page.');
    const taken = await chair.patch(url(mabelId)).send({ email: s.treasurer.email }).expect(409);
    expect(taken.body.message).toMatch(/another account/);
    await chair.patch(url(mabelId)).send({ name: '' }).expect(400);
    await chair.patch(url(999999)).send({ phone: '555 0000' }).expect(404);
    const m = await db().findOneOrFail(User, { name: 'Mabel Thornbury', email: null });
    expect(m.phone).toBe('555 0198');
    expect(m.email).toBeNull();
  });

  it('lets the treasurer record her cash dues, recorded as hers', async () => {
    const treasurer = await signIn(t, s.treasurer.email);
    const dues = `/api/guilds/${s.guild.id}/dues`;
    const plan = await treasurer.post(`${dues}/plans`).send({ name: 'Regular', kind: 'standard', yearlyCents: 3000 }).expect(201);
    const today = todayIn(s.guild.timeZone);
    const paid = await treasurer.post(`${dues}/payments`).send({ membershipId: mabelId, planId: plan.body.id, method: 'cash', amountCents: 3000, receivedOn: today }).expect(201);
    expect(paid.body).toMatchObject({ status: 'paid', method: 'cash', memberName: 'Mabel Thornbury', recordedBy: s.treasurer.user.name });
    const payment = await db().findOneOrFail(DuesPayment, { invoice: paid.body.id });
    expect(payment.recordedBy?.id).toBe(s.treasurer.membership!.id);
    // The receipt is not mailed to a member with no address.
    expect(await db().count(OutboxMessage, { idempotencyKey: `receipt:${paid.body.id}` })).toBe(0);
  });

  it('lets the organiser add her to a bee, and the queen and organiser mark her block, on the record', async () => {
    bee = await createBee(t, s);
    const base = `/api/guilds/${s.guild.id}/bees/${bee.beeId}`;
    // Members who sign in are invited, never added.
    const signsIn = await bee.organiser.post(`${base}/members`).send({ membershipIds: [noraId, s.membershipChair.membership!.id] });
    expect(signsIn.status).toBe(409);
    expect(signsIn.body.message).toMatch(/invite her instead/);
    // Only the organiser.
    await bee.agents.get(s.admin.membership!.id)!.post(`${base}/members`).send({ membershipIds: [mabelId] }).expect(403);
    const detailBefore = (await bee.organiser.get(base).expect(200)).body;
    expect(detailBefore.addable.map((m: { membershipId: number }) => m.membershipId)).toEqual(expect.arrayContaining([mabelId]));
    const added = await bee.organiser.post(`${base}/members`).send({ membershipIds: [mabelId] }).expect(201);
    expect(added.body.members).toEqual(expect.arrayContaining([{ membershipId: mabelId, name: 'Mabel Thornbury', status: 'active', onPaper: true }]));
    expect(added.body.addable.map((m: { membershipId: number }) => m.membershipId)).not.toContain(mabelId);
    // Adding her again changes nothing.
    await bee.organiser.post(`${base}/members`).send({ membershipIds: [mabelId] }).expect(201);

    // A month after this one whose queen signs in; the organiser sets and publishes the round.
    const rotation = added.body.rotation as { month: string; skipped: boolean; queen: { membershipId: number; name: string } | null }[];
    const slot = rotation.find((r) => r.month >= bee.next && !r.skipped && r.queen && r.queen.membershipId !== mabelId && r.queen.membershipId !== s.member.membership!.id)!;
    const month = slot.month;
    const queen = bee.agents.get(slot.queen!.membershipId)!;
    const rounds = `${base}/rounds/${month}`;
    await bee.organiser.put(rounds).send(roundInput({ title: 'Paper star', dueDate: `${monthsFrom(month, 2)[1]}-20` })).expect(200);
    await bee.organiser.post(`${rounds}/publish`).send({}).expect(200);
    const round = await db().findOneOrFail(Round, { bee: bee.beeId, month });
    await t.app.get(BeesScheduler).tick(new Date(round.sendAt.getTime() + 60_000));
    const block = await db().findOneOrFail(RoundBlock, { round: round.id, maker: mabelId });
    expect(block.status).toBe('not_started');
    // Every maker who signs in got the assignment; she, with no address, got nothing.
    expect(await db().count(OutboxMessage, { idempotencyKey: `round-assignment:${round.id}:${mabelId}` })).toBe(0);
    expect(await db().count(OutboxMessage, { idempotencyKey: { $like: `round-assignment:${round.id}:%` } })).toBeGreaterThan(0);

    // The queen marks the paper maker's block made, on her behalf; she still cannot mark a maker who signs in.
    const made = await queen.patch(`${rounds}/blocks/${mabelId}`).send({ status: 'made' }).expect(200);
    expect(made.body).toMatchObject({ status: 'made', updatedOnBehalf: true, updatedByName: slot.queen!.name, onPaper: true });
    const other = [s.admin, s.treasurer, s.membershipChair, s.showChair].map((p) => p.membership!.id).find((id) => id !== slot.queen!.membershipId)!;
    await queen.patch(`${rounds}/blocks/${other}`).send({ status: 'made' }).expect(403);
    // The organiser marks it handed over; the grid says who did it.
    await bee.organiser.patch(`${rounds}/blocks/${mabelId}`).send({ status: 'handed_over' }).expect(200);
    const grid = (await queen.get(rounds).expect(200)).body;
    const row = grid.blocks.find((b: { membershipId: number }) => b.membershipId === mabelId);
    expect(row).toMatchObject({ status: 'handed_over', updatedOnBehalf: true, updatedByName: s.member.user.name, onPaper: true });
    const stored = await db().findOneOrFail(RoundBlock, { round: round.id, maker: mabelId });
    expect(stored.updatedBy?.id).toBe(s.member.user.id);
    expect(stored.onBehalf).toBe(true);
  });

  it('lets the show chair enter a quilt for her, on the record', async () => {
    const showChair = await signIn(t, s.showChair.email);
    const list = (await showChair.get(members).expect(200)).body as { membershipId: number; name: string }[];
    expect(list.map((m) => m.membershipId)).toContain(mabelId);
    const { showId, medium } = await setUpShow(showChair, s.guild.id);
    const entry = await showChair
      .post(`/api/guilds/${s.guild.id}/shows/${showId}/entries`)
      .send({ categoryId: medium, title: 'Hedgerow Medallion', widthIn: '50', heightIn: '60', makers: ['Mabel Thornbury'], onBehalfOf: mabelId })
      .expect(201);
    expect(entry.body).toMatchObject({ enteredOnBehalf: true, enteredBy: s.showChair.user.name });
    expect(entry.body.entrant).toMatchObject({ name: 'Mabel Thornbury' });
  });

  it('prints the roster with only what the reader may see', async () => {
    const url = `/api/guilds/${s.guild.id}/roster.pdf`;
    const plain = await (await signIn(t, s.member.email)).get(url).buffer(true).parse(binary).expect(200);
    expect(plain.headers['content-type']).toBe('application/pdf');
    const seen = pdfText(plain.body as Buffer).replace(/\s+/g, ' ');
    expect(seen).toContain('For members only — please do not share');
    expect(seen).toContain(s.guild.name);
    expect(seen).toContain('Mabel Thornbury');
    expect(seen).toContain('555 0198'); // she shows her phone
    expect(seen).not.toContain('Little Wrenfield'); // but not her town
    expect(seen).toContain('Nora Pilkington');
    expect(seen).toContain('Saltmere');
    expect(seen).not.toContain('555 0123');
    expect(seen).not.toMatch(looseEmail(noraEmail));
    expect(seen).not.toMatch(looseEmail(s.treasurer.email));
    expect(seen).not.toContain('@');

    const officer = await chair.get(`${url}?paper=a4`).buffer(true).parse(binary).expect(200);
    const all = pdfText(officer.body as Buffer).replace(/\s+/g, ' ');
    for (const text of ['Little Wrenfield', '555 0198', '555 0123']) expect(all).toContain(text);
    for (const email of [noraEmail, s.treasurer.email]) expect(all).toMatch(looseEmail(email));
    await chair.get(`${url}?paper=folio`).expect(400);
    await client(t).get(url).expect(401);
    await (await signIn(t, s.outsider.email)).get(url).expect(404);
  });

  it('prints the bee schedule with the months and their queens, for the bee and the officers only', async () => {
    const url = `/api/guilds/${s.guild.id}/bees/${bee.beeId}/schedule.pdf`;
    const detail = (await bee.organiser.get(`/api/guilds/${s.guild.id}/bees/${bee.beeId}`).expect(200)).body;
    const res = await bee.organiser.get(url).buffer(true).parse(binary).expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = pdfText(res.body as Buffer).replace(/\s+/g, ' ');
    expect(text).toContain(detail.name);
    expect(text).toContain('Mabel Thornbury');
    for (const r of detail.rotation as { month: string; skipped: boolean; queen: { name: string } | null }[]) {
      const label = new Date(`${r.month}-15T12:00:00Z`).toLocaleString('en-US', { month: 'long', year: 'numeric', timeZone: 'UTC' });
      expect(text).toContain(r.skipped ? `${label} — skipped` : `${label} — Queen: ${r.queen!.name}`);
    }
    expect(text).toContain('Block: Paper star');
    expect(text).toContain('Mail it to: 1 Test Lane Testville');
    // An officer outside the bee may print it; a plain member outside it may not.
    await (await signIn(t, s.loner.email)).get(url).expect(404);
    const [outsideMember] = await signedInMembers(t, s.guild.id, s.tag, 1);
    const refused = await outsideMember.get(url).expect(403);
    expect(refused.body.message).toMatch(/makers and the guild's officers/);
  });

  it('never queued an e-mail for a member with no address', async () => {
    const conn = db().getConnection();
    const bad = await conn.execute<{ n: number }[]>("SELECT COUNT(*) AS n FROM outbox_messages WHERE to_address NOT LIKE '%@%'");
    expect(Number(bad[0].n)).toBe(0);
    const beeMember = await conn.execute<{ id: number }[]>('SELECT id FROM bee_members WHERE membership_id = ?', [mabelId]);
    const keys = [`bee-invitation:${beeMember[0].id}:%`, `round-assignment:%:${mabelId}`, `due-reminder:%:${mabelId}`, `round-changed:%:${mabelId}`];
    for (const key of keys) expect(await db().count(OutboxMessage, { idempotencyKey: { $like: key } })).toBe(0);
  });
});

/**
 * An e-mail address as pdftotext reads it back: it sometimes loses a full stop drawn in these fonts
 * (the glyph is printed; only the text extraction drops it), so a full stop may read as a space or nothing.
 */
const looseEmail = (email: string) => new RegExp(email.replace(/[-[\]{}()*+?^$|\\]/g, '\\$&').replace(/\./g, '[. ]?'));

/** Collects a response body as bytes (supertest's parser for a PDF). */
const binary = (r: NodeJS.EventEmitter, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  r.on('data', (c: Buffer) => chunks.push(c));
  r.on('end', () => cb(null, Buffer.concat(chunks)));
};
