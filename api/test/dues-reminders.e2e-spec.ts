import { DuesInvoice } from '../src/dues/dues-invoice.entity';
import { DuesPlan } from '../src/dues/dues-plan.entity';
import { DuesRemindersService, duesRemindersEnabled } from '../src/dues/dues-reminders.service';
import { DuesSettingsRecord } from '../src/dues/dues-settings.entity';
import { DuesStanding } from '../src/dues/dues-standing.entity';
import { Household } from '../src/dues/household.entity';
import { Guild } from '../src/guilds/guild.entity';
import { Membership } from '../src/guilds/membership.entity';
import { OutboxMessage } from '../src/outbox/outbox-message.entity';
import { User } from '../src/users/user.entity';
import { createScenario, createTestApp, ORIGIN, waitForMail, type TestApp } from './helpers';

/**
 * The dues reminders job against the real MariaDB, with a chosen clock. The guild keeps Chicago
 * time, so 16:00 UTC is 10:00 there in winter (after the 9 o'clock start) and 14:00 UTC is 08:00.
 */
describe('dues reminders: the job sends each reminder once (real MariaDB)', () => {
  let a: TestApp;
  let b: TestApp;
  let s: Awaited<ReturnType<typeof createScenario>>;
  const ids: Record<string, number> = {};
  const emails: Record<string, string> = {};
  const db = () => a.orm.em.fork();

  /** Outbox rows of the dues reminders for this file's members, as "kind:name". */
  async function reminders(): Promise<string[]> {
    const rows = await db().find(OutboxMessage, { idempotencyKey: { $like: 'dues-reminder:%' } });
    const byId = new Map(Object.entries(ids).map(([name, id]) => [id, name]));
    return rows
      .map((r) => r.idempotencyKey.split(':'))
      .filter(([, , membershipId]) => byId.has(Number(membershipId)))
      .map(([, kind, membershipId]) => `${kind}:${byId.get(Number(membershipId))}`)
      .sort();
  }
  const allReminderRows = () => db().count(OutboxMessage, { idempotencyKey: { $like: 'dues-reminder:%' } });

  /** Every message the SMTP fake holds for this address whose subject matches. */
  async function inbox(to: string, subject: RegExp): Promise<string[]> {
    const base = process.env.SMTP_FAKE_INBOX_URL!;
    const list = (await (await fetch(`${base}/messages?to=${encodeURIComponent(to)}`)).json()) as { subject: string }[];
    return list.map((m) => m.subject).filter((x) => subject.test(x));
  }
  const settle = () => new Promise((r) => setTimeout(r, 1500));

  beforeAll(async () => {
    expect(duesRemindersEnabled()).toBe(false); // under NODE_ENV=test only tick(now) sends
    a = await createTestApp();
    b = await createTestApp();
    s = await createScenario(a);
    const em = db();
    const guild = await em.findOneOrFail(Guild, { id: s.guild.id });
    guild.timeZone = 'America/Chicago';
    guild.currency = 'USD';
    em.create(DuesSettingsRecord, {
      guild,
      yearStartMonth: 1,
      dueMonth: 1,
      dueDay: 1,
      graceDays: 31,
      lateFeeCents: 500,
      earlyRenewalDays: 60,
      proration: [],
    });
    const regular = em.create(DuesPlan, { guild, name: 'Regular', kind: 'standard', yearlyCents: 3000 });
    const householdPlan = em.create(DuesPlan, { guild, name: 'Household', kind: 'household', yearlyCents: 4500 });
    const lifetime = em.create(DuesPlan, { guild, name: 'Lifetime', kind: 'lifetime', yearlyCents: 0 });
    const household = em.create(Household, { guild, name: 'Bobbin Row' });
    const passwordHash = 'not-used';
    const member = (name: string, standing: Partial<Pick<DuesStanding, 'plan' | 'household' | 'paidThrough'>>, opts: { status?: 'left'; email?: string } = {}) => {
      const email = opts.email ?? `${name.toLowerCase().replace(/\s+/g, '.')}.${s.tag}@test.example`;
      const user = em.create(User, { email, name: `${name} ${s.tag}`, passwordHash });
      const membership = em.create(Membership, { user, guild, roles: [], status: opts.status ?? 'active' });
      em.create(DuesStanding, { membership, plan: null, household: null, paidThrough: null, ...standing });
      return { key: name.split(' ')[0].toLowerCase(), membership, email };
    };
    const people = [
      member('Nell Strand', { plan: regular, paidThrough: '2027-12-31' }),
      member('Ivy Bobbin', { plan: householdPlan, household, paidThrough: '2027-12-31' }),
      member('Opal Ahead', { plan: regular, paidThrough: '2028-12-31' }),
      member('Greta Lifelong', { plan: lifetime }),
      member('Fern Gone', { plan: regular, paidThrough: '2027-12-31' }, { status: 'left' }),
      member('Wren Noplan', { paidThrough: '2027-12-31' }),
      member('Tess Nomail', { plan: regular, paidThrough: '2027-12-31' }, { email: `no-address-${s.tag}` }),
      member('Bea Longago', { plan: regular, paidThrough: '2025-12-31' }),
    ];
    await em.flush();
    // Opal has paid for 2028 already: her invoice and her paid-through date say so.
    em.create(DuesInvoice, {
      guild,
      membership: people[2].membership,
      plan: regular,
      planName: 'Regular',
      yearLabel: '2028',
      coversFrom: '2028-01-01',
      coversThrough: '2028-12-31',
      lines: [{ kind: 'dues', label: '2028 dues — Regular', amountCents: 3000 }],
      totalCents: 3000,
      currency: 'USD',
      status: 'paid',
      paidOn: '2027-11-20',
      method: 'cash',
      receiptNumber: `2027-${s.tag.slice(-4)}`,
    });
    await em.flush();
    for (const p of people) {
      ids[p.key] = p.membership.id;
      emails[p.key] = p.email;
    }
  });
  afterAll(async () => {
    await a?.close();
    await b?.close();
  });

  it('sends nothing before 9 in the morning in the guild\'s time zone', async () => {
    const report = await a.app.get(DuesRemindersService).tick(new Date('2027-12-20T14:00:00Z'));
    expect(report).not.toBeNull();
    expect(await reminders()).toEqual([]);
  });

  it('two instances ticking at once queue each "soon" reminder exactly once, to the right people', async () => {
    const before = await allReminderRows();
    const at = new Date('2027-12-20T16:00:00Z');
    const reports = await Promise.all([a.app.get(DuesRemindersService).tick(at), b.app.get(DuesRemindersService).tick(at)]);
    // One instance held the named lock; the other skipped (null), or ran after and found nothing new.
    expect(reports.some((r) => r !== null)).toBe(true);
    const queued = reports.reduce((n, r) => n + (r ? r.soon + r.lapsed : 0), 0);
    expect(queued).toBe((await allReminderRows()) - before);
    // Not Opal (paid for 2028), Greta (lifetime), Fern (left), Wren (no plan), Tess (no address) or Bea (lapsed long ago).
    expect(await reminders()).toEqual(['soon:ivy', 'soon:nell']);
    const rows = await db().find(OutboxMessage, { idempotencyKey: `dues-reminder:soon:${ids.nell}:2027-12-31` });
    expect(rows).toHaveLength(1);
    expect(rows[0].toAddress).toBe(emails.nell);
  });

  it('the e-mail says what she owes, by when, and links to her dues page', async () => {
    const nell = await waitForMail(emails.nell, (m) => m.subject.includes('dues for 2028'));
    expect(nell.subject).toBe(`Your ${s.guild.name} dues for 2028: $30.00 by 1 January 2028`);
    expect(nell.text).toContain('paid through 31 December 2027');
    expect(nell.text).toContain('2028 dues — Regular: $30.00');
    expect(nell.text).toContain(`${ORIGIN}/guilds/${s.guild.id}/dues`);
    expect(nell.text).toContain(`Or give cash or a cheque to ${s.treasurer.user.name}, the guild's treasurer.`);
    expect(nell.text).toContain('grace period until 1 February 2028; after that, renewing adds a $5.00 late fee');
    expect(nell.html).toContain(`href="${ORIGIN}/guilds/${s.guild.id}/dues"`);
    const ivy = await waitForMail(emails.ivy, (m) => m.subject.includes('dues for 2028'));
    expect(ivy.subject).toContain('$45.00 by 1 January 2028');
    expect(ivy.text).toContain('everyone in the Bobbin Row household');
    await settle();
    expect(await inbox(emails.nell, /dues for 2028/)).toHaveLength(1);
    expect(await inbox(emails.ivy, /dues for 2028/)).toHaveLength(1);
  });

  it('a later tick, the same day or later in the window, sends nothing new', async () => {
    const same = await a.app.get(DuesRemindersService).tick(new Date('2027-12-20T16:15:00Z'));
    expect(same).toEqual({ soon: 0, lapsed: 0 });
    await b.app.get(DuesRemindersService).tick(new Date('2027-12-31T18:00:00Z'));
    await a.app.get(DuesRemindersService).tick(new Date('2028-01-01T18:00:00Z'));
    expect(await reminders()).toEqual(['soon:ivy', 'soon:nell']);
    await settle();
    expect(await inbox(emails.nell, /dues for 2028/)).toHaveLength(1);
  });

  it('says nothing in grace, then tells her once the day she lapses; a member who paid hears nothing', async () => {
    // Ivy pays for 2028 in January (as markPaid leaves it: her paid-through date moves on).
    const em = db();
    const ivy = await em.findOneOrFail(DuesStanding, { membership: ids.ivy });
    ivy.paidThrough = '2028-12-31';
    await em.flush();

    await a.app.get(DuesRemindersService).tick(new Date('2028-01-15T16:00:00Z'));
    await a.app.get(DuesRemindersService).tick(new Date('2028-02-01T16:00:00Z'));
    expect(await reminders()).toEqual(['soon:ivy', 'soon:nell']);

    const at = new Date('2028-02-02T16:00:00Z');
    await Promise.all([a.app.get(DuesRemindersService).tick(at), b.app.get(DuesRemindersService).tick(at)]);
    expect(await reminders()).toEqual(['lapsed:nell', 'soon:ivy', 'soon:nell']);
    const mail = await waitForMail(emails.nell, (m) => m.subject.includes('has lapsed'));
    expect(mail.subject).toBe(`Your ${s.guild.name} membership has lapsed: here is how to renew`);
    expect(mail.text).toContain('lapsed on 2 February 2028');
    expect(mail.text).toContain('Renewing now is $35.00');
    expect(mail.text).toContain('Late fee (renewed after 1 February 2028): $5.00');
    expect(mail.text).toContain(`${ORIGIN}/guilds/${s.guild.id}/dues`);

    await b.app.get(DuesRemindersService).tick(new Date('2028-02-05T16:00:00Z'));
    expect(await reminders()).toEqual(['lapsed:nell', 'soon:ivy', 'soon:nell']);
    await settle();
    expect(await inbox(emails.nell, /has lapsed/)).toHaveLength(1);
    expect(await inbox(emails.ivy, /has lapsed/)).toHaveLength(0);
  });
});
