import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import PDFDocument from 'pdfkit';
import { findUp } from '../../common/find-up';

/**
 * Shared pieces for the show's printed sheets: the fonts, a document that collects itself into a Buffer,
 * text that is measured before it is drawn (so it can shrink or be shortened to fit its box), dashed cut
 * lines, a flowing table that repeats its header on every page, and page footers.
 *
 * Every layout works in PDF points (1/72 inch) from the page's top-left corner. Documents are made with
 * no margins so pdfkit never adds a page by itself: each renderer decides where every line goes.
 */

export type Doc = PDFKit.PDFDocument;
export type Weight = 'regular' | 'bold' | 'italic';
export type Align = 'left' | 'center' | 'right';

export const LETTER_PORTRAIT: [number, number] = [612, 792];
export const LETTER_LANDSCAPE: [number, number] = [792, 612];
export const INK = '#000000';
/** Secondary text; still about 12:1 on white. */
export const MUTED = '#333333';
/** Dashed cut lines: light enough not to compete with the text, dark enough to cut along. */
export const CUT_GREY = '#8c8c8c';
/** Thin rules between table rows. */
export const RULE_GREY = '#6b6b6b';
/** Table header band. */
export const BAND_GREY = '#e6e6e6';

/** Printed at the foot of every sheet that is cut apart. */
export const CUT_CAUTION = 'Cut on the dashed lines; keep fingers clear of the rotary cutter blade and close it after each cut.';

export interface RenderOptions {
  /** Stamped into the PDF's metadata; pdfkit uses the current time when it is not given. */
  createdAt?: Date;
  /** Compress the content streams (the default). */
  compress?: boolean;
}

/**
 * The Latin subset only: the latin-ext files are WOFF2, which pdfkit cannot embed, so letters outside
 * the Latin subset are printed without their accents instead (see printable()).
 */
const FONT_FILES: Record<Weight, string> = {
  regular: 'atkinson-hyperlegible-next-latin-400-normal.woff',
  bold: 'atkinson-hyperlegible-next-latin-700-normal.woff',
  italic: 'atkinson-hyperlegible-next-latin-400-italic.woff',
};
const WEIGHTS = Object.keys(FONT_FILES) as Weight[];

/** Letters with no decomposition to a base letter plus accents. */
const BASE_LETTER: Record<string, string> = { Ł: 'L', ł: 'l', Đ: 'D', đ: 'd', Ħ: 'H', ħ: 'h', Ŧ: 'T', ŧ: 't', Ŀ: 'L', ŀ: 'l' };

let fileCache: Record<Weight, Buffer> | null = null;
function fontFiles(): Record<Weight, Buffer> {
  if (!fileCache) {
    const dir = findUp('fonts', __dirname);
    const loaded = {} as Record<Weight, Buffer>;
    for (const w of WEIGHTS) loaded[w] = readFileSync(join(dir, FONT_FILES[w]));
    fileCache = loaded;
  }
  return fileCache;
}

interface FontkitFont {
  layout?: unknown;
  hasGlyphForCodePoint?: (cp: number) => boolean;
}
const currentFont = (doc: Doc): FontkitFont | undefined => (doc as unknown as { _font?: { font?: FontkitFont } })._font?.font;

/** Parsed fonts kept between documents (pdfkit accepts them in place of the file); each PDF still embeds its own subset. */
let parsedFonts: Partial<Record<Weight, FontkitFont>> = {};

export function registerFonts(doc: Doc): void {
  const files = fontFiles();
  for (const w of WEIGHTS) {
    const parsed = parsedFonts[w];
    doc.registerFont(w, (parsed ?? files[w]) as Buffer);
    if (!parsed) {
      doc.font(w);
      const font = currentFont(doc);
      if (typeof font?.layout === 'function') parsedFonts = { ...parsedFonts, [w]: font };
    }
  }
}

const coverageCache = new WeakMap<Doc, (cp: number) => boolean>();
function coverage(doc: Doc): (cp: number) => boolean {
  let has = coverageCache.get(doc);
  if (!has) {
    const checks = WEIGHTS.map((w) => {
      doc.font(w);
      const font = currentFont(doc);
      return typeof font?.hasGlyphForCodePoint === 'function' ? (cp: number) => font.hasGlyphForCodePoint!(cp) : () => true;
    });
    has = (cp) => checks.every((check) => check(cp));
    coverageCache.set(doc, has);
  }
  return has;
}

/**
 * The text on one line of characters the fonts can draw: control characters and line breaks become
 * spaces, a letter the fonts lack loses its accents (ő → o, Ł → L), and anything else becomes "?"
 * rather than an empty box.
 */
export function printable(doc: Doc, text: string): string {
  const has = coverage(doc);
  const covers = (s: string) => [...s].every((ch) => has(ch.codePointAt(0)!));
  let out = '';
  for (const ch of String(text ?? '').replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, ' ')) {
    if (has(ch.codePointAt(0)!)) out += ch;
    else if (/\s/u.test(ch)) out += ' ';
    else {
      const base = BASE_LETTER[ch] ?? ch.normalize('NFD').replace(/\p{M}/gu, '');
      out += base !== '' && covers(base) ? base : '?';
    }
  }
  return out.replace(/ {2,}/g, ' ').trim();
}

/** Whether the fonts can draw every character of the text. */
export function covers(doc: Doc, text: string): boolean {
  const has = coverage(doc);
  return [...text].every((ch) => has(ch.codePointAt(0)!));
}

export interface OpenDocument {
  doc: Doc;
  /** Ends the document and resolves with its bytes. */
  finish(): Promise<Buffer>;
}

/** A new document with the fonts registered and no margins; the first page is already there. */
export function openDocument(
  meta: { size: [number, number]; title: string; author: string; subject: string },
  options: RenderOptions = {},
): OpenDocument {
  const info: PDFKit.DocumentInfo = { Title: meta.title, Author: meta.author, Subject: meta.subject, Creator: 'Selvage' };
  if (options.createdAt) {
    info.CreationDate = options.createdAt;
    info.ModDate = options.createdAt;
  }
  const doc = new PDFDocument({
    size: meta.size,
    margin: 0,
    bufferPages: true,
    compress: options.compress ?? true,
    displayTitle: true,
    lang: 'en',
    info,
  });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  registerFonts(doc);
  doc.font('regular').fillColor(INK).strokeColor(INK);
  return {
    doc,
    finish: () => {
      doc.end();
      return done;
    },
  };
}

export interface TextStyle {
  weight?: Weight;
  size: number;
  width: number;
  align?: Align;
  color?: string;
  /** Extra space between letters, in points. */
  characterSpacing?: number;
}

function apply(doc: Doc, style: TextStyle): PDFKit.Mixins.TextOptions {
  doc
    .font(style.weight ?? 'regular')
    .fontSize(style.size)
    .fillColor(style.color ?? INK);
  return { width: style.width, align: style.align ?? 'left', characterSpacing: style.characterSpacing ?? 0, lineGap: 0 };
}

/** The height the text takes, wrapped to the style's width (the text is used as given). */
export function measure(doc: Doc, text: string, style: TextStyle): number {
  if (text === '') return 0;
  return doc.heightOfString(text, apply(doc, style));
}

/** The height of one line in this style. */
export function lineHeight(doc: Doc, style: Omit<TextStyle, 'width'>): number {
  return measure(doc, 'Hg', { ...style, width: 10_000 });
}

/** Draws text already made printable at (x, y), wrapped to the style's width; returns the y just below it. */
export function drawText(doc: Doc, text: string, x: number, y: number, style: TextStyle): number {
  if (text === '') return y;
  const options = apply(doc, style);
  const height = doc.heightOfString(text, options);
  doc.text(text, x, y, options);
  return y + height;
}

export interface Fitted {
  text: string;
  size: number;
  height: number;
  /** True when the text had to be shortened (it ends with "…"). */
  shortened: boolean;
}

export interface FitRule {
  weight?: Weight;
  width: number;
  align?: Align;
  color?: string;
  characterSpacing?: number;
  /** The size to try first. */
  maxSize: number;
  /** The smallest size allowed; below it the text is shortened instead. Defaults to maxSize. */
  minSize?: number;
  /** The tallest the text may be. */
  maxHeight?: number;
  /** The most lines it may take (combined with maxHeight when both are given). */
  maxLines?: number;
}

const SIZE_STEP = 0.5;

/** The tallest a text may be in this style under the rule's height and line limits. */
function heightLimit(doc: Doc, rule: FitRule, size: number): number {
  let limit = rule.maxHeight ?? Infinity;
  if (rule.maxLines !== undefined) {
    const style = { weight: rule.weight, size, characterSpacing: rule.characterSpacing };
    const one = lineHeight(doc, style);
    const two = measure(doc, 'Hg\nHg', { ...style, width: 10_000 });
    limit = Math.min(limit, one + (rule.maxLines - 1) * (two - one));
  }
  return limit + 0.01;
}

/**
 * The text made printable and fitted into the rule's box: the largest size from maxSize down to minSize
 * (in half points) at which it fits, else minSize with the text cut short at a word and ended with "…".
 * The height returned never exceeds the limit, so a box laid out from it cannot spill into the next one.
 */
export function fitText(doc: Doc, raw: string, rule: FitRule): Fitted {
  const text = printable(doc, raw);
  const minSize = Math.min(rule.minSize ?? rule.maxSize, rule.maxSize);
  const style = (size: number): TextStyle => ({
    weight: rule.weight,
    size,
    width: rule.width,
    align: rule.align,
    characterSpacing: rule.characterSpacing,
  });
  if (text === '') return { text, size: rule.maxSize, height: 0, shortened: false };
  for (let size = rule.maxSize; size >= minSize - 1e-9; size -= SIZE_STEP) {
    const height = measure(doc, text, style(size));
    if (height <= heightLimit(doc, rule, size)) return { text, size, height, shortened: false };
  }
  // Shorten at the smallest size: the longest prefix that fits with an ellipsis.
  const size = minSize;
  const limit = heightLimit(doc, rule, size);
  const chars = [...text];
  const candidate = (n: number): string => {
    let head = chars.slice(0, n).join('');
    const space = head.lastIndexOf(' ');
    // Cut at a word when one ends near the cut, so no word is left half-printed.
    if (n < chars.length && space > 0 && head.length - space <= 16) head = head.slice(0, space);
    return `${head.replace(/[\s,;:.\-–—]+$/u, '')}…`;
  };
  let lo = 0;
  let hi = chars.length - 1;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (measure(doc, candidate(mid), style(size)) <= limit) lo = mid;
    else hi = mid - 1;
  }
  const shortened = lo > 0 ? candidate(lo) : '…';
  const height = measure(doc, shortened, style(size));
  if (height > limit) return { text: '', size, height: 0, shortened: true };
  return { text: shortened, size, height, shortened: true };
}

/** Draws a fitted text; returns the y just below it. */
export function drawFitted(doc: Doc, fitted: Fitted, x: number, y: number, rule: FitRule): number {
  return drawText(doc, fitted.text, x, y, {
    weight: rule.weight,
    size: fitted.size,
    width: rule.width,
    align: rule.align,
    color: rule.color,
    characterSpacing: rule.characterSpacing,
  });
}

/** Fits and draws in one step; returns the y just below the text. */
export function fitAndDraw(doc: Doc, raw: string, x: number, y: number, rule: FitRule): number {
  return drawFitted(doc, fitText(doc, raw, rule), x, y, rule);
}

/** "Ann", "Ann and Bea", "Ann, Bea and Cy". */
export function joinNames(names: readonly string[]): string {
  const clean = names.map((n) => String(n ?? '').trim()).filter((n) => n !== '');
  if (clean.length <= 1) return clean[0] ?? '';
  return `${clean.slice(0, -1).join(', ')} and ${clean[clean.length - 1]}`;
}

/** "No. 17", or "No. —" for an entry not numbered yet. */
export function entryLabel(entryNumber: number | null | undefined): string {
  return entryNumber === null || entryNumber === undefined ? 'No. —' : `No. ${entryNumber}`;
}

/**
 * A grid of equal cells with dashed cut lines on every edge, shared edges drawn once so each cut is a
 * single line.
 */
export function drawCutGrid(doc: Doc, grid: { left: number; top: number; cellWidth: number; cellHeight: number; columns: number; rows: number }): void {
  const { left, top, cellWidth, cellHeight, columns, rows } = grid;
  const right = left + columns * cellWidth;
  const bottom = top + rows * cellHeight;
  doc.save().lineWidth(0.75).strokeColor(CUT_GREY).dash(6, { space: 4 });
  for (let c = 0; c <= columns; c++) doc.moveTo(left + c * cellWidth, top).lineTo(left + c * cellWidth, bottom);
  for (let r = 0; r <= rows; r++) doc.moveTo(left, top + r * cellHeight).lineTo(right, top + r * cellHeight);
  doc.stroke().undash().restore();
}

export function rule(doc: Doc, x1: number, x2: number, y: number, thickness = 1, color = INK): void {
  doc.save().lineWidth(thickness).strokeColor(color).moveTo(x1, y).lineTo(x2, y).stroke().restore();
}

/** Runs `draw` on every page once the content is laid out (footers, page numbers, banners). */
export function eachPage(doc: Doc, draw: (index: number, count: number) => void): void {
  const range = doc.bufferedPageRange();
  for (let i = 0; i < range.count; i++) {
    doc.switchToPage(range.start + i);
    draw(i, range.count);
  }
}

/** The area content may fill on each page, and where the next line goes. */
export class Flow {
  y: number;

  constructor(
    readonly doc: Doc,
    readonly left: number,
    readonly width: number,
    readonly top: number,
    readonly bottom: number,
    /** Called on every page added by the flow, with the flow's y at `top`; it may move y down. */
    private readonly onNewPage: (flow: Flow) => void = () => undefined,
  ) {
    this.y = top;
  }

  get room(): number {
    return this.bottom - this.y;
  }

  newPage(): void {
    this.doc.addPage();
    this.y = this.top;
    this.onNewPage(this);
  }

  /** Starts a new page unless `height` fits below y. */
  need(height: number): void {
    if (this.y + height > this.bottom + 0.01) this.newPage();
  }
}

export interface Column {
  header: string;
  width: number;
  align?: Align;
}

export interface Cell {
  text: string;
  weight?: Weight;
  /** A second, smaller line in regular type under the text, e.g. a qualifier. */
  note?: string;
}

export interface TableLook {
  size: number;
  headerSize: number;
  padX: number;
  padY: number;
  /** A cell longer than this is cut short with "…", so every row fits on a page. */
  maxLines: number;
}

export const TABLE_LOOK: TableLook = { size: 12, headerSize: 11.5, padX: 4, padY: 4, maxLines: 6 };

interface FittedCell {
  fitted: Fitted;
  rule: FitRule;
  note?: { fitted: Fitted; rule: FitRule };
}

interface FittedRow {
  cells: FittedCell[];
  height: number;
}

/**
 * A table that flows down the pages. `heading(continued)` draws whatever goes above the table (a section
 * heading) at flow.y and moves flow.y below it; it is drawn again, with continued = true, above the
 * repeated header on each new page. The heading, header and first row are kept together.
 */
export function drawTable(
  flow: Flow,
  columns: readonly Column[],
  rows: readonly (string | Cell)[][],
  options: { look?: TableLook; heading?: (continued: boolean) => void; headingHeight?: number } = {},
): void {
  const doc = flow.doc;
  const look = options.look ?? TABLE_LOOK;
  const total = columns.reduce((sum, c) => sum + c.width, 0);
  if (total > flow.width + 0.01) throw new Error(`The table is ${total} pt wide but the page has room for ${flow.width} pt.`);

  const fitRow = (row: readonly (string | Cell)[], header: boolean): FittedRow => {
    const cells = columns.map((col, i): FittedCell => {
      const cell = row[i] ?? '';
      const { text, weight, note } = typeof cell === 'string' ? { text: cell, weight: undefined, note: undefined } : cell;
      const rule: FitRule = {
        weight: header ? 'bold' : (weight ?? 'regular'),
        width: col.width - 2 * look.padX,
        align: col.align,
        maxSize: header ? look.headerSize : look.size,
        maxLines: look.maxLines,
      };
      const fitted: FittedCell = { fitted: fitText(doc, text, rule), rule };
      if (note) {
        const noteRule: FitRule = { ...rule, weight: 'regular', maxSize: Math.max(8, look.size - 1.5) };
        fitted.note = { fitted: fitText(doc, note, noteRule), rule: noteRule };
      }
      return fitted;
    });
    const cellHeight = (c: FittedCell) => c.fitted.height + (c.note?.fitted.height ?? 0);
    const height = Math.max(lineHeight(doc, { size: header ? look.headerSize : look.size }), ...cells.map(cellHeight)) + 2 * look.padY;
    return { cells, height };
  };

  const drawRow = (row: FittedRow, header: boolean): void => {
    const y = flow.y;
    if (header) doc.save().rect(flow.left, y, total, row.height).fill(BAND_GREY).restore();
    let x = flow.left;
    row.cells.forEach(({ fitted, rule: r, note }, i) => {
      const below = drawFitted(doc, fitted, x + look.padX, y + look.padY, r);
      if (note) drawFitted(doc, note.fitted, x + look.padX, below, note.rule);
      x += columns[i].width;
    });
    flow.y = y + row.height;
    rule(doc, flow.left, flow.left + total, flow.y, header ? 1.25 : 0.5, header ? INK : RULE_GREY);
  };

  const header = fitRow(
    columns.map((c) => c.header),
    true,
  );
  const fitted = rows.map((r) => fitRow(r, false));
  flow.need((options.headingHeight ?? 0) + header.height + (fitted[0]?.height ?? 0));
  options.heading?.(false);
  drawRow(header, true);
  for (const row of fitted) {
    if (flow.y + row.height > flow.bottom + 0.01) {
      flow.newPage();
      options.heading?.(true);
      drawRow(header, true);
    }
    drawRow(row, false);
  }
}
