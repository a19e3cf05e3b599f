/**
 * CSV as spreadsheets read it (RFC 4180): comma-separated, CRLF line ends, fields quoted when they
 * hold a comma, a quote or a line break, quotes doubled. Text that a spreadsheet would run as a
 * formula (starting with =, +, -, @, a tab or a carriage return) gets a leading apostrophe; numbers,
 * and text that is just a number ("-5.00"), are written as they are. A byte-order mark up front makes Excel read the file as UTF-8.
 */
export type CsvCell = string | number | null | undefined;

const FORMULA = /^[=+\-@\t\r]/;

export function csvCell(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = FORMULA.test(value) && !/^-?\d+(\.\d+)?$/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return '\uFEFF' + [header, ...rows].map((row) => row.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

/** Minor units as a plain decimal for a spreadsheet column: 3050 → "30.50", -5 → "-0.05" (2 digits). */
export function centsColumn(cents: number, digits: number): string {
  const negative = cents < 0;
  const abs = String(Math.abs(cents)).padStart(digits + 1, '0');
  const body = digits === 0 ? abs : `${abs.slice(0, -digits)}.${abs.slice(-digits)}`;
  return negative ? `-${body}` : body;
}
