import type { DuesSettings, Plan } from './dues-rules';
import {
  duesReminderFor,
  LAPSED_NOTICE_DAYS,
  reminderKey,
  remindersMaySendAt,
  SOON_DAYS,
  standingTimeline,
  type LapsedReminder,
  type ReminderInput,
  type SoonReminder,
} from './dues-reminders';

/** A calendar year due 1 January, 31 days' grace, a $5 late fee, renewals open 60 days ahead. */
const calendar: DuesSettings = {
  currency: 'USD',
  yearStartMonth: 1,
  dueMonth: 1,
  dueDay: 1,
  graceDays: 31,
  lateFeeCents: 500,
  earlyRenewalDays: 60,
  proration: [],
};
const regular: Plan = { id: 1, name: 'Regular', kind: 'standard', yearlyCents: 3000 };
const household: Plan = { id: 2, name: 'Household', kind: 'household', yearlyCents: 4500 };
const lifetime: Plan = { id: 3, name: 'Lifetime', kind: 'lifetime', yearlyCents: 0 };
const honorary: Plan = { id: 4, name: 'Honorary', kind: 'honorary', yearlyCents: 0 };

const on = (today: string, over: Partial<ReminderInput> = {}) =>
  duesReminderFor({ plan: regular, settings: calendar, paidThrough: '2027-12-31', today, ...over });

describe('duesReminderFor: "your dues run out soon"', () => {
  it('says nothing before the window, which opens 14 days before her last current day', () => {
    expect(SOON_DAYS).toBe(14);
    // Paid through 31 December 2027; 2028 is due on 1 January, her last current day.
    expect(on('2027-06-01')).toBeNull();
    expect(on('2027-12-17')).toBeNull();
    const first = on('2027-12-18') as SoonReminder;
    expect(first).toMatchObject({
      kind: 'soon',
      periodEnd: '2027-12-31',
      renewBy: '2028-01-01',
      graceEndsOn: '2028-02-01',
      lateFeeCents: 500,
      yearLabel: '2028',
    });
    expect(first.quote.totalCents).toBe(3000);
    expect(first.quote.lines).toEqual([{ kind: 'dues', label: '2028 dues — Regular', amountCents: 3000 }]);
    expect(first.quote.coversFrom).toBe('2028-01-01');
  });

  it('stays due inside the window, through her last current day (the key is the same, so she hears once)', () => {
    for (const day of ['2027-12-20', '2027-12-31', '2028-01-01']) expect(on(day)?.kind).toBe('soon');
    expect(reminderKey('soon', 42, on('2027-12-20')!.periodEnd)).toBe(reminderKey('soon', 42, on('2028-01-01')!.periodEnd));
  });

  it('says nothing to a member already paid for the next year', () => {
    expect(on('2027-12-20', { paidThrough: '2028-12-31' })).toBeNull();
    // …nor when a paid invoice reaches past a paid-through date that has not caught up.
    expect(on('2027-12-20', { paidInvoicesThrough: '2028-12-31' })).toBeNull();
    // An invoice for the period she already has changes nothing.
    expect(on('2027-12-20', { paidInvoicesThrough: '2027-12-31' })?.kind).toBe('soon');
  });

  it('never reminds lifetime or honorary members, members without a plan, or who never paid', () => {
    for (const plan of [lifetime, honorary, null]) expect(on('2027-12-20', { plan })).toBeNull();
    expect(on('2027-12-20', { paidThrough: null })).toBeNull();
    expect(on('2028-02-02', { paidThrough: null })).toBeNull();
  });

  it('quotes a household plan at the household amount', () => {
    const r = on('2027-12-20', { plan: household }) as SoonReminder;
    expect(r.quote.totalCents).toBe(4500);
    expect(r.quote.lines[0].label).toBe('2028 dues — Household');
  });

  it('waits for renewals to open: with no early renewal it comes on the due date itself', () => {
    const settings = { ...calendar, earlyRenewalDays: 0 };
    expect(on('2027-12-20', { settings })).toBeNull();
    expect(on('2027-12-31', { settings })).toBeNull();
    expect(on('2028-01-01', { settings })).toMatchObject({ kind: 'soon', renewBy: '2028-01-01' });
  });

  it('uses the due date when it falls after the paid year ends (due at the end of February)', () => {
    const settings = { ...calendar, dueMonth: 2, dueDay: 28 };
    // Paid through 31 December, but current until 28 February: the window opens on 14 February.
    expect(on('2028-02-13', { settings })).toBeNull();
    expect(on('2028-02-14', { settings })).toMatchObject({ kind: 'soon', renewBy: '2028-02-28', graceEndsOn: '2028-03-30' });
  });

  it('handles a membership year from November (labels "2027–28")', () => {
    const settings = { ...calendar, yearStartMonth: 11, dueMonth: 10, dueDay: 31 };
    expect(on('2027-10-16', { settings, paidThrough: '2027-10-31' })).toBeNull();
    expect(on('2027-10-17', { settings, paidThrough: '2027-10-31' })).toMatchObject({
      kind: 'soon',
      renewBy: '2027-10-31',
      yearLabel: '2027–28',
    });
  });
});

describe('duesReminderFor: in grace and lapsed', () => {
  it('says nothing while she is in grace', () => {
    for (const day of ['2028-01-02', '2028-01-15', '2028-02-01']) expect(on(day)).toBeNull();
  });

  it('tells her the day after grace ends, with the late fee renewing now adds', () => {
    const r = on('2028-02-02') as LapsedReminder;
    expect(r).toMatchObject({ kind: 'lapsed', periodEnd: '2027-12-31', lapsedOn: '2028-02-02', yearLabel: '2028' });
    expect(r.quote.totalCents).toBe(3500);
    expect(r.quote.lines.map((l) => l.kind)).toEqual(['dues', 'late-fee']);
    expect(reminderKey('lapsed', 7, r.periodEnd)).toBe('dues-reminder:lapsed:7:2027-12-31');
  });

  it('still sends a lapse notice the job missed for a few days, then leaves her alone', () => {
    expect(LAPSED_NOTICE_DAYS).toBe(7);
    expect(on('2028-02-08')?.kind).toBe('lapsed');
    expect(on('2028-02-09')).toBeNull();
    // Lapsed long ago: switching reminders on does not write to her.
    expect(on('2028-02-02', { paidThrough: '2025-12-31' })).toBeNull();
    expect(on('2028-02-02', { paidThrough: '2026-12-31' })).toBeNull();
  });

  it('with no grace she goes from current to lapsed the day after the due date', () => {
    const settings = { ...calendar, graceDays: 0 };
    expect(standingTimeline(regular, settings, '2027-12-31')).toEqual({ lastCurrentDay: '2028-01-01', lastGraceDay: null });
    expect(on('2028-01-01', { settings })).toMatchObject({ kind: 'soon', graceEndsOn: null });
    expect(on('2028-01-02', { settings })).toMatchObject({ kind: 'lapsed', lapsedOn: '2028-01-02' });
  });
});

describe('duesReminderFor: leap days', () => {
  it('a due date of 29 February is the 29th in a leap year and the 28th otherwise', () => {
    const settings = { ...calendar, dueMonth: 2, dueDay: 29, graceDays: 0 };
    expect(on('2028-02-14', { settings })).toBeNull();
    expect(on('2028-02-15', { settings })).toMatchObject({ kind: 'soon', renewBy: '2028-02-29' });
    expect(on('2028-02-29', { settings })).toMatchObject({ kind: 'soon', renewBy: '2028-02-29' });
    expect(on('2028-03-01', { settings })).toMatchObject({ kind: 'lapsed', lapsedOn: '2028-03-01' });
    expect(on('2027-02-14', { settings, paidThrough: '2026-12-31' })).toMatchObject({ kind: 'soon', renewBy: '2027-02-28' });
    expect(on('2027-03-01', { settings, paidThrough: '2026-12-31' })).toMatchObject({ kind: 'lapsed', lapsedOn: '2027-03-01' });
  });

  it('grace that ends on 29 February lapses on 1 March', () => {
    const settings = { ...calendar, graceDays: 59 };
    expect(on('2028-02-29', { settings })).toBeNull();
    expect(on('2028-03-01', { settings })).toMatchObject({ kind: 'lapsed', lapsedOn: '2028-03-01' });
  });

  it('a member paid through 29 February is reminded before her next due date', () => {
    // Paid through a leap day (e.g. a treasurer's correction); the next unpaid year is 2028–29 from March.
    const settings = { ...calendar, yearStartMonth: 3, dueMonth: 3, dueDay: 1 };
    expect(on('2028-02-15', { settings, paidThrough: '2028-02-29' })).toBeNull();
    expect(on('2028-02-16', { settings, paidThrough: '2028-02-29' })).toMatchObject({ kind: 'soon', renewBy: '2028-03-01', yearLabel: '2028–29' });
  });
});

describe('remindersMaySendAt', () => {
  it('waits for 9 in the morning in the guild\'s time zone', () => {
    // 14:59 UTC is 08:59 in Chicago in December; 15:00 is 09:00.
    expect(remindersMaySendAt(new Date('2027-12-20T14:59:00Z'), 'America/Chicago')).toBe(false);
    expect(remindersMaySendAt(new Date('2027-12-20T15:00:00Z'), 'America/Chicago')).toBe(true);
    // The same instant is already the evening in Auckland.
    expect(remindersMaySendAt(new Date('2027-12-20T08:00:00Z'), 'Pacific/Auckland')).toBe(true);
    expect(remindersMaySendAt(new Date('2027-12-20T08:00:00Z'), 'Not/AZone')).toBe(false);
  });
});
