import { CsvError, parse } from 'csv-parse/sync';

/** Largest file or pasted text the roster import reads, in bytes. */
export const MAX_ROSTER_BYTES = 5 * 1024 * 1024;
/** Most member rows one import takes. */
export const MAX_ROSTER_ROWS = 10_000;

export type Delimiter = ',' | ';' | '\t';
export const DELIMITER_NAMES: Record<Delimiter, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };

/** A file the import cannot read at all; `status` is the HTTP answer (400 or 413). */
export class RosterFileError extends Error {
  constructor(
    message: string,
    readonly status: 400 | 413 = 400,
  ) {
    super(message);
  }
}

export const TOO_LARGE_MESSAGE =
  'The file is larger than 5 MB, more than a roster needs. Save only the member columns, or split the file into two and import each.';

const NOT_TEXT_MESSAGE =
  'This file is not a spreadsheet saved as text. In your spreadsheet choose File › Save as (or Download) › CSV, then choose that file.';

const WORKBOOK_MESSAGE =
  'This is a spreadsheet workbook (such as .xlsx or .ods), which Selvage cannot read. In your spreadsheet choose File › Save as (or Download) › CSV, then choose that file.';

/**
 * Bytes of an uploaded file to text: UTF-8 (with or without a byte-order mark), UTF-16 with its
 * mark (a spreadsheet's "Unicode text"), and otherwise Windows-1252, which older spreadsheets use
 * for CSV. Refuses anything that is not text.
 */
export function decodeRosterBytes(bytes: Uint8Array): string {
  if (bytes.length > MAX_ROSTER_BYTES) throw new RosterFileError(TOO_LARGE_MESSAGE, 413);
  // A zip archive: the workbook file of a spreadsheet program (.xlsx, .ods), not its CSV.
  if (bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04) throw new RosterFileError(WORKBOOK_MESSAGE);
  let text: string;
  if (bytes[0] === 0xff && bytes[1] === 0xfe) text = new TextDecoder('utf-16le').decode(bytes.subarray(2));
  else if (bytes[0] === 0xfe && bytes[1] === 0xff) text = new TextDecoder('utf-16be').decode(bytes.subarray(2));
  else {
    if (bytes.includes(0)) throw new RosterFileError(NOT_TEXT_MESSAGE);
    try {
      text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes);
    } catch {
      text = new TextDecoder('windows-1252').decode(bytes);
    }
  }
  return checkRosterText(text);
}

/**
 * Text as pasted or decoded: drops a byte-order mark and refuses binary content (a NUL, or more
 * than one character in ten that is a control character or undecodable).
 */
export function checkRosterText(raw: string): string {
  const text = raw.charCodeAt(0) === 0xfeff ? raw.slice(1) : raw;
  if (Buffer.byteLength(text, 'utf8') > MAX_ROSTER_BYTES) throw new RosterFileError(TOO_LARGE_MESSAGE, 413);
  if (text.includes('\u0000')) throw new RosterFileError(NOT_TEXT_MESSAGE);
  const sample = text.slice(0, 64 * 1024);
  let odd = 0;
  for (let i = 0; i < sample.length; i++) {
    const c = sample.charCodeAt(i);
    if ((c < 32 && c !== 9 && c !== 10 && c !== 13 && c !== 12) || c === 0xfffd || (c >= 0x7f && c < 0xa0 && c !== 0x85)) odd++;
  }
  if (sample.length > 0 && odd / sample.length > 0.1) throw new RosterFileError(NOT_TEXT_MESSAGE);
  return text;
}

/**
 * Which of comma, semicolon and tab separates the columns: the one found most often, outside
 * quotes, on the first line that is not blank. Ties go to tab, then semicolon (a list of names
 * with commas in them is more likely than a header with semicolons in it).
 */
export function detectDelimiter(text: string): Delimiter {
  const counts: Record<Delimiter, number> = { '\t': 0, ';': 0, ',': 0 };
  let inQuotes = false;
  let seenContent = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === '"') inQuotes = !inQuotes;
    else if (!inQuotes && (ch === '\n' || ch === '\r')) {
      if (seenContent) break;
    } else if (!inQuotes && (ch === ',' || ch === ';' || ch === '\t')) {
      counts[ch]++;
      seenContent = true;
    } else if (!inQuotes && ch.trim() !== '') seenContent = true;
  }
  const order: Delimiter[] = ['\t', ';', ','];
  let best: Delimiter = ',';
  let bestCount = 0;
  for (const d of order)
    if (counts[d] > bestCount) {
      best = d;
      bestCount = counts[d];
    }
  return best;
}

export interface RosterTable {
  delimiter: Delimiter;
  header: string[];
  /** Data rows with their row number as a spreadsheet shows it (the header is row 1). */
  rows: { rowNumber: number; cells: string[] }[];
}

/**
 * Splits the text into a header and data rows (quoted cells may hold the delimiter, doubled quotes
 * and line breaks), trims every cell and leaves out rows with nothing in them. Row numbers count
 * each record once, blank ones included, so they match the spreadsheet the file came from.
 */
export function readRosterTable(text: string, delimiter: Delimiter = detectDelimiter(text)): RosterTable {
  if (text.trim() === '') throw new RosterFileError('The file is empty: there is no header and no members in it.');
  let lastLine = 0;
  let records: string[][];
  try {
    records = parse(text, {
      delimiter,
      relax_column_count: true,
      relax_quotes: true,
      skip_empty_lines: false,
      trim: false,
      bom: true,
      on_record: (record: string[], context: { lines: number }) => {
        lastLine = context.lines;
        return record;
      },
    }) as string[][];
  } catch (e) {
    if (e instanceof CsvError) {
      if (e.code === 'CSV_QUOTE_NOT_CLOSED')
        throw new RosterFileError(
          `Line ${lastLine + 1} starts a quoted cell (") that is never closed, so the rest of the file cannot be read. ` +
            'Look for a stray quotation mark on that line, or save the file again from your spreadsheet.',
        );
      throw new RosterFileError(
        `Line ${lastLine + 1} cannot be read: a quotation mark is out of place. Save the file again from your spreadsheet, or remove the quotation mark.`,
      );
    }
    throw e;
  }
  const trimmed = records.map((r) => r.map((c) => c.trim()));
  const blank = (r: string[]) => r.every((c) => c === '');
  const headerIndex = trimmed.findIndex((r) => !blank(r));
  if (headerIndex < 0) throw new RosterFileError('The file is empty: there is no header and no members in it.');
  const header = trimmed[headerIndex];
  const rows: RosterTable['rows'] = [];
  for (let i = headerIndex + 1; i < trimmed.length; i++) {
    if (blank(trimmed[i])) continue;
    rows.push({ rowNumber: i + 1, cells: trimmed[i] });
  }
  if (rows.length === 0) throw new RosterFileError('The file has a header but no members: every row below the header is empty.');
  if (rows.length > MAX_ROSTER_ROWS)
    throw new RosterFileError(
      `The file has ${rows.length.toLocaleString('en-US')} members; one import takes up to ${MAX_ROSTER_ROWS.toLocaleString('en-US')}. Split it into smaller files and import each.`,
      413,
    );
  return { delimiter, header, rows };
}
