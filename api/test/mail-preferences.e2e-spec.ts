import { OutboxMessage } from '../src/outbox/outbox-message.entity';
import { OutboxService } from '../src/outbox/outbox.service';
import { client, createScenario, createTestApp, signIn, unique, type TestApp } from './helpers';

/** Reminder e-mails can be turned off, by a one-click link without signing in or on the profile page (real MariaDB). */
describe('e-mail preferences and one-click unsubscribe', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const renewal = (to: string, key: string) => ({
    idempotencyKey: key,
    template: 'dues-renewal-soon' as const,
    to,
    context: { name: 'Ada', guildName: 'Test Guild', yearLabel: '2027', totalText: '$30.00', renewByText: '1 January 2027', paidThroughText: '31 December 2026', duesUrl: 'http://x/dues' },
  });
  const enqueue = (email: ReturnType<typeof renewal>) => t.orm.em.fork().transactional((em) => t.app.get(OutboxService).enqueue(em as never, email));
  const message = (key: string) => t.orm.em.fork().findOne(OutboxMessage, { idempotencyKey: key });

  it('puts a one-click unsubscribe header and link on reminders, and honours it without a session', async () => {
    const s = await createScenario(t);
    const key = unique('renewal');
    expect(await enqueue(renewal(s.member.email, key))).toBe(true);
    const m = (await message(key))!;
    expect(m.headers).toMatchObject({ 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' });
    const api = /^<(.+)>$/.exec(m.headers!['List-Unsubscribe'])![1];
    const page = /To stop reminder e-mails like this one: (\S+)/.exec(m.text)![1];
    expect(m.html).toContain('Stop reminder e-mails like this one');
    const query = new URL(api).search;
    expect(new URL(page).search).toBe(query);

    // Tampered links are refused with a message and change nothing.
    const anon = client(t);
    const tampered = query.replace(/t=([A-Za-z0-9_-])/, (_, c: string) => `t=${c === 'A' ? 'B' : 'A'}`);
    const bad = await anon.post(`/api/unsubscribe${tampered}`).expect(400);
    expect(bad.body.message).toContain('not valid');
    await anon.post(`/api/unsubscribe?u=${s.admin.user.id}&${query.split('&')[1]}`).expect(400); // another person's id
    await anon.get('/api/unsubscribe?u=abc&t=').expect(400);
    expect((await anon.get(`/api/unsubscribe${query}`).expect(200)).body).toEqual({ remindersOff: false });

    // The mail program's one-click POST: no cookie, no Origin, a form body.
    await anon.post(`/api/unsubscribe${query}`).unset('Origin').type('form').send('List-Unsubscribe=One-Click').expect(200, { remindersOff: true });
    const next = unique('renewal');
    expect(await enqueue(renewal(s.member.email, next))).toBe(false);
    expect(await message(next)).toBeNull();
    // Her transactional mail still goes.
    const reset = { idempotencyKey: unique('reset'), template: 'password-reset' as const, to: s.member.email, context: { name: 'Ada', resetUrl: 'http://x/reset', validForText: '1 hour' } };
    expect(await t.orm.em.fork().transactional((em) => t.app.get(OutboxService).enqueue(em as never, reset))).toBe(true);
    expect((await message(reset.idempotencyKey))!.headers).toBeNull();
    const member = await signIn(t, s.member.email);
    expect((await member.get('/api/profile/mail-preferences').expect(200)).body).toEqual({ reminders: false });
  });

  it('lets her choose on the profile page, and refuses a bad value', async () => {
    const s = await createScenario(t);
    const member = await signIn(t, s.member.email);
    await member.put('/api/profile/mail-preferences').send({ reminders: 'maybe' }).expect(400);
    await member.put('/api/profile/mail-preferences').send({ reminders: false }).expect(200, { reminders: false });
    expect(await enqueue(renewal(s.member.email, unique('renewal')))).toBe(false);
    await member.put('/api/profile/mail-preferences').send({ reminders: true }).expect(200, { reminders: true });
    expect(await enqueue(renewal(s.member.email, unique('renewal')))).toBe(true);
    await client(t).get('/api/profile/mail-preferences').expect(401);
  });
});
