import { defaultDateOrder, fullYear, parseRosterDate } from './roster-dates';

const ok = (text: string, order: 'dmy' | 'mdy' = 'dmy') => {
  const r = parseRosterDate(text, order);
  if (!r.ok) throw new Error(`${text}: ${r.message}`);
  return r.date;
};
const problem = (text: string, order: 'dmy' | 'mdy' = 'dmy') => {
  const r = parseRosterDate(text, order);
  if (r.ok) throw new Error(`${text} read as ${r.date}`);
  return r.message;
};

describe('roster dates', () => {
  it('reads ISO dates whatever the order', () => {
    expect(ok('2026-03-01')).toBe('2026-03-01');
    expect(ok('2026-03-01', 'mdy')).toBe('2026-03-01');
    expect(ok('2026/3/1')).toBe('2026-03-01');
  });

  it('reads dates written out in English', () => {
    for (const t of ['1 March 2026', 'March 1, 2026', '1 Mar 2026', 'Mar 1 2026', '1st March 2026', 'march 1 2026', ' 1  MARCH 2026 ', '1 Sept 2026'])
      expect([t, ok(t, 'mdy')]).toEqual([t, t.includes('Sept') ? '2026-09-01' : '2026-03-01']);
    expect(ok('1 Mar 26')).toBe('2026-03-01');
  });

  it('reads numeric dates day first or month first, with slashes, dots or dashes', () => {
    expect(ok('03/04/2026', 'dmy')).toBe('2026-04-03');
    expect(ok('03/04/2026', 'mdy')).toBe('2026-03-04');
    expect(ok('3.4.2026')).toBe('2026-04-03');
    expect(ok('3-4-2026', 'mdy')).toBe('2026-03-04');
    expect(ok('31/12/2026')).toBe('2026-12-31');
    expect(ok('12/31/2026', 'mdy')).toBe('2026-12-31');
  });

  it('reads 2-digit years: 00–49 this century, 50–99 the last', () => {
    expect(ok('1/3/26')).toBe('2026-03-01');
    expect(ok('1/3/49')).toBe('2049-03-01');
    expect(ok('1/3/75')).toBe('1975-03-01');
    expect(fullYear(0, 2)).toBe(2000);
    expect(fullYear(1999, 4)).toBe(1999);
  });

  it('calls impossible dates problems and hints at the other order', () => {
    expect(problem('31/02/2026')).toMatch(/not a real date read day first/);
    expect(problem('12/31/2026', 'dmy')).toMatch(/month first it would be 2026-12-31/);
    expect(problem('2026-02-30')).toMatch(/no such day/);
    expect(problem('31 February 2026')).toMatch(/no such day/);
    expect(problem('next Tuesday')).toMatch(/not a date Selvage can read/);
    expect(problem('1/3')).toMatch(/not a date/);
    expect(problem('1/3/202')).toMatch(/not a date/);
    expect(problem('')).toMatch(/empty/);
  });

  it('reads a spreadsheet day number', () => {
    expect(ok('45292')).toBe('2024-01-01');
    expect(ok('45352', 'mdy')).toBe('2024-03-01');
    expect(problem('12345')).toMatch(/not a date/);
  });

  it('defaults to month first only for guilds paying in US dollars', () => {
    expect(defaultDateOrder('USD')).toBe('mdy');
    expect(defaultDateOrder('GBP')).toBe('dmy');
    expect(defaultDateOrder('CAD')).toBe('dmy');
  });
});
