/** Months travel as "YYYY-MM" and dates as "YYYY-MM-DD", both in the guild's time zone. */

const MONTH_RE = /^(\d{4})-(\d{2})$/;
const DATE_RE = /^(\d{4})-(\d{2})-(\d{2})$/;

export function isMonth(value: string): boolean {
  const m = value.match(MONTH_RE);
  return Boolean(m && Number(m[2]) >= 1 && Number(m[2]) <= 12);
}

/** "2027-03" → "March 2027". */
export function formatMonth(month: string): string {
  const m = month.match(MONTH_RE);
  if (!m) return month;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, 1));
  return date.toLocaleDateString('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' });
}

/** "2026-09-01" → "1 September 2026": the month written out, so day and month cannot be mixed up. */
export function formatDay(value: string | null | undefined): string {
  if (!value) return '';
  const m = value.match(DATE_RE);
  if (!m) return value;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return date.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
}

/** "2027-03-15" → "Monday 15 March 2027". */
export function formatDate(value: string | null | undefined): string {
  if (!value) return '';
  const m = value.match(DATE_RE);
  if (!m) return value;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return date.toLocaleDateString('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
}

/** An ISO instant shown in the guild's time zone: "Monday 1 March 2027 at 08:00". */
export function formatDateTime(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '';
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  const zone = safeZone(timeZone);
  const day = date.toLocaleDateString('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: zone });
  const time = date.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', timeZone: zone });
  return `${day} at ${time}`;
}

function safeZone(timeZone?: string): string | undefined {
  if (!timeZone) return undefined;
  try {
    new Intl.DateTimeFormat('en', { timeZone });
    return timeZone;
  } catch {
    return undefined;
  }
}

/** This month ("YYYY-MM") in a time zone. */
export function currentMonth(timeZone?: string, now: Date = new Date()): string {
  const parts = new Intl.DateTimeFormat('en-CA', { year: 'numeric', month: '2-digit', timeZone: safeZone(timeZone) }).formatToParts(now);
  const year = parts.find((p) => p.type === 'year')?.value ?? String(now.getFullYear());
  const month = parts.find((p) => p.type === 'month')?.value ?? String(now.getMonth() + 1).padStart(2, '0');
  return `${year}-${month}`;
}

/** "2027-11" + 3 → "2028-02". */
export function addMonths(month: string, count: number): string {
  const m = month.match(MONTH_RE);
  if (!m) return month;
  const index = Number(m[1]) * 12 + Number(m[2]) - 1 + count;
  return `${Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}`;
}

/** The last month of a run of `months` starting at `start`. */
export function lastMonth(start: string, months: number): string {
  return addMonths(start, Math.max(0, months - 1));
}
