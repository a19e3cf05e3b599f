/** Dates as the api sends them ("YYYY-MM-DD", the guild's calendar), written out for people. */

const DATE_RE = /^(\d{4})-(\d{2})-(\d{2})$/;

function utcDate(value: string): Date | null {
  const m = DATE_RE.exec(value);
  return m ? new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]))) : null;
}

/** "2026-09-01" → "1 September 2026" (no weekday: short enough for a table). */
export { formatDay } from '@/lib/dates';

/** "2026-09-01" → "1 Sept 2026", for tables with many columns. */
export function formatDayShort(value: string | null | undefined): string {
  if (!value) return '';
  const date = utcDate(value);
  if (!date) return value;
  return date.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
}

/** "2026-09" → "Sep 2026" (for chart axes); "September 2026" with long. */
export function formatMonthShort(month: string, long = false): string {
  const m = /^(\d{4})-(\d{2})$/.exec(month);
  if (!m) return month;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, 1));
  return date.toLocaleDateString('en-GB', { month: long ? 'long' : 'short', year: 'numeric', timeZone: 'UTC' });
}

/** Today's date ("YYYY-MM-DD") in a time zone; the browser's own zone when none is known. */
export function todayIn(timeZone?: string, now: Date = new Date()): string {
  let zone: string | undefined = timeZone;
  try {
    if (zone) new Intl.DateTimeFormat('en', { timeZone: zone });
  } catch {
    zone = undefined;
  }
  const parts = new Intl.DateTimeFormat('en-CA', { year: 'numeric', month: '2-digit', day: '2-digit', timeZone: zone }).formatToParts(now);
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${get('year')}-${get('month')}-${get('day')}`;
}

export const MONTH_NAMES = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
] as const;

export const MONTH_OPTIONS = MONTH_NAMES.map((label, i) => ({ value: String(i + 1), label }));

/** Days in a month of a leap year: February allows 29 ("the last day of February"). */
export function daysInMonth(month: number): number {
  return new Date(Date.UTC(2000, month, 0)).getUTCDate();
}
