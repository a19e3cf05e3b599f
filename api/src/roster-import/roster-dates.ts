import { DateTime } from 'luxon';

/** How a numeric date such as 03/04/2026 is read: day first (3 April) or month first (4 March). */
export type DateOrder = 'dmy' | 'mdy';
export const DATE_ORDERS: readonly DateOrder[] = ['dmy', 'mdy'];

export type DateResult = { ok: true; date: string } | { ok: false; message: string };

/** The order a guild most likely writes its dates in: month first in the US, day first elsewhere. */
export function defaultDateOrder(currency: string): DateOrder {
  return currency === 'USD' ? 'mdy' : 'dmy';
}

/** Written-out forms, tried in turn (English month names, full or short, any letter case). */
const WORDY_FORMATS = ['d MMMM yyyy', 'd MMM yyyy', 'MMMM d yyyy', 'MMM d yyyy', 'd MMMM yy', 'd MMM yy', 'MMMM d yy', 'MMM d yy'];

const NUMERIC = /^(\d{1,4})([/.\-])(\d{1,2})\2(\d{1,4})$/;
const SERIAL = /^\d{5}$/;

/** Two-digit years: 00–49 are 2000–2049, 50–99 are 1950–1999. */
export function fullYear(y: number, digits: number): number {
  if (digits > 2) return y;
  return y < 50 ? 2000 + y : 1900 + y;
}

function isoOf(year: number, month: number, day: number): string | null {
  const d = DateTime.fromObject({ year, month, day }, { zone: 'utc' });
  return d.isValid ? d.toISODate() : null;
}

/**
 * A date as a roster spreadsheet holds it, to "YYYY-MM-DD". Accepted: 2026-03-01 (and 2026/3/1);
 * "1 March 2026", "1 Mar 2026", "March 1, 2026", "Mar 1 2026"; numbers with slashes, dots or dashes
 * (1/3/2026, 01.03.26) read in the chosen order, with 2- or 4-digit years; and a spreadsheet's own
 * day number (45292 = 2024-01-01) when a date column was saved as a number.
 */
export function parseRosterDate(raw: string, order: DateOrder): DateResult {
  const text = raw.trim().replace(/\s+/g, ' ');
  if (text === '') return { ok: false, message: 'The date is empty.' };
  const cannot = { ok: false as const, message: `“${text}” is not a date Selvage can read. Write it like 2026-03-01 or 1 March 2026.` };

  const numeric = NUMERIC.exec(text);
  if (numeric) {
    const [, a, , b, c] = numeric;
    if (a.length === 4) {
      // Year first is never ambiguous: 2026-03-01, 2026/3/1.
      const iso = isoOf(Number(a), Number(b), Number(c));
      return iso ? { ok: true, date: iso } : { ok: false, message: `“${text}” is not a real date (there is no such day).` };
    }
    if (a.length > 2 || c.length === 1 || c.length === 3) return cannot;
    const year = fullYear(Number(c), c.length);
    const [day, month] = order === 'dmy' ? [Number(a), Number(b)] : [Number(b), Number(a)];
    const iso = isoOf(year, month, day);
    if (iso) return { ok: true, date: iso };
    const other = order === 'dmy' ? isoOf(year, Number(a), Number(b)) : isoOf(year, Number(b), Number(a));
    const hint = other
      ? ` Read ${order === 'dmy' ? 'month first' : 'day first'} it would be ${other}: if your file writes dates that way, change the date order above.`
      : '';
    return { ok: false, message: `“${text}” is not a real date read ${order === 'dmy' ? 'day first' : 'month first'}.${hint}` };
  }

  if (SERIAL.test(text)) {
    const n = Number(text);
    // Spreadsheets count days from 30 December 1899; 20000–80000 covers 1954 to 2119.
    if (n >= 20000 && n <= 80000)
      return { ok: true, date: DateTime.fromObject({ year: 1899, month: 12, day: 30 }, { zone: 'utc' }).plus({ days: n }).toISODate()! };
    return cannot;
  }

  const wordy = text
    .replace(/,/g, ' ')
    .replace(/(\d)(st|nd|rd|th)\b/gi, '$1')
    .replace(/\bsept\b/gi, 'Sep')
    .replace(/\s+/g, ' ')
    .trim()
    .replace(/[A-Za-z]+/g, (w) => w[0].toUpperCase() + w.slice(1).toLowerCase());
  for (const format of WORDY_FORMATS) {
    const d = DateTime.fromFormat(wordy, format, { zone: 'utc', locale: 'en-US' });
    if (d.isValid) {
      if (format.endsWith(' yy')) return { ok: true, date: isoOf(fullYear(d.year % 100, 2), d.month, d.day)! };
      return { ok: true, date: d.toISODate()! };
    }
  }
  // A month name with a day that month does not have ("31 February 2026").
  if (/[A-Za-z]/.test(wordy) && /\d/.test(wordy)) {
    for (const format of WORDY_FORMATS) {
      const d = DateTime.fromFormat(wordy, format, { zone: 'utc', locale: 'en-US' });
      if (d.invalidReason === 'unit out of range') return { ok: false, message: `“${text}” is not a real date (there is no such day).` };
    }
  }
  return cannot;
}
