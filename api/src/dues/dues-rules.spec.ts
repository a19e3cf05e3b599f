import {
  DuesRuleError,
  DuesSettings,
  Plan,
  ageOn,
  assertDuesSettings,
  duesSettingsProblems,
  formatDate,
  graceEndsOn,
  memberStanding,
  memberStatus,
  membershipYearAfter,
  membershipYearOf,
  membershipYearStarting,
  planFitsAge,
  quoteDues,
  renewalDueDate,
  renewalOpensOn,
  todayIn,
  validateDuesSettings,
  validatePlan,
} from './dues-rules';

// Invented plans for the invented Wrenfield Quilters' Guild. $25 a year is one of the amounts guilds
// charge (TRADE.md §4, S55–S60); the junior and senior tiers are categories seen in TRADE.md §4, S61–S64.
const standard: Plan = { id: 1, name: 'Standard', kind: 'standard', yearlyCents: 2500 };
const household: Plan = { id: 2, name: 'Household', kind: 'household', yearlyCents: 3500 };
const junior: Plan = { id: 3, name: 'Junior', kind: 'standard', yearlyCents: 1500, maxAge: 17 };
const senior: Plan = { id: 4, name: 'Senior', kind: 'standard', yearlyCents: 2000, minAge: 65 };
const lifetime: Plan = { id: 5, name: 'Lifetime', kind: 'lifetime', yearlyCents: 0 };
const honorary: Plan = { id: 6, name: 'Honorary', kind: 'honorary', yearlyCents: 0 };

/** Calendar year, due Jan 1, delinquent through Jan 31, dropped Feb 1 (TRADE.md §4, S65). */
const calendar: DuesSettings = {
  currency: 'USD',
  yearStartMonth: 1,
  dueMonth: 1,
  dueDay: 1,
  graceDays: 30,
  lateFeeCents: 0,
  proration: [],
};

/**
 * Nov–Oct year due Oct 31: joiners pay full Nov–Apr, half May–Jul, and Aug–Oct pay full and are covered
 * for the next year too (TRADE.md §4, S59).
 */
const novOct: DuesSettings = {
  currency: 'USD',
  yearStartMonth: 11,
  dueMonth: 10,
  dueDay: 31,
  graceDays: 0,
  lateFeeCents: 0,
  proration: [
    { fromMonth: 11, charge: 'full', coversNextYear: false },
    { fromMonth: 5, charge: 'half', coversNextYear: false },
    { fromMonth: 8, charge: 'full', coversNextYear: true },
  ],
};

/**
 * "$25 becomes $30 if unpaid by March", half dues for Jul–Dec joiners (TRADE.md §4, S57). Written as due
 * on the last day of February (day 29 = last day) with no further grace, so leap years keep Feb 29.
 */
const lateByMarch: DuesSettings = {
  currency: 'USD',
  yearStartMonth: 1,
  dueMonth: 2,
  dueDay: 29,
  graceDays: 0,
  lateFeeCents: 500,
  proration: [
    { fromMonth: 1, charge: 'full', coversNextYear: false },
    { fromMonth: 7, charge: 'half', coversNextYear: false },
  ],
};

/** Joining on or after Oct 1 covers the next year too (TRADE.md §4, S55; "after Oct 1" read as "from"). */
const octoberCoversNext: DuesSettings = {
  ...calendar,
  proration: [
    { fromMonth: 1, charge: 'full', coversNextYear: false },
    { fromMonth: 10, charge: 'full', coversNextYear: true },
  ],
};

/** A Sep–Aug year (TRADE.md §4, S58) with a late fee, for the edge cases. */
const sepAug: DuesSettings = {
  currency: 'USD',
  yearStartMonth: 9,
  dueMonth: 9,
  dueDay: 30,
  graceDays: 14,
  lateFeeCents: 500,
  proration: [],
};

const total = (q: { totalCents: number }) => q.totalCents;

describe('membershipYearOf', () => {
  it('labels a calendar year with one number', () => {
    expect(membershipYearOf('2026-06-15', calendar)).toEqual({
      label: '2026',
      startYear: 2026,
      startsOn: '2026-01-01',
      endsOn: '2026-12-31',
    });
    expect(membershipYearOf('2026-01-01', calendar).label).toBe('2026');
    expect(membershipYearOf('2025-12-31', calendar).label).toBe('2025');
  });

  it('labels a Nov–Oct year with both years', () => {
    expect(membershipYearOf('2026-03-10', novOct)).toEqual({
      label: '2025–26',
      startYear: 2025,
      startsOn: '2025-11-01',
      endsOn: '2026-10-31',
    });
    expect(membershipYearOf('2026-10-31', novOct).label).toBe('2025–26');
    expect(membershipYearOf('2026-11-01', novOct).label).toBe('2026–27');
  });

  it('labels a year starting in September "2026–27"', () => {
    expect(membershipYearOf('2026-09-01', sepAug)).toEqual({
      label: '2026–27',
      startYear: 2026,
      startsOn: '2026-09-01',
      endsOn: '2027-08-31',
    });
    expect(membershipYearOf('2026-08-31', sepAug).label).toBe('2025–26');
  });

  it('writes both years in full across a century', () => {
    expect(membershipYearStarting(2099, sepAug).label).toBe('2099–2100');
    expect(membershipYearStarting(1999, sepAug).label).toBe('1999–2000');
    expect(membershipYearStarting(2009, sepAug).label).toBe('2009–10');
    expect(membershipYearStarting(2000, sepAug).label).toBe('2000–01');
  });

  it('handles 29 February', () => {
    expect(membershipYearOf('2028-02-29', calendar).label).toBe('2028');
    const marchStart: DuesSettings = { ...calendar, yearStartMonth: 3, dueMonth: 3 };
    expect(membershipYearStarting(2027, marchStart).endsOn).toBe('2028-02-29');
    expect(membershipYearStarting(2028, marchStart).endsOn).toBe('2029-02-28');
    expect(membershipYearOf('2028-02-29', marchStart).label).toBe('2027–28');
  });

  it('gives the year after', () => {
    expect(membershipYearAfter(membershipYearOf('2026-12-31', calendar), calendar)).toEqual({
      label: '2027',
      startYear: 2027,
      startsOn: '2027-01-01',
      endsOn: '2027-12-31',
    });
    expect(membershipYearAfter(membershipYearOf('2026-10-31', novOct), novOct).label).toBe('2026–27');
  });

  it('rejects dates that are not yyyy-mm-dd calendar dates', () => {
    expect(() => membershipYearOf('2026-02-30', calendar)).toThrow('The date must be a date written yyyy-mm-dd, got "2026-02-30".');
    expect(() => membershipYearOf('2026-2-3', calendar)).toThrow(DuesRuleError);
    expect(() => membershipYearOf('2027-02-29', calendar)).toThrow(DuesRuleError);
    expect(() => membershipYearOf('2026-06-15T10:00', calendar)).toThrow(DuesRuleError);
  });
});

describe('renewalDueDate and graceEndsOn', () => {
  it('calendar year: due Jan 1, grace through Jan 31 (TRADE.md §4, S65)', () => {
    const y2026 = membershipYearStarting(2026, calendar);
    expect(renewalDueDate(y2026, calendar)).toBe('2026-01-01');
    expect(graceEndsOn(y2026, calendar)).toBe('2026-01-31');
  });

  it('Nov–Oct year: due Oct 31, the day before the year starts (TRADE.md §4, S59)', () => {
    const y = membershipYearStarting(2026, novOct);
    expect(y.label).toBe('2026–27');
    expect(renewalDueDate(y, novOct)).toBe('2026-10-31');
    expect(graceEndsOn(y, novOct)).toBe('2026-10-31');
    // Grace across the year boundary.
    expect(graceEndsOn(y, { ...novOct, graceDays: 30 })).toBe('2026-11-30');
  });

  it('due at the end of February, leap years included (TRADE.md §4, S57)', () => {
    expect(renewalDueDate(membershipYearStarting(2027, lateByMarch), lateByMarch)).toBe('2027-02-28');
    expect(renewalDueDate(membershipYearStarting(2028, lateByMarch), lateByMarch)).toBe('2028-02-29');
    expect(graceEndsOn(membershipYearStarting(2028, lateByMarch), lateByMarch)).toBe('2028-02-29');
  });

  it('grace that runs over the end of February counts the leap day', () => {
    const y2028 = membershipYearStarting(2028, calendar);
    const y2027 = membershipYearStarting(2027, calendar);
    const s = { ...calendar, graceDays: 59 };
    expect(graceEndsOn(y2027, s)).toBe('2027-03-01');
    expect(graceEndsOn(y2028, s)).toBe('2028-02-29');
  });

  it('a Sep–Aug year due Sep 30', () => {
    const y = membershipYearStarting(2026, sepAug);
    expect(renewalDueDate(y, sepAug)).toBe('2026-09-30');
    expect(graceEndsOn(y, sepAug)).toBe('2026-10-14');
  });

  it('early renewal opens 60 days before the due date or the first day, whichever is earlier', () => {
    expect(renewalOpensOn(membershipYearStarting(2027, calendar), calendar)).toBe('2026-11-02');
    expect(renewalOpensOn(membershipYearStarting(2027, lateByMarch), lateByMarch)).toBe('2026-11-02');
    expect(renewalOpensOn(membershipYearStarting(2026, novOct), novOct)).toBe('2026-09-01');
    expect(renewalOpensOn(membershipYearStarting(2027, { ...calendar, earlyRenewalDays: 0 }), { ...calendar, earlyRenewalDays: 0 })).toBe(
      '2027-01-01',
    );
  });
});

describe('memberStatus', () => {
  const at = (settings: DuesSettings, paidThrough: string | null, today: string, plan: Plan = standard) =>
    memberStanding({ plan, settings, paidThrough, today });

  it('calendar year: current through Jan 1, grace to Jan 31, lapsed Feb 1 (TRADE.md §4, S65)', () => {
    expect(at(calendar, '2025-12-31', '2025-06-01')).toEqual({ status: 'current', endsOn: '2026-01-01' });
    expect(at(calendar, '2025-12-31', '2026-01-01')).toEqual({ status: 'current', endsOn: '2026-01-01' });
    expect(at(calendar, '2025-12-31', '2026-01-02')).toEqual({ status: 'grace', endsOn: '2026-01-31' });
    expect(at(calendar, '2025-12-31', '2026-01-31')).toEqual({ status: 'grace', endsOn: '2026-01-31' });
    expect(at(calendar, '2025-12-31', '2026-02-01')).toEqual({ status: 'lapsed', endsOn: null });
  });

  it('Nov–Oct year with 30 days of grace', () => {
    const s = { ...novOct, graceDays: 30 };
    expect(at(s, '2026-10-31', '2026-10-31').status).toBe('current');
    expect(at(s, '2026-10-31', '2026-11-01')).toEqual({ status: 'grace', endsOn: '2026-11-30' });
    expect(at(s, '2026-10-31', '2026-12-01').status).toBe('lapsed');
  });

  it('no one is dropped before March when dues are due by the end of February (TRADE.md §4, S57, S66)', () => {
    expect(at(lateByMarch, '2027-12-31', '2028-01-15')).toEqual({ status: 'current', endsOn: '2028-02-29' });
    expect(at(lateByMarch, '2027-12-31', '2028-02-29').status).toBe('current');
    expect(at(lateByMarch, '2027-12-31', '2028-03-01').status).toBe('lapsed');
    expect(at(lateByMarch, '2026-12-31', '2027-02-28').status).toBe('current');
    expect(at(lateByMarch, '2026-12-31', '2027-03-01').status).toBe('lapsed');
  });

  it('never paid, or paid long ago, is lapsed', () => {
    expect(at(calendar, null, '2026-01-01')).toEqual({ status: 'lapsed', endsOn: null });
    expect(at(calendar, '2023-12-31', '2026-01-01').status).toBe('lapsed');
  });

  it('paid ahead stays current until the end of what was paid', () => {
    expect(at(calendar, '2027-12-31', '2026-11-20')).toEqual({ status: 'current', endsOn: '2028-01-01' });
  });

  it('lifetime and honorary members have their own status whatever was paid', () => {
    expect(at(calendar, null, '2026-05-01', lifetime)).toEqual({ status: 'lifetime', endsOn: null });
    expect(memberStatus({ plan: honorary, settings: calendar, paidThrough: '2001-12-31', today: '2026-05-01' })).toBe('honorary');
  });

  it('memberStatus is the status alone', () => {
    expect(memberStatus({ plan: standard, settings: calendar, paidThrough: '2025-12-31', today: '2026-01-15' })).toBe('grace');
  });
});

describe('quoteDues for renewing members', () => {
  const renew = (settings: DuesSettings, paidThrough: string | null, today: string, plan: Plan = standard) =>
    quoteDues({ plan, settings, paidThrough, today, joining: false });

  it('$25 becomes $30 if unpaid by March (TRADE.md §4, S57)', () => {
    const onTime = renew(lateByMarch, '2026-12-31', '2027-02-28');
    expect(onTime.lines).toEqual([{ kind: 'dues', label: '2027 dues — Standard', amountCents: 2500 }]);
    expect(total(onTime)).toBe(2500);
    expect(onTime.currency).toBe('USD');
    const late = renew(lateByMarch, '2026-12-31', '2027-03-01');
    expect(late.lines).toEqual([
      { kind: 'dues', label: '2027 dues — Standard', amountCents: 2500 },
      { kind: 'late-fee', label: 'Late fee (renewed after 28 February 2027)', amountCents: 500 },
    ]);
    expect(total(late)).toBe(3000); // TRADE.md §4, S57: $30
    expect([late.coversFrom, late.coversThrough]).toEqual(['2027-01-01', '2027-12-31']);
  });

  it('in a leap year, 29 February is still on time (TRADE.md §4, S57)', () => {
    expect(total(renew(lateByMarch, '2027-12-31', '2028-02-28'))).toBe(2500);
    expect(total(renew(lateByMarch, '2027-12-31', '2028-02-29'))).toBe(2500);
    expect(total(renew(lateByMarch, '2027-12-31', '2028-03-01'))).toBe(3000);
  });

  it('pays the current year when it is unpaid, with the late fee only after grace', () => {
    const s = { ...calendar, lateFeeCents: 500 };
    expect(total(renew(s, '2025-12-31', '2026-01-31'))).toBe(2500); // last grace day (TRADE.md §4, S65)
    const q = renew(s, '2025-12-31', '2026-02-01');
    expect(total(q)).toBe(3000);
    expect(q.lines[1]).toEqual({ kind: 'late-fee', label: 'Late fee (renewed after 31 January 2026)', amountCents: 500 });
    expect([q.coversFrom, q.coversThrough]).toEqual(['2026-01-01', '2026-12-31']);
  });

  it('charges no back dues: a member gone for years pays for this year only', () => {
    const s = { ...calendar, lateFeeCents: 500 };
    const q = renew(s, '2023-12-31', '2026-01-15');
    expect(total(q)).toBe(2500);
    expect(q.coversThrough).toBe('2026-12-31');
    expect(total(renew(s, null, '2026-06-01'))).toBe(3000);
  });

  it('renewing early pays for the next year, from 60 days before the year starts', () => {
    const closed = renew(calendar, '2026-12-31', '2026-11-01');
    expect(closed.lines).toEqual([]);
    expect(total(closed)).toBe(0);
    expect([closed.coversFrom, closed.coversThrough]).toEqual([null, null]);
    expect(closed.note).toBe('Paid through 31 December 2026. Renewal for 2027 opens on 2 November 2026.');

    const open = renew(calendar, '2026-12-31', '2026-11-02');
    expect(open.lines).toEqual([{ kind: 'dues', label: '2027 dues — Standard', amountCents: 2500 }]);
    expect([open.coversFrom, open.coversThrough]).toEqual(['2027-01-01', '2027-12-31']);
    expect(open.note).toBeNull();
  });

  it('an unpaid year that is nearly over is skipped once the next one opens', () => {
    const s = { ...calendar, lateFeeCents: 500 };
    const q = renew(s, '2025-12-31', '2026-11-15');
    expect(q.lines).toEqual([{ kind: 'dues', label: '2027 dues — Standard', amountCents: 2500 }]);
    expect(q.coversFrom).toBe('2027-01-01');
    // Still in the year (before the window): this year, late.
    expect(total(renew(s, '2025-12-31', '2026-11-01'))).toBe(3000);
  });

  it('Nov–Oct year: renewals for 2026–27 open Sep 1 and are due Oct 31 (TRADE.md §4, S59)', () => {
    const s = { ...novOct, lateFeeCents: 500 };
    expect(renew(s, '2026-10-31', '2026-08-31').lines).toEqual([]);
    const q = renew(s, '2026-10-31', '2026-10-31');
    expect(q.lines).toEqual([{ kind: 'dues', label: '2026–27 dues — Standard', amountCents: 2500 }]);
    expect([q.coversFrom, q.coversThrough]).toEqual(['2026-11-01', '2027-10-31']);
    expect(total(renew(s, '2026-10-31', '2026-11-01'))).toBe(3000);
  });

  it('Sep–Aug year: label 2026–27 and a late fee after the 14-day grace', () => {
    const q = renew(sepAug, '2026-08-31', '2026-10-15');
    expect(q.lines.map((l) => l.label)).toEqual(['2026–27 dues — Standard', 'Late fee (renewed after 14 October 2026)']);
    expect(total(q)).toBe(3000);
    expect(total(renew(sepAug, '2026-08-31', '2026-10-14'))).toBe(2500);
  });

  it('paid two years ahead has nothing to pay', () => {
    const q = renew(calendar, '2027-12-31', '2026-11-20');
    expect(q.lines).toEqual([]);
    expect(q.note).toBe('Paid through 31 December 2027. Renewal for 2028 opens on 2 November 2027.');
  });

  it('household plans charge their own yearly amount', () => {
    expect(renew(calendar, '2025-12-31', '2026-01-01', household).lines).toEqual([
      { kind: 'dues', label: '2026 dues — Household', amountCents: 3500 },
    ]);
  });

  it('lifetime and honorary members pay nothing', () => {
    for (const plan of [lifetime, honorary]) {
      for (const joining of [false, true]) {
        const q = quoteDues({ plan, settings: { ...calendar, lateFeeCents: 500 }, paidThrough: null, today: '2026-06-01', joining });
        expect(total(q)).toBe(0);
        expect(q.lines).toHaveLength(1);
        expect(q.lines[0].label).toMatch(/no dues$/);
        expect(q.note).toMatch(/pay no dues/);
      }
    }
  });

  it('a free plan is never charged a late fee', () => {
    const free: Plan = { id: 9, name: 'Newsletter only', kind: 'standard', yearlyCents: 0 };
    expect(total(renew({ ...calendar, lateFeeCents: 500 }, '2025-12-31', '2026-06-01', free))).toBe(0);
  });
});

describe('quoteDues for joining members', () => {
  const join = (settings: DuesSettings, today: string, plan: Plan = standard) =>
    quoteDues({ plan, settings, paidThrough: null, today, joining: true });

  it('Nov–Oct year: full Nov–Apr, half May–Jul, full and next year Aug–Oct (TRADE.md §4, S59)', () => {
    const cases: [string, number, string][] = [
      ['2025-11-01', 2500, '2026-10-31'],
      ['2026-01-15', 2500, '2026-10-31'],
      ['2026-04-30', 2500, '2026-10-31'],
      ['2026-05-01', 1250, '2026-10-31'],
      ['2026-07-31', 1250, '2026-10-31'],
      ['2026-08-01', 2500, '2027-10-31'],
      ['2026-10-31', 2500, '2027-10-31'],
    ];
    for (const [today, cents, through] of cases) {
      const q = join(novOct, today);
      expect([today, total(q), q.coversFrom, q.coversThrough]).toEqual([today, cents, today, through]);
    }
    expect(join(novOct, '2026-05-01').lines).toEqual([
      { kind: 'proration', label: 'Half of 2025–26 dues — Standard (joined in May)', amountCents: 1250 },
    ]);
    expect(join(novOct, '2026-08-01').lines).toEqual([
      { kind: 'dues', label: 'Rest of 2025–26 and all of 2026–27 — Standard', amountCents: 2500 },
    ]);
  });

  it('half dues for Jul–Dec joiners, and never a late fee (TRADE.md §4, S57)', () => {
    expect(total(join(lateByMarch, '2027-06-30'))).toBe(2500);
    expect(total(join(lateByMarch, '2027-07-01'))).toBe(1250);
    expect(total(join(lateByMarch, '2027-12-31'))).toBe(1250);
    const march = join(lateByMarch, '2027-03-15');
    expect(march.lines).toEqual([{ kind: 'dues', label: '2027 dues — Standard', amountCents: 2500 }]);
    expect(march.coversThrough).toBe('2027-12-31');
  });

  it('half of an odd amount rounds half-up (the guild keeps the odd cent)', () => {
    const odd: Plan = { ...standard, yearlyCents: 2501 };
    expect(total(join(lateByMarch, '2027-08-01', odd))).toBe(1251);
  });

  it('joining on or after Oct 1 covers the next year (TRADE.md §4, S55)', () => {
    expect(join(octoberCoversNext, '2026-09-30').coversThrough).toBe('2026-12-31');
    const oct = join(octoberCoversNext, '2026-10-01');
    expect(total(oct)).toBe(2500);
    expect(oct.coversThrough).toBe('2027-12-31');
    expect(oct.lines[0].label).toBe('Rest of 2026 and all of 2027 — Standard');
  });

  it('without proration bands joiners pay the full current year', () => {
    const q = join(calendar, '2026-12-20');
    expect(total(q)).toBe(2500);
    expect([q.coversFrom, q.coversThrough]).toEqual(['2026-12-20', '2026-12-31']);
  });

  it('a joiner on 29 February', () => {
    const q = join(lateByMarch, '2028-02-29');
    expect(total(q)).toBe(2500);
    expect(q.coversFrom).toBe('2028-02-29');
  });

  it('someone still paid up cannot join again', () => {
    expect(() => quoteDues({ plan: standard, settings: calendar, paidThrough: '2026-12-31', today: '2026-05-01', joining: true })).toThrow(
      'This member is already paid through 31 December 2026; renew instead of joining.',
    );
    // A former member whose membership ran out can.
    expect(total(quoteDues({ plan: standard, settings: calendar, paidThrough: '2024-12-31', today: '2026-05-01', joining: true }))).toBe(2500);
  });
});

describe('duesSettingsProblems', () => {
  it('names the field each problem is about, so a form can show it in place', () => {
    const problems = duesSettingsProblems({
      ...calendar,
      currency: 'XYZ',
      dueMonth: 2,
      dueDay: 30,
      graceDays: -1,
      proration: [
        { fromMonth: 3, charge: 'full', coversNextYear: false },
        { fromMonth: 7, charge: 'third' as 'half', coversNextYear: false },
      ],
    });
    expect(problems.map((p) => p.field)).toEqual(['currency', 'dueDay', 'graceDays', 'proration.1.charge', 'proration']);
    expect(problems.map((p) => p.message)).toEqual(validateDuesSettings({ ...calendar, currency: 'XYZ', dueMonth: 2, dueDay: 30, graceDays: -1, proration: [
      { fromMonth: 3, charge: 'full', coversNextYear: false },
      { fromMonth: 7, charge: 'third' as 'half', coversNextYear: false },
    ] }));
    expect(problems[0].message).toBe('"XYZ" is not a currency this system knows.');
  });
});

describe('validateDuesSettings', () => {
  it('accepts the example settings', () => {
    for (const s of [calendar, novOct, lateByMarch, octoberCoversNext, sepAug]) expect(validateDuesSettings(s)).toEqual([]);
  });

  it('reports every problem at once', () => {
    const bad = { ...calendar, yearStartMonth: 13, dueMonth: 0, graceDays: -1, lateFeeCents: -500, currency: 'XX' };
    expect(validateDuesSettings(bad)).toEqual([
      '"XX" is not a currency code; use three letters like USD.',
      'The membership year must start in a month numbered 1 to 12, got 13.',
      'The due month must be numbered 1 to 12, got 0.',
      'The grace period must be a whole number of days from 0 to 364, got -1.',
      'The late fee must be a whole number of cents, 0 or more, got -500.',
    ]);
  });

  it('checks the due day against the month', () => {
    expect(validateDuesSettings({ ...calendar, dueMonth: 4, dueDay: 31 })).toEqual([
      'The due day must be a day of April (1 to 30), got 31.',
    ]);
    expect(validateDuesSettings({ ...calendar, dueMonth: 2, dueDay: 30 })).toEqual([
      'The due day must be a day of February (1 to 29), got 30.',
    ]);
    expect(validateDuesSettings({ ...calendar, dueMonth: 2, dueDay: 29 })).toEqual([]);
    expect(validateDuesSettings({ ...calendar, dueDay: 1.5 })).toHaveLength(1);
  });

  it('rejects fractional fees and grace', () => {
    expect(validateDuesSettings({ ...calendar, lateFeeCents: 4.5, graceDays: 2.5 })).toHaveLength(2);
    expect(validateDuesSettings({ ...calendar, graceDays: 365 })).toHaveLength(1);
  });

  it('checks the early renewal window', () => {
    expect(validateDuesSettings({ ...calendar, earlyRenewalDays: 181 })).toEqual([
      'Early renewal must open a whole number of days from 0 to 180 before the due date, got 181.',
    ]);
    expect(validateDuesSettings({ ...calendar, earlyRenewalDays: 90 })).toEqual([]);
  });

  it('checks the proration bands', () => {
    expect(
      validateDuesSettings({
        ...novOct,
        proration: [
          { fromMonth: 11, charge: 'full', coversNextYear: false },
          { fromMonth: 8, charge: 'full', coversNextYear: true },
          { fromMonth: 5, charge: 'half', coversNextYear: false },
        ],
      }),
    ).toEqual(['Proration bands must be listed in order through the membership year from November, with no month twice.']);
    expect(
      validateDuesSettings({
        ...novOct,
        proration: [
          { fromMonth: 11, charge: 'full', coversNextYear: false },
          { fromMonth: 11, charge: 'half', coversNextYear: false },
        ],
      }),
    ).toEqual(['Proration bands must be listed in order through the membership year from November, with no month twice.']);
    expect(validateDuesSettings({ ...novOct, proration: [{ fromMonth: 1, charge: 'full', coversNextYear: false }] })).toEqual([
      'The first proration band must start in November, the first month of the membership year.',
    ]);
    expect(
      validateDuesSettings({
        ...calendar,
        proration: [{ fromMonth: 13, charge: 'quarter', coversNextYear: 'yes' }] as unknown as DuesSettings['proration'],
      }),
    ).toEqual([
      'Proration band 1 must start in a month numbered 1 to 12, got 13.',
      'Proration band 1 must charge "full" or "half", got "quarter".',
      'Proration band 1 must say whether it covers the next year (true or false).',
    ]);
    expect(validateDuesSettings({ ...calendar, proration: undefined as unknown as [] })).toEqual([
      'The proration bands must be a list (it may be empty).',
    ]);
  });

  it('every rule throws a clear Error for bad settings', () => {
    const bad = { ...calendar, yearStartMonth: 13, lateFeeCents: -500 };
    const expected =
      'The dues settings cannot be used: The membership year must start in a month numbered 1 to 12, got 13. ' +
      'The late fee must be a whole number of cents, 0 or more, got -500.';
    expect(() => assertDuesSettings(bad)).toThrow(expected);
    expect(() => membershipYearOf('2026-01-01', bad)).toThrow(expected);
    expect(() => quoteDues({ plan: standard, settings: bad, paidThrough: null, today: '2026-01-01', joining: false })).toThrow(Error);
    expect(() => memberStatus({ plan: standard, settings: bad, paidThrough: null, today: '2026-01-01' })).toThrow(DuesRuleError);
    expect(validateDuesSettings(null as unknown as DuesSettings)).toEqual(['Dues settings are missing.']);
  });

  it('rejects bad dates passed to the rules', () => {
    expect(() => quoteDues({ plan: standard, settings: calendar, paidThrough: null, today: '15/01/2026', joining: false })).toThrow(
      'Today must be a date written yyyy-mm-dd, got "15/01/2026".',
    );
    expect(() => memberStatus({ plan: standard, settings: calendar, paidThrough: '2025-13-31', today: '2026-01-01' })).toThrow(
      /Paid through must be a date/,
    );
  });
});

describe('plans and ages', () => {
  it('checks age limits inclusively', () => {
    expect(planFitsAge(junior, 17)).toBe(true);
    expect(planFitsAge(junior, 18)).toBe(false);
    expect(planFitsAge(junior, 0)).toBe(true);
    expect(planFitsAge(senior, 64)).toBe(false);
    expect(planFitsAge(senior, 65)).toBe(true);
    expect(planFitsAge(standard, 40)).toBe(true);
  });

  it('rejects ages that are not whole years', () => {
    expect(() => planFitsAge(junior, -1)).toThrow('An age must be a whole number of years, got -1.');
    expect(() => planFitsAge(junior, 12.5)).toThrow(DuesRuleError);
  });

  it('validates plans', () => {
    expect(validatePlan(standard)).toEqual([]);
    expect(validatePlan({ id: 7, name: ' ', kind: 'family' as Plan['kind'], yearlyCents: 25.5, minAge: 18, maxAge: 12 })).toEqual([
      'The plan needs a name.',
      'The plan kind must be one of standard, household, lifetime, honorary, got "family".',
      'Yearly dues must be a whole number of cents, 0 or more, got 25.5.',
      "The plan's lowest age (18) is above its highest age (12).",
    ]);
    expect(() => quoteDues({ plan: { ...standard, yearlyCents: -1 }, settings: calendar, paidThrough: null, today: '2026-01-01', joining: true })).toThrow(
      'The membership plan cannot be used: Yearly dues must be a whole number of cents, 0 or more, got -1.',
    );
  });

  it('counts age in whole years; a 29 February birthday comes on 1 March in common years', () => {
    expect(ageOn('1960-05-20', '2026-05-19')).toBe(65);
    expect(ageOn('1960-05-20', '2026-05-20')).toBe(66);
    expect(ageOn('2012-02-29', '2013-02-28')).toBe(0);
    expect(ageOn('2012-02-29', '2013-03-01')).toBe(1);
    expect(ageOn('2012-02-29', '2016-02-29')).toBe(4);
    expect(() => ageOn('2030-01-01', '2026-01-01')).toThrow('The birth date is after today.');
  });
});

describe('dates', () => {
  it('takes today in the guild time zone', () => {
    const instant = new Date('2026-12-31T23:30:00Z');
    expect(todayIn('Pacific/Auckland', instant)).toBe('2027-01-01');
    expect(todayIn('America/Chicago', instant)).toBe('2026-12-31');
    expect(() => todayIn('Not/AZone', instant)).toThrow('"Not/AZone" is not a time zone.');
  });

  it('writes dates out in words', () => {
    expect(formatDate('2028-02-29')).toBe('29 February 2028');
  });
});
