import { changeLeavesNoAdmin, firstDayWithoutCover, isIsoDate, rolesInForce, syncedRoles, termCovers, termsOverlap } from './terms';

describe('office terms', () => {
  const today = '2026-12-02';

  it('counts a term from its first day and stops on its end date', () => {
    const term = { startsOn: '2026-01-01', endsOn: '2026-12-02' };
    expect(termCovers(term, '2026-01-01')).toBe(true);
    expect(termCovers(term, '2026-12-01')).toBe(true);
    expect(termCovers(term, '2026-12-02')).toBe(false);
    expect(termCovers(term, '2025-12-31')).toBe(false);
    expect(termCovers({ startsOn: '2020-05-05', endsOn: null }, '2099-01-01')).toBe(true);
  });

  it('gives the roles in force today: ending today is out, starting today is in, future not yet', () => {
    const terms = [
      { role: 'treasurer', startsOn: '2025-01-01', endsOn: today },
      { role: 'show_chair', startsOn: today, endsOn: null },
      { role: 'membership_chair', startsOn: '2026-12-03', endsOn: null },
      { role: 'admin', startsOn: '2024-09-01', endsOn: '2026-12-03' },
    ];
    expect(rolesInForce(terms, today)).toEqual(['admin', 'show_chair']);
    expect(rolesInForce(terms, '2026-12-01')).toEqual(['admin', 'treasurer']);
    expect(rolesInForce(terms, '2026-12-03')).toEqual(['membership_chair', 'show_chair']);
    expect(rolesInForce([], today)).toEqual([]);
  });

  it('keeps a role that has no term at all and says it needs recording', () => {
    const terms = [{ role: 'treasurer', startsOn: '2025-01-01', endsOn: '2026-06-01' }];
    expect(syncedRoles(['treasurer', 'show_chair'], terms, today)).toEqual({ roles: ['show_chair'], untracked: ['show_chair'] });
    expect(syncedRoles([], [{ role: 'admin', startsOn: today, endsOn: null }], today)).toEqual({ roles: ['admin'], untracked: [] });
  });

  it('finds overlapping terms and lets one start on the day the other ends', () => {
    const a = { startsOn: '2026-01-01', endsOn: '2027-01-01' };
    expect(termsOverlap(a, { startsOn: '2027-01-01', endsOn: null })).toBe(false);
    expect(termsOverlap(a, { startsOn: '2025-01-01', endsOn: '2026-01-01' })).toBe(false);
    expect(termsOverlap(a, { startsOn: '2026-12-31', endsOn: null })).toBe(true);
    expect(termsOverlap({ startsOn: '2020-01-01', endsOn: null }, { startsOn: '2030-01-01', endsOn: '2031-01-01' })).toBe(true);
    expect(termsOverlap(a, { startsOn: '2026-03-01', endsOn: '2026-04-01' })).toBe(true);
  });

  it('finds the first day without an admin', () => {
    expect(firstDayWithoutCover([{ startsOn: '2024-01-01', endsOn: null }], today)).toBeNull();
    expect(firstDayWithoutCover([{ startsOn: '2024-01-01', endsOn: today }], today)).toBe(today);
    expect(firstDayWithoutCover([{ startsOn: '2024-01-01', endsOn: '2027-03-01' }], today)).toBe('2027-03-01');
    // A handover with no day in between keeps the guild covered.
    expect(firstDayWithoutCover([{ startsOn: '2024-01-01', endsOn: '2027-03-01' }, { startsOn: '2027-03-01', endsOn: null }], today)).toBeNull();
    // A successor starting a day late leaves one day bare.
    expect(firstDayWithoutCover([{ startsOn: '2024-01-01', endsOn: '2027-03-01' }, { startsOn: '2027-03-02', endsOn: null }], today)).toBe('2027-03-01');
    expect(firstDayWithoutCover([], today)).toBe(today);
  });

  it('refuses a change only when it brings a day without an admin closer', () => {
    const open = [{ startsOn: '2024-01-01', endsOn: null }];
    expect(changeLeavesNoAdmin(open, [{ startsOn: '2024-01-01', endsOn: '2027-01-01' }], today)).toBe('2027-01-01');
    const ending = [{ startsOn: '2024-01-01', endsOn: '2027-01-01' }];
    expect(changeLeavesNoAdmin(ending, [{ startsOn: '2024-01-01', endsOn: '2027-02-01' }], today)).toBeNull();
    expect(changeLeavesNoAdmin(ending, [{ startsOn: '2024-01-01', endsOn: today }], today)).toBe(today);
    expect(changeLeavesNoAdmin(open, [...open, { startsOn: '2026-01-01', endsOn: today }], today)).toBeNull();
  });

  it('reads only real calendar dates', () => {
    expect(isIsoDate('2026-02-28')).toBe(true);
    expect(isIsoDate('2026-02-30')).toBe(false);
    expect(isIsoDate('2026-2-3')).toBe(false);
    expect(isIsoDate('yesterday')).toBe(false);
    expect(isIsoDate(20260101)).toBe(false);
  });
});
