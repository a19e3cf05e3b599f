import { DateTime } from 'luxon';
import { todayIn } from '../src/dues/dues-rules';
import { Membership } from '../src/guilds/membership.entity';
import { OfficeTerm } from '../src/offices/office-term.entity';
import { OfficesService } from '../src/offices/offices.service';
import { createScenario, createTestApp, signIn, type TestApp } from './helpers';

/** Offices with terms: access follows the dates, handovers, overlaps and the last admin (real MariaDB). */
describe('offices and terms', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  // createScenario's guilds use the default zone.
  const today = () => todayIn('America/Chicago');
  const day = (offset: number) => DateTime.fromISO(today()).plus({ days: offset }).toISODate()!;
  const rolesOf = async (membershipId: number) => (await t.orm.em.fork().findOneOrFail(Membership, membershipId)).roles;
  const treasurerRoute = (guildId: number) => `/api/guilds/${guildId}/dues/ledger`;

  it('takes away a treasurer whose term ended yesterday, even when nothing re-synced the roles', async () => {
    const s = await createScenario(t);
    const em = t.orm.em.fork();
    // Stored roles still say treasurer; her only term ended yesterday.
    const m = await em.findOneOrFail(Membership, s.member.membership!.id);
    m.roles = ['treasurer'];
    em.create(OfficeTerm, { guild: s.guild.id, membership: m, role: 'treasurer', startsOn: day(-60), endsOn: day(-1) });
    await em.flush();
    const member = await signIn(t, s.member.email);
    const res = await member.get(treasurerRoute(s.guild.id)).expect(403);
    expect(res.body.message).toMatch(/Treasurer/);
    expect(await rolesOf(s.member.membership!.id)).toEqual([]);
    // A term starting today counts at once, though nothing re-synced her stored roles.
    const em3 = t.orm.em.fork();
    em3.create(OfficeTerm, { guild: s.guild.id, membership: s.member.membership!.id, role: 'show_chair', startsOn: today() });
    await em3.flush();
    await member.post(`/api/guilds/${s.guild.id}/shows`).send({}).expect(400);
    expect((await member.get(`/api/guilds/${s.guild.id}`).expect(200)).body.myRoles).toEqual(['show_chair']);
    // A term ending today is over today too.
    const em2 = t.orm.em.fork();
    em2.create(OfficeTerm, { guild: s.guild.id, membership: s.showChair.membership!.id, role: 'treasurer', startsOn: day(-5), endsOn: today() });
    await em2.flush();
    await (await signIn(t, s.showChair.email)).get(treasurerRoute(s.guild.id)).expect(403);
    // The treasurer of the scenario (roles without a term) keeps her office and gets an open term.
    await (await signIn(t, s.treasurer.email)).get(treasurerRoute(s.guild.id)).expect(200);
    const adopted = await t.orm.em.fork().find(OfficeTerm, { membership: s.treasurer.membership!.id });
    expect(adopted.map((x) => [x.role, x.startsOn, x.endsOn])).toEqual([['treasurer', today(), null]]);
  });

  it('gives a future term no access until its first day, then syncs it for the chosen day', async () => {
    const s = await createScenario(t);
    const admin = await signIn(t, s.admin.email);
    const created = await admin
      .post(`/api/guilds/${s.guild.id}/offices/terms`)
      .send({ membershipId: s.member.membership!.id, role: 'treasurer', startsOn: day(1), note: 'Elected at the meeting' })
      .expect(201);
    expect(created.body).toMatchObject({ role: 'treasurer', startsOn: day(1), endsOn: null, note: 'Elected at the meeting', recordedBy: { name: s.admin.user.name } });
    const member = await signIn(t, s.member.email);
    await member.get(treasurerRoute(s.guild.id)).expect(403);
    const offices = (await member.get(`/api/guilds/${s.guild.id}/offices`).expect(200)).body;
    const treasurer = offices.offices.find((o: { role: string }) => o.role === 'treasurer');
    expect(treasurer.holders.map((h: { name: string }) => h.name)).toEqual([s.treasurer.user.name]);
    expect(treasurer.upcoming).toEqual([expect.objectContaining({ name: s.member.user.name, startsOn: day(1) })]);
    await t.app.get(OfficesService).syncGuild(s.guild.id, day(1));
    expect(await rolesOf(s.member.membership!.id)).toEqual(['treasurer']);
    await t.app.get(OfficesService).syncGuild(s.guild.id, today());
    expect(await rolesOf(s.member.membership!.id)).toEqual([]);
  });

  it('moves access on the handover date and shows who recorded it in the history', async () => {
    const s = await createScenario(t);
    const admin = await signIn(t, s.admin.email);
    const base = `/api/guilds/${s.guild.id}/offices`;
    // Tomorrow: nothing changes today.
    const later = await admin
      .post(`${base}/handover`)
      .send({ role: 'treasurer', fromMembershipId: s.treasurer.membership!.id, toMembershipId: s.membershipChair.membership!.id, on: day(1) })
      .expect(200);
    expect(later.body.ended).toMatchObject({ name: s.treasurer.user.name, endsOn: day(1) });
    expect(later.body.started).toMatchObject({ name: s.membershipChair.user.name, startsOn: day(1), endsOn: null });
    await (await signIn(t, s.treasurer.email)).get(treasurerRoute(s.guild.id)).expect(200);
    await (await signIn(t, s.membershipChair.email)).get(treasurerRoute(s.guild.id)).expect(403);
    await t.app.get(OfficesService).syncGuild(s.guild.id, day(1));
    expect(await rolesOf(s.treasurer.membership!.id)).toEqual([]);
    expect(await rolesOf(s.membershipChair.membership!.id)).toEqual(['treasurer', 'membership_chair']);
    await t.app.get(OfficesService).syncGuild(s.guild.id, today());

    // Today: the show chair's access ends now and the member's begins.
    await admin
      .post(`${base}/handover`)
      .send({ role: 'show_chair', fromMembershipId: s.showChair.membership!.id, toMembershipId: s.member.membership!.id, on: today(), note: 'Thank you, Bea' })
      .expect(200);
    await (await signIn(t, s.showChair.email)).post(`/api/guilds/${s.guild.id}/shows`).send({}).expect(403);
    await (await signIn(t, s.member.email)).post(`/api/guilds/${s.guild.id}/shows`).send({}).expect(400);

    const member = await signIn(t, s.member.email);
    const history = (await member.get(`${base}/history`).expect(200)).body.terms as {
      name: string;
      role: string;
      startsOn: string;
      endsOn: string | null;
      note: string;
      recordedBy: { name: string } | null;
    }[];
    expect(history[0]).toMatchObject({ role: 'treasurer', name: s.membershipChair.user.name, startsOn: day(1), recordedBy: { name: s.admin.user.name } });
    expect(history).toContainEqual(
      expect.objectContaining({ role: 'show_chair', name: s.member.user.name, startsOn: today(), note: 'Thank you, Bea', recordedBy: expect.objectContaining({ name: s.admin.user.name }) }),
    );
    expect(history).toContainEqual(expect.objectContaining({ role: 'show_chair', name: s.showChair.user.name, endsOn: today() }));
    expect(history).toContainEqual(expect.objectContaining({ role: 'treasurer', name: s.treasurer.user.name, endsOn: day(1) }));

    // Nothing to hand over: the member holds no treasurer term; to herself; to someone who left.
    const none = await admin
      .post(`${base}/handover`)
      .send({ role: 'treasurer', fromMembershipId: s.admin.membership!.id, toMembershipId: s.member.membership!.id, on: day(3) })
      .expect(409);
    expect(none.body.message).toMatch(/holds no Treasurer term/);
    const self = await admin
      .post(`${base}/handover`)
      .send({ role: 'admin', fromMembershipId: s.admin.membership!.id, toMembershipId: s.admin.membership!.id, on: today() })
      .expect(400);
    expect(self.body.errors.toMembershipId).toEqual(['Choose someone other than the outgoing officer.']);
    const em = t.orm.em.fork();
    (await em.findOneOrFail(Membership, s.treasurer.membership!.id)).status = 'left';
    await em.flush();
    const gone = await admin
      .post(`${base}/handover`)
      .send({ role: 'admin', fromMembershipId: s.admin.membership!.id, toMembershipId: s.treasurer.membership!.id, on: today() })
      .expect(409);
    expect(gone.body.message).toMatch(/no longer an active member/);
    await admin
      .post(`${base}/handover`)
      .send({ role: 'admin', fromMembershipId: s.admin.membership!.id, toMembershipId: s.outsider.membership!.id, on: today() })
      .expect(404);
  });

  it('refuses overlapping terms and bad dates, and writes nothing', async () => {
    const s = await createScenario(t);
    const admin = await signIn(t, s.admin.email);
    const url = `/api/guilds/${s.guild.id}/offices/terms`;
    const count = () => t.orm.em.fork().count(OfficeTerm, { guild: s.guild.id });
    await admin.get(`/api/guilds/${s.guild.id}/offices`).expect(200);
    const before = await count();
    const overlap = await admin.post(url).send({ membershipId: s.treasurer.membership!.id, role: 'treasurer', startsOn: day(-10), endsOn: day(10) }).expect(409);
    expect(overlap.body.message).toMatch(/already holds Treasurer .* overlaps/);
    const bad = await admin.post(url).send({ membershipId: s.member.membership!.id, role: 'queen', startsOn: '2026-02-30', endsOn: 'soon', note: 'x'.repeat(301) }).expect(400);
    expect(Object.keys(bad.body.errors).sort()).toEqual(['endsOn', 'note', 'role', 'startsOn']);
    const backwards = await admin.post(url).send({ membershipId: s.member.membership!.id, role: 'treasurer', startsOn: day(5), endsOn: day(5) }).expect(400);
    expect(backwards.body.errors.endsOn).toEqual(['Access must end after the first day in office.']);
    await admin.post(url).send({ membershipId: s.outsider.membership!.id, role: 'treasurer', startsOn: day(0) }).expect(404);
    const past = await admin
      .post(`/api/guilds/${s.guild.id}/offices/handover`)
      .send({ role: 'treasurer', fromMembershipId: s.treasurer.membership!.id, toMembershipId: s.member.membership!.id, on: day(-1) })
      .expect(400);
    expect(past.body.errors.on[0]).toMatch(/today/);
    const rolesPast = await admin.patch(`/api/guilds/${s.guild.id}/members/${s.member.membership!.id}/roles`).send({ roles: ['treasurer'], endsOn: day(0) }).expect(400);
    expect(rolesPast.body.errors.endsOn[0]).toMatch(/after today/);
    expect(await count()).toBe(before);

    // Back-to-back terms are fine: one ends the day the next begins.
    const term = (await admin.post(url).send({ membershipId: s.member.membership!.id, role: 'show_chair', startsOn: day(-30), endsOn: day(-10) }).expect(201)).body;
    await admin.post(url).send({ membershipId: s.member.membership!.id, role: 'show_chair', startsOn: day(-10), endsOn: day(-5) }).expect(201);
    // Stretching the first one over the second is an overlap.
    await admin.patch(`${url}/${term.id}`).send({ endsOn: day(-8) }).expect(409);
    const patched = await admin.patch(`${url}/${term.id}`).send({ note: 'Acting chair' }).expect(200);
    expect(patched.body).toMatchObject({ note: 'Acting chair', endsOn: day(-10) });
    await admin.patch(`${url}/999999`).send({ note: 'x' }).expect(404);
    // A day that does not exist, or a note too long, is a 400 with the field named.
    expect((await admin.patch(`${url}/${term.id}`).send({ startsOn: '2026-02-30' }).expect(400)).body.errors.startsOn).toBeDefined();
    expect((await admin.patch(`${url}/${term.id}`).send({ note: 'x'.repeat(301) }).expect(400)).body.errors.note).toBeDefined();
  });

  it('never leaves the guild without an admin in force', async () => {
    const s = await createScenario(t);
    const admin = await signIn(t, s.admin.email);
    const base = `/api/guilds/${s.guild.id}`;
    const offices = (await admin.get(`${base}/offices`).expect(200)).body;
    const adminTerm = offices.offices.find((o: { role: string }) => o.role === 'admin').holders[0];
    const soon = await admin.patch(`${base}/offices/terms/${adminTerm.id}`).send({ endsOn: day(30) }).expect(409);
    expect(soon.body.message).toMatch(/no admin from/);
    await admin.patch(`${base}/members/${s.admin.membership!.id}/roles`).send({ roles: [] }).expect(409);
    // A successor from day 30 makes that end date fine.
    await admin.post(`${base}/offices/terms`).send({ membershipId: s.member.membership!.id, role: 'admin', startsOn: day(30) }).expect(201);
    await admin.patch(`${base}/offices/terms/${adminTerm.id}`).send({ endsOn: day(30) }).expect(200);
    // Roles: adding one with an end date opens a term until then; removing one ends its term today.
    const added = await admin.patch(`${base}/members/${s.member.membership!.id}/roles`).send({ roles: ['treasurer'], endsOn: day(90) }).expect(200);
    expect(added.body.roles).toEqual(['treasurer']);
    const holders = (await admin.get(`${base}/offices`).expect(200)).body.offices.find((o: { role: string }) => o.role === 'treasurer').holders;
    expect(holders).toContainEqual(expect.objectContaining({ name: s.member.user.name, startsOn: today(), endsOn: day(90) }));
    await admin.patch(`${base}/members/${s.showChair.membership!.id}/roles`).send({ roles: [] }).expect(200);
    await (await signIn(t, s.showChair.email)).post(`${base}/shows`).send({}).expect(403);
    const ended = await t.orm.em.fork().find(OfficeTerm, { membership: s.showChair.membership!.id });
    expect(ended.map((x) => [x.role, x.endsOn])).toEqual([['show_chair', today()]]);
  });

  it('lets members read, only admins write, and hides the guild from outsiders', async () => {
    const s = await createScenario(t);
    const base = `/api/guilds/${s.guild.id}/offices`;
    const member = await signIn(t, s.member.email);
    await member.get(base).expect(200);
    await member.get(`${base}/history`).expect(200);
    const refused = await member.post(`${base}/terms`).send({ membershipId: s.member.membership!.id, role: 'admin', startsOn: today() }).expect(403);
    expect(refused.body.message).toMatch(/Admin/);
    await member.post(`${base}/handover`).send({ role: 'admin', fromMembershipId: s.admin.membership!.id, toMembershipId: s.member.membership!.id, on: today() }).expect(403);
    await (await signIn(t, s.treasurer.email)).patch(`${base}/terms/1`).send({ note: 'x' }).expect(403);
    const outsider = await signIn(t, s.outsider.email);
    await outsider.get(base).expect(404);
    await outsider.get(`${base}/history`).expect(404);
    await outsider.post(`${base}/terms`).send({ membershipId: s.member.membership!.id, role: 'admin', startsOn: today() }).expect(404);
    expect(await rolesOf(s.member.membership!.id)).toEqual([]);
  });

  it('sweeps every guild under its named lock', async () => {
    const s = await createScenario(t);
    const em = t.orm.em.fork();
    em.create(OfficeTerm, { guild: s.guild.id, membership: s.treasurer.membership!.id, role: 'treasurer', startsOn: day(-100), endsOn: day(-1) });
    await em.flush();
    expect(await t.app.get(OfficesService).sweep(new Date())).toBe(true);
    expect(await rolesOf(s.treasurer.membership!.id)).toEqual([]);
    // Someone who has left does not take up an office that starts after she went.
    const em2 = t.orm.em.fork();
    em2.create(OfficeTerm, { guild: s.guild.id, membership: s.member.membership!.id, role: 'show_chair', startsOn: day(2) });
    (await em2.findOneOrFail(Membership, s.member.membership!.id)).status = 'left';
    await em2.flush();
    await t.app.get(OfficesService).syncGuild(s.guild.id, day(3));
    expect(await rolesOf(s.member.membership!.id)).toEqual([]);
  });
});
