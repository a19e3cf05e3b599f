import request from 'supertest';
import { Invitation } from '../src/invitations/invitation.entity';
import { Membership } from '../src/guilds/membership.entity';
import { OutboxMessage } from '../src/outbox/outbox-message.entity';
import { User } from '../src/users/user.entity';
import { client, createScenario, createTestApp, linkIn, PASSWORD, signIn, TestApp, unique, waitForMail } from './helpers';

describe('joining a guild by invitation, through the SMTP fake (real MariaDB)', () => {
  let t: TestApp;
  let s: Awaited<ReturnType<typeof createScenario>>;

  beforeAll(async () => {
    t = await createTestApp();
    s = await createScenario(t);
  });
  afterAll(() => t.close());

  async function invite(email: string, roles: string[] = []) {
    const admin = await signIn(t, s.admin.email);
    const res = await admin.post(`/api/guilds/${s.guild.id}/invitations`).send({ email, roles });
    expect(res.status).toBe(201);
    const mail = await waitForMail(email, (m) => m.subject.includes(s.guild.name));
    return { admin, mail, token: linkIn(mail.text, '/invitations/').split('/invitations/')[1] };
  }

  it('lets a new person follow the e-mailed link, set her name and password, and land signed in', async () => {
    const email = `${unique('newbie')}@test.example`;
    const { mail, token } = await invite(email, ['show_chair']);
    expect(mail.html).toContain(`/invitations/${token}`);
    expect(mail.subject).toContain(s.admin.user.name);

    const view = await request(t.http).get(`/api/invitations/${token}`);
    expect(view.status).toBe(200);
    expect(view.body).toMatchObject({ guildName: s.guild.name, email, hasAccount: false, invitedByName: s.admin.user.name });

    const newcomer = client(t);
    const accepted = await newcomer.post(`/api/invitations/${token}/accept`).send({ name: 'Wilhelmina Test', password: PASSWORD });
    expect(accepted.status).toBe(200);
    const dash = await newcomer.get('/api/dashboard');
    expect(dash.status).toBe(200);
    expect(dash.body.user.name).toBe('Wilhelmina Test');
    expect(dash.body.guilds).toEqual([expect.objectContaining({ id: s.guild.id, roles: ['show_chair'] })]);
    // Her office is a term from today in the guild's record, so the roles keep following the terms.
    const history = await newcomer.get(`/api/guilds/${s.guild.id}/offices/history`).expect(200);
    const hers = (Array.isArray(history.body) ? history.body : history.body.terms).filter((x: { name: string }) => x.name === 'Wilhelmina Test');
    expect(hers).toEqual([expect.objectContaining({ role: 'show_chair', endsOn: null, note: 'Given with her invitation' })]);
    await waitForMail(email, (m) => /welcome/i.test(m.subject));

    // Single use: the same link cannot be used again, signed in or not.
    expect((await request(t.http).get(`/api/invitations/${token}`)).status).toBe(404);
    const again = await client(t).post(`/api/invitations/${token}/accept`).send({ name: 'Someone', password: PASSWORD });
    expect(again.status).toBe(404);
    expect(again.body.message).toMatch(/expired, was already used/);
  });

  it('a member the officers added without a password cannot sign in; her invitation lets her choose one and keeps her record', async () => {
    const email = `${unique('kept')}@test.example`;
    const em = t.orm.em.fork();
    const user = em.create(User, { email, name: 'Philippa Kept', passwordHash: null, phone: '555 0100' });
    const kept = em.create(Membership, { user, guild: s.guild.id, roles: [] });
    await em.flush();

    const refused = await client(t).post('/api/auth/sign-in').send({ email, password: PASSWORD });
    expect(refused.status).toBe(401);
    const { token } = await invite(email);
    expect((await request(t.http).get(`/api/invitations/${token}`)).body.hasAccount).toBe(false);
    const she = client(t);
    expect((await she.post(`/api/invitations/${token}/accept`).send({ name: 'Philippa Kept', password: PASSWORD })).status).toBe(200);
    expect((await she.get('/api/dashboard')).body.guilds).toEqual([expect.objectContaining({ id: s.guild.id })]);
    // Same account and membership as before, now with a password; her phone stays.
    const after = await t.orm.em.fork().findOneOrFail(Membership, { id: kept.id }, { populate: ['user', 'user.passwordHash'] });
    expect(after.user.id).toBe(user.id);
    expect(after.user.passwordHash).toBeTruthy();
    expect(after.user.phone).toBe('555 0100');
    expect((await client(t).post('/api/auth/sign-in').send({ email, password: PASSWORD })).status).toBe(200);
    // Now that she signs in, inviting her again is refused as for any member.
    const admin = await signIn(t, s.admin.email);
    expect((await admin.post(`/api/guilds/${s.guild.id}/invitations`).send({ email })).status).toBe(409);
  });

  it('adds the guild to an existing account once she signs in as the invited address', async () => {
    const { token } = await invite(s.outsider.email);
    expect((await request(t.http).get(`/api/invitations/${token}`)).body.hasAccount).toBe(true);
    const anonymous = await client(t).post(`/api/invitations/${token}/accept`).send({});
    expect(anonymous.status).toBe(403);
    expect(anonymous.body.message).toMatch(/Sign in as/);
    const wrongPerson = await signIn(t, s.member.email);
    expect((await wrongPerson.post(`/api/invitations/${token}/accept`).send({})).status).toBe(403);

    const outsider = await signIn(t, s.outsider.email);
    expect((await outsider.post(`/api/invitations/${token}/accept`).send({})).status).toBe(200);
    const dash = await outsider.get('/api/dashboard');
    expect(dash.body.guilds.map((g: { id: number }) => g.id).sort()).toEqual([s.guild.id, s.otherGuild.id].sort());
  });

  it('refuses a second invitation to a member or to someone already invited, writing nothing', async () => {
    const admin = await signIn(t, s.admin.email);
    const before = await t.orm.em.fork().count(OutboxMessage, {});
    const member = await admin.post(`/api/guilds/${s.guild.id}/invitations`).send({ email: s.member.email.toUpperCase() });
    expect(member.status).toBe(409);
    expect(member.body.message).toMatch(/already a member/);

    const email = `${unique('twice')}@test.example`;
    expect((await admin.post(`/api/guilds/${s.guild.id}/invitations`).send({ email })).status).toBe(201);
    const twice = await admin.post(`/api/guilds/${s.guild.id}/invitations`).send({ email });
    expect(twice.status).toBe(409);
    expect(await t.orm.em.fork().count(Invitation, { email })).toBe(1);
    expect(await t.orm.em.fork().count(OutboxMessage, {})).toBe(before + 1);
  });

  it('turns away an expired or withdrawn link', async () => {
    const email = `${unique('late')}@test.example`;
    const { admin, token } = await invite(email);
    const em = t.orm.em.fork();
    const inv = await em.findOneOrFail(Invitation, { email });
    inv.expiresAt = new Date(Date.now() - 1000);
    await em.flush();
    const expired = await client(t).post(`/api/invitations/${token}/accept`).send({ name: 'Late', password: PASSWORD });
    expect(expired.status).toBe(404);

    const email2 = `${unique('withdrawn')}@test.example`;
    const second = await invite(email2);
    const id = (await em.findOneOrFail(Invitation, { email: email2 })).id;
    expect((await admin.delete(`/api/guilds/${s.guild.id}/invitations/${id}`)).status).toBe(204);
    expect((await request(t.http).get(`/api/invitations/${second.token}`)).status).toBe(404);
    expect(await em.fork().count(Membership, { user: { email: email2 } })).toBe(0);
  });

  it('explains what is missing when a new person leaves out her name or password', async () => {
    const { token } = await invite(`${unique('blank')}@test.example`);
    const res = await client(t).post(`/api/invitations/${token}/accept`).send({ password: 'short' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.errors)).toEqual(['password']);
    const noName = await client(t).post(`/api/invitations/${token}/accept`).send({ password: PASSWORD });
    expect(noName.status).toBe(400);
    expect(noName.body.errors.name).toEqual(['Enter your name.']);
    // Still usable afterwards: the failed tries wrote nothing.
    expect((await request(t.http).get(`/api/invitations/${token}`)).status).toBe(200);
  });

  it('lets an admin change roles but never remove the last admin', async () => {
    const admin = await signIn(t, s.admin.email);
    const url = (id: number) => `/api/guilds/${s.guild.id}/members/${id}/roles`;
    const promote = await admin.patch(url(s.member.membership!.id)).send({ roles: ['treasurer', 'show_chair'] });
    expect(promote.status).toBe(200);
    expect(promote.body.roles).toEqual(['treasurer', 'show_chair']);
    const lastAdmin = await admin.patch(url(s.admin.membership!.id)).send({ roles: [] });
    expect(lastAdmin.status).toBe(409);
    expect(lastAdmin.body.message).toMatch(/at least one admin/);
    const bad = await admin.patch(url(s.member.membership!.id)).send({ roles: ['queen'] });
    expect(bad.status).toBe(400);
    expect(bad.body.errors.roles[0]).toMatch(/must be one of/);
    const foreign = await admin.patch(url(s.outsider.membership!.id)).send({ roles: [] });
    expect(foreign.status).toBe(404);
    const members = await admin.get(`/api/guilds/${s.guild.id}/members`);
    expect(members.body.find((m: { membershipId: number }) => m.membershipId === s.member.membership!.id).roles).toEqual([
      'treasurer',
      'show_chair',
    ]);
  });

  it('shows plain members names only and officers contact details', async () => {
    const member = await signIn(t, s.showChair.email);
    const plain = await member.get(`/api/guilds/${s.guild.id}/members`);
    expect(plain.status).toBe(200);
    expect(plain.body[0]).not.toHaveProperty('email');
    const chair = await signIn(t, s.membershipChair.email);
    const full = await chair.get(`/api/guilds/${s.guild.id}/members`);
    expect(full.body.map((m: { email: string }) => m.email)).toContain(s.member.email);
  });
});
