import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import PDFDocument from 'pdfkit';
import { findUp } from '../common/find-up';
import { IsoDate, formatDate } from './dues-rules';
import { MoneyError, assertCents, formatMoney, minorUnitDigits, sumCents } from './money';

/**
 * A one-page payment receipt (US Letter) in large, high-contrast type: members are mostly older readers
 * and printed forms should be legible without magnification (TRADE.md §8.3, S86, S110–S112).
 * Amounts are integer minor units, shown with money.ts; nothing is computed in floating point.
 */

export interface ReceiptLine {
  label: string;
  amountCents: number;
}

export interface Receipt {
  guildName: string;
  guildTown?: string;
  /** e.g. "2026-0007". */
  receiptNumber: string;
  issuedOn: IsoDate;
  memberName: string;
  memberEmail?: string;
  lines: ReceiptLine[];
  /** Must equal the sum of the lines. */
  totalCents: number;
  /** ISO 4217 code, e.g. "USD". */
  currency: string;
  /** e.g. "Card ending 4242". */
  paymentMethod: string;
  paymentReference: string;
  /** The membership period paid for, if the payment is dues. */
  coversFrom?: IsoDate;
  coversThrough?: IsoDate;
  /** Locale for amounts; "en-US" unless given. */
  locale?: string;
}

/** A receipt that cannot be printed; the message lists every problem. */
export class ReceiptError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ReceiptError';
  }
}

export const MAX_RECEIPT_LINES = 10;

const PAGE: [number, number] = [612, 792]; // US Letter in points
const MARGIN = 60;
const WIDTH = PAGE[0] - 2 * MARGIN;
const AMOUNT_W = 160;
const GAP = 16;
const LABEL_W = WIDTH - AMOUNT_W - GAP;
const FIELD_LABEL_W = 150;
const HEADER_RIGHT_W = 180;
const HEADER_LEFT_W = WIDTH - HEADER_RIGHT_W - GAP;
const INK = '#000000';
const MUTED = '#333333'; // still about 12:1 on white

/**
 * The Latin subset only. The latin-ext subset (Ł, ő, ș...) is in the repo as WOFF2 alone, which pdfkit
 * cannot embed (its subsetter copies raw glyf bytes, and WOFF2 stores glyf transformed), so letters
 * outside the Latin subset are printed without their accents instead (see printable()).
 */
const FONT_FILES = {
  regular: 'atkinson-hyperlegible-next-latin-400-normal.woff',
  bold: 'atkinson-hyperlegible-next-latin-700-normal.woff',
} as const;
type FontName = keyof typeof FONT_FILES;
type Weight = FontName;

/** Letters with no decomposition to a base letter plus accents. */
const BASE_LETTER: Record<string, string> = { Ł: 'L', ł: 'l', Đ: 'D', đ: 'd', Ħ: 'H', ħ: 'h', Ŧ: 'T', ŧ: 't', Ŀ: 'L', ŀ: 'l' };

let fontCache: Record<FontName, Buffer> | null = null;
function fonts(): Record<FontName, Buffer> {
  if (!fontCache) {
    const dir = findUp('fonts', __dirname);
    const loaded = {} as Record<FontName, Buffer>;
    for (const name of Object.keys(FONT_FILES) as FontName[]) loaded[name] = readFileSync(join(dir, FONT_FILES[name]));
    fontCache = loaded;
  }
  return fontCache;
}

/**
 * The parsed fonts, kept between receipts. pdfkit accepts a parsed font object in place of the file;
 * reusing it keeps the decompressed tables and glyphs warm, which makes a receipt about 40% faster
 * (payments render one inside their transaction). Each document still makes its own subset.
 */
let parsedFonts: Partial<Record<FontName, unknown>> = {};
export function registerFonts(doc: PDFKit.PDFDocument): void {
  const files = fonts();
  for (const name of Object.keys(FONT_FILES) as FontName[]) {
    const parsed = parsedFonts[name];
    doc.registerFont(name, (parsed ?? files[name]) as Buffer);
    if (!parsed) {
      doc.font(name);
      const font = (doc as unknown as { _font?: { font?: { layout?: unknown } } })._font?.font;
      if (typeof font?.layout === 'function') parsedFonts = { ...parsedFonts, [name]: font };
    }
  }
}

const isDate = (value: unknown): boolean => {
  if (typeof value !== 'string') return false;
  try {
    formatDate(value);
    return true;
  } catch {
    return false;
  }
};
const isText = (value: unknown): value is string => typeof value === 'string' && value.trim() !== '';

/** Every problem with the receipt; empty when it can be printed. */
export function validateReceipt(receipt: Receipt): string[] {
  if (!receipt || typeof receipt !== 'object') return ['The receipt is missing.'];
  const problems: string[] = [];
  if (!isText(receipt.guildName)) problems.push('The guild name is missing.');
  if (!isText(receipt.receiptNumber)) problems.push('The receipt number is missing.');
  if (!isDate(receipt.issuedOn)) problems.push(`The issue date must be written yyyy-mm-dd, got "${String(receipt.issuedOn)}".`);
  if (!isText(receipt.memberName)) problems.push("The member's name is missing.");
  if (!isText(receipt.paymentMethod)) problems.push('The payment method is missing.');
  if (!isText(receipt.paymentReference)) problems.push('The payment reference is missing.');
  try {
    minorUnitDigits(receipt.currency);
  } catch (e) {
    problems.push(e instanceof MoneyError ? e.message : 'The currency is not valid.');
  }
  for (const key of ['coversFrom', 'coversThrough'] as const) {
    const v = receipt[key];
    if (v !== undefined && !isDate(v)) problems.push(`${key === 'coversFrom' ? 'The start' : 'The end'} of the period paid for must be written yyyy-mm-dd, got "${String(v)}".`);
  }
  if (isDate(receipt.coversFrom) && isDate(receipt.coversThrough) && receipt.coversFrom! > receipt.coversThrough!)
    problems.push('The period paid for ends before it starts.');

  if (!Array.isArray(receipt.lines) || receipt.lines.length === 0) problems.push('The receipt has no lines.');
  else {
    if (receipt.lines.length > MAX_RECEIPT_LINES) problems.push(`A receipt holds at most ${MAX_RECEIPT_LINES} lines, got ${receipt.lines.length}.`);
    let amountsOk = true;
    receipt.lines.forEach((line, i) => {
      if (!line || !isText(line.label)) problems.push(`Line ${i + 1} has no label.`);
      try {
        assertCents(line?.amountCents, `The amount on line ${i + 1}`);
      } catch (e) {
        amountsOk = false;
        problems.push((e as Error).message);
      }
    });
    try {
      assertCents(receipt.totalCents, 'The total');
      if (receipt.totalCents < 0) problems.push('The total cannot be negative.');
      else if (amountsOk && sumCents(receipt.lines.map((l) => l.amountCents)) !== receipt.totalCents)
        problems.push('The total does not match the sum of the lines.');
    } catch (e) {
      problems.push((e as Error).message);
    }
  }
  return problems;
}

type Doc = PDFKit.PDFDocument;

interface TextStyle {
  weight?: Weight;
  size: number;
  color?: string;
  width: number;
  align?: 'left' | 'right';
}

/** Which code points a registered font has (pdfkit keeps the fontkit font on the current font). */
function coverage(doc: Doc, name: FontName): (codePoint: number) => boolean {
  doc.font(name);
  const font = (doc as unknown as { _font?: { font?: { hasGlyphForCodePoint?: (cp: number) => boolean } } })._font?.font;
  return typeof font?.hasGlyphForCodePoint === 'function' ? (cp) => font.hasGlyphForCodePoint!(cp) : () => true;
}

class Writer {
  private readonly has: Record<FontName, (cp: number) => boolean>;

  constructor(private readonly doc: Doc) {
    this.has = { regular: coverage(doc, 'regular'), bold: coverage(doc, 'bold') };
  }

  private drawable(ch: string): boolean {
    const cp = ch.codePointAt(0)!;
    return this.has.regular(cp) && this.has.bold(cp);
  }

  /** Whether the fonts can draw every character of the text. */
  covers(text: string): boolean {
    return [...text].every((ch) => this.drawable(ch));
  }

  /**
   * The text in characters the fonts have: a letter the fonts lack loses its accents (ő → o, Ł → L),
   * an unusual space becomes a plain one, and anything else becomes "?" rather than an empty box.
   */
  printable(text: string): string {
    let out = '';
    for (const ch of text) {
      if (this.drawable(ch)) out += ch;
      else if (/\s/u.test(ch)) out += ' ';
      else {
        const base = BASE_LETTER[ch] ?? ch.normalize('NFD').replace(/\p{M}/gu, '');
        out += base !== '' && this.covers(base) ? base : '?';
      }
    }
    return out;
  }

  /** Draws text at (x, y) and returns the y just below it. */
  text(value: string, x: number, y: number, style: TextStyle): number {
    const doc = this.doc;
    const text = this.printable(value.replace(/[\u0000-\u001f\u007f]+/g, ' ').trim());
    const options = { width: style.width, align: style.align ?? 'left' };
    doc
      .font(style.weight ?? 'regular')
      .fontSize(style.size)
      .fillColor(style.color ?? INK);
    const height = doc.heightOfString(text, options);
    doc.text(text, x, y, options);
    return y + height;
  }

  rule(y: number, thickness = 1): void {
    this.doc.save().lineWidth(thickness).strokeColor(INK).moveTo(MARGIN, y).lineTo(MARGIN + WIDTH, y).stroke().restore();
  }
}

/** The receipt as a one-page PDF. Throws ReceiptError listing every problem with the input. */
export async function renderReceiptPdf(receipt: Receipt): Promise<Buffer> {
  const problems = validateReceipt(receipt);
  if (problems.length > 0) throw new ReceiptError(`The receipt cannot be printed: ${problems.join(' ')}`);

  // The issue date stands in for "now" so the same receipt always renders to the same bytes.
  const issued = new Date(`${receipt.issuedOn}T12:00:00Z`);
  const doc = new PDFDocument({
    size: PAGE,
    margin: MARGIN,
    bufferPages: true,
    displayTitle: true,
    lang: 'en',
    info: {
      Title: `Receipt ${receipt.receiptNumber} — ${receipt.guildName}`,
      Author: receipt.guildName,
      Subject: `Payment receipt for ${receipt.memberName}`,
      CreationDate: issued,
      ModDate: issued,
    },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const finished = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  registerFonts(doc);
  const w = new Writer(doc);

  const locale = receipt.locale ?? 'en-US';
  /** An amount in the fonts' characters: odd spaces become plain ones; a missing symbol becomes the code. */
  const money = (cents: number): string => {
    const shown = formatMoney(cents, receipt.currency, locale).replace(/\s/gu, ' ');
    return w.covers(shown) ? shown : formatMoney(cents, receipt.currency, locale, 'code').replace(/\s/gu, ' ');
  };

  // Header: the guild on the left; "Receipt", its number and date on the right.
  let left = w.text(receipt.guildName, MARGIN, MARGIN, { weight: 'bold', size: 22, width: HEADER_LEFT_W });
  if (isText(receipt.guildTown)) left = w.text(receipt.guildTown, MARGIN, left + 2, { size: 15, color: MUTED, width: HEADER_LEFT_W });
  const rightX = MARGIN + WIDTH - HEADER_RIGHT_W;
  const right = { width: HEADER_RIGHT_W, align: 'right' as const };
  let top = w.text('Receipt', rightX, MARGIN - 4, { weight: 'bold', size: 30, ...right });
  top = w.text(`No. ${receipt.receiptNumber.trim()}`, rightX, top, { weight: 'bold', size: 16, ...right });
  top = w.text(formatDate(receipt.issuedOn), rightX, top + 2, { size: 16, ...right });
  let y = Math.max(left, top) + 12;
  w.rule(y, 1.5);
  y += 16;

  const field = (label: string, values: string[], top: number): number => {
    w.text(label, MARGIN, top + 2, { size: 14, color: MUTED, width: FIELD_LABEL_W });
    let bottom = top;
    values.forEach((value, i) => {
      bottom = w.text(value, MARGIN + FIELD_LABEL_W, bottom, { weight: i === 0 ? 'bold' : 'regular', size: 16, width: WIDTH - FIELD_LABEL_W });
    });
    return bottom + 8;
  };

  y = field('Received from', [receipt.memberName, ...(isText(receipt.memberEmail) ? [receipt.memberEmail] : [])], y);
  const period =
    receipt.coversFrom && receipt.coversThrough
      ? `${formatDate(receipt.coversFrom)} to ${formatDate(receipt.coversThrough)}`
      : receipt.coversThrough
        ? `Through ${formatDate(receipt.coversThrough)}`
        : receipt.coversFrom
          ? `From ${formatDate(receipt.coversFrom)}`
          : null;
  if (period) y = field('Membership', [period], y);

  // The lines, amounts right-aligned in their own column.
  y += 14;
  w.text('Item', MARGIN, y, { weight: 'bold', size: 14, width: LABEL_W });
  y = w.text('Amount', MARGIN + LABEL_W + GAP, y, { weight: 'bold', size: 14, width: AMOUNT_W, align: 'right' });
  y += 4;
  w.rule(y, 0.75);
  y += 8;
  for (const line of receipt.lines) {
    const labelBottom = w.text(line.label, MARGIN, y, { size: 16, width: LABEL_W });
    const amountBottom = w.text(money(line.amountCents), MARGIN + LABEL_W + GAP, y, { size: 16, width: AMOUNT_W, align: 'right' });
    y = Math.max(labelBottom, amountBottom) + 4;
  }
  w.rule(y, 1.5);
  y += 10;
  w.text('Total paid', MARGIN, y, { weight: 'bold', size: 20, width: LABEL_W });
  y = w.text(money(receipt.totalCents), MARGIN + LABEL_W + GAP, y, { weight: 'bold', size: 20, width: AMOUNT_W, align: 'right' });
  y += 22;

  y = field('Paid by', [receipt.paymentMethod], y);
  y = field('Reference', [receipt.paymentReference], y);
  y += 22;

  y = w.text(`Thank you for supporting ${receipt.guildName.trim()}.`, MARGIN, y, { weight: 'bold', size: 18, width: WIDTH });
  w.text('Please keep this receipt for your records.', MARGIN, y + 6, { size: 14, color: MUTED, width: WIDTH });

  const pages = doc.bufferedPageRange().count;
  doc.end();
  const pdf = await finished;
  if (pages !== 1) throw new ReceiptError('The receipt does not fit on one page; shorten the line labels or use fewer lines.');
  return pdf;
}
