import type { MembershipYear } from './dues-rules';
import { monthsOf, startYearOfLabel, yearReport } from './year-report';

const CALENDAR_2026: MembershipYear = { label: '2026', startYear: 2026, startsOn: '2026-01-01', endsOn: '2026-12-31' };
const SEPT_2026: MembershipYear = { label: '2026–27', startYear: 2026, startsOn: '2026-09-01', endsOn: '2027-08-31' };

describe('monthsOf', () => {
  it('lists the twelve months of a calendar year and of a year that crosses New Year', () => {
    expect(monthsOf(CALENDAR_2026)).toEqual(['2026-01', '2026-02', '2026-03', '2026-04', '2026-05', '2026-06', '2026-07', '2026-08', '2026-09', '2026-10', '2026-11', '2026-12']);
    const sept = monthsOf(SEPT_2026);
    expect(sept).toHaveLength(12);
    expect([sept[0], sept[3], sept[4], sept[11]]).toEqual(['2026-09', '2026-12', '2027-01', '2027-08']);
  });
});

describe('yearReport', () => {
  // Worked by hand: three payments of $30, $15 and $45, fees of 117, 74 and 161 cents (2.9% + 30¢,
  // rounded half up), and a $15 refund of the junior payment in March.
  const payments = [
    { planName: 'Regular', paidOn: '2026-01-04', amountCents: 3000, feeCents: 117 },
    { planName: 'Junior', paidOn: '2026-01-20', amountCents: 1500, feeCents: 74 },
    { planName: 'Household', paidOn: '2026-02-02', amountCents: 4500, feeCents: 161 },
    // An early renewal paid before the year began counts in the year the bank saw it.
    { planName: 'Regular', paidOn: '2025-12-15', amountCents: 3000, feeCents: 117 },
  ];
  const refunds = [{ planName: 'Junior', refundedOn: '2026-03-09', amountCents: 1500 }];

  it('adds up received, fees, refunds and net by month, by plan and in total, in whole cents', () => {
    const r = yearReport(CALENDAR_2026, payments, refunds);
    expect(r.totals).toEqual({ count: 3, grossCents: 9000, feeCents: 352, refundedCents: 1500, netCents: 7148 });
    expect(r.incomeByMonth.slice(0, 4)).toEqual([
      { month: '2026-01', count: 2, grossCents: 4500, feeCents: 191, refundedCents: 0, netCents: 4309 },
      { month: '2026-02', count: 1, grossCents: 4500, feeCents: 161, refundedCents: 0, netCents: 4339 },
      { month: '2026-03', count: 0, grossCents: 0, feeCents: 0, refundedCents: 1500, netCents: -1500 },
      { month: '2026-04', count: 0, grossCents: 0, feeCents: 0, refundedCents: 0, netCents: 0 },
    ]);
    expect(r.incomeByPlan.map((p) => [p.planName, p.count, p.grossCents, p.netCents])).toEqual([
      ['Household', 1, 4500, 4339],
      ['Regular', 1, 3000, 2883],
      ['Junior', 1, 1500, -74],
    ]);
  });

  it('keeps the months and plans summing to the totals', () => {
    const r = yearReport(CALENDAR_2026, payments, refunds);
    for (const key of ['grossCents', 'feeCents', 'refundedCents', 'netCents'] as const) {
      expect(r.incomeByMonth.reduce((t, m) => t + m[key], 0)).toBe(r.totals[key]);
      expect(r.incomeByPlan.reduce((t, p) => t + p[key], 0)).toBe(r.totals[key]);
    }
  });

  it('reports an empty year as twelve months of zero', () => {
    const r = yearReport(SEPT_2026, [], []);
    expect(r.incomeByMonth).toHaveLength(12);
    expect(r.totals).toEqual({ count: 0, grossCents: 0, feeCents: 0, refundedCents: 0, netCents: 0 });
    expect(r.incomeByPlan).toEqual([]);
  });
});

describe('startYearOfLabel', () => {
  it('reads the labels the dues rules write, and nothing else', () => {
    expect(startYearOfLabel('2026')).toBe(2026);
    expect(startYearOfLabel('2025–26')).toBe(2025);
    expect(startYearOfLabel('2099-2100')).toBe(2099);
    expect(startYearOfLabel('last year')).toBeNull();
    expect(startYearOfLabel('20266')).toBeNull();
  });
});
