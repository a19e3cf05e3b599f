import request from 'supertest';
import { PasswordReset } from '../src/auth/password-reset.entity';
import { client, createScenario, createTestApp, linkIn, PASSWORD, signIn, TestApp, unique, waitForMail } from './helpers';

describe('password reset and profile changes (real MariaDB, SMTP fake)', () => {
  let t: TestApp;
  let s: Awaited<ReturnType<typeof createScenario>>;

  beforeAll(async () => {
    t = await createTestApp();
    s = await createScenario(t);
  });
  afterAll(() => t.close());

  it('e-mails a one-hour, single-use link that sets a new password', async () => {
    const email = s.loner.email;
    const elsewhere = await signIn(t, email);
    const asked = await client(t).post('/api/auth/forgot-password').send({ email });
    expect(asked.status).toBe(202);
    const mail = await waitForMail(email, (m) => /password/i.test(m.subject));
    const link = linkIn(mail.text, '/reset-password?token=');
    const token = decodeURIComponent(new URL(link).searchParams.get('token')!);
    const row = await t.orm.em.fork().findOneOrFail(PasswordReset, { user: s.loner.user.id });
    // createdAt is stamped at insert, expiresAt a moment before: they can differ by a millisecond or two.
    const validFor = row.expiresAt.getTime() - row.createdAt.getTime();
    expect(Math.abs(validFor - 60 * 60 * 1000)).toBeLessThanOrEqual(50);

    const reset = await client(t).post('/api/auth/reset-password').send({ token, password: 'a brand new password' });
    expect(reset.status).toBe(200);
    // A device signed in with the old password is signed out.
    expect((await elsewhere.get('/api/dashboard')).status).toBe(401);
    expect((await client(t).post('/api/auth/sign-in').send({ email, password: PASSWORD })).status).toBe(401);
    expect((await client(t).post('/api/auth/sign-in').send({ email, password: 'a brand new password' })).status).toBe(200);
    const reused = await client(t).post('/api/auth/reset-password').send({ token, password: 'another new password' });
    expect(reused.status).toBe(400);
    expect(reused.body.message).toMatch(/expired or was already used/);
  });

  it('says the same thing for an unknown address and sends nothing', async () => {
    const email = `${unique('ghost')}@test.example`;
    const known = await client(t).post('/api/auth/forgot-password').send({ email: s.member.email });
    const unknown = await client(t).post('/api/auth/forgot-password').send({ email });
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    await expect(waitForMail(email, () => true, 1500)).rejects.toThrow(/no e-mail/);
  });

  it('refuses an expired link', async () => {
    await client(t).post('/api/auth/forgot-password').send({ email: s.treasurer.email });
    const mail = await waitForMail(s.treasurer.email, (m) => /password/i.test(m.subject));
    const token = decodeURIComponent(new URL(linkIn(mail.text, '/reset-password?token=')).searchParams.get('token')!);
    const em = t.orm.em.fork();
    const row = await em.findOneOrFail(PasswordReset, { user: s.treasurer.user.id });
    row.expiresAt = new Date(Date.now() - 1);
    await em.flush();
    const res = await client(t).post('/api/auth/reset-password').send({ token, password: 'too late for this one' });
    expect(res.status).toBe(400);
  });

  it('asks for the current password before changing e-mail or password', async () => {
    const agent = await signIn(t, s.showChair.email);
    const newEmail = `${unique('moved')}@test.example`;
    const wrong = await agent.post('/api/profile/email').send({ email: newEmail, currentPassword: 'not it at all' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.errors.currentPassword).toEqual(['That is not your current password.']);
    const taken = await agent.post('/api/profile/email').send({ email: s.member.email, currentPassword: PASSWORD });
    expect(taken.status).toBe(409);
    expect(taken.body.errors.email[0]).toMatch(/already uses/);
    const moved = await agent.post('/api/profile/email').send({ email: newEmail, currentPassword: PASSWORD });
    expect(moved.status).toBe(200);
    expect((await agent.get('/api/auth/me')).body.user.email).toBe(newEmail);

    const badPw = await agent.post('/api/profile/password').send({ currentPassword: 'nope nope', newPassword: 'whatever long enough' });
    expect(badPw.status).toBe(400);
    const otherDevice = await signIn(t, newEmail);
    const ok = await agent.post('/api/profile/password').send({ currentPassword: PASSWORD, newPassword: 'my second password' });
    expect(ok.status).toBe(200);
    expect((await otherDevice.get('/api/dashboard')).status).toBe(401);
    expect((await agent.get('/api/dashboard')).status).toBe(200);
    expect((await client(t).post('/api/auth/sign-in').send({ email: newEmail, password: 'my second password' })).status).toBe(200);
    const renamed = await agent.patch('/api/profile').send({ name: '  Ottilie Test  ' });
    expect(renamed.body.name).toBe('Ottilie Test');
    expect((await request(t.http).get('/api/profile')).status).toBe(401);
  });
});
