import { formatMoney } from '../../dues/money';
import {
  CUT_CAUTION,
  Doc,
  FitRule,
  Fitted,
  INK,
  LETTER_PORTRAIT,
  MUTED,
  RenderOptions,
  covers,
  drawCutGrid,
  drawFitted,
  drawText,
  entryLabel,
  fitAndDraw,
  fitText,
  joinNames,
  openDocument,
  printable,
  rule,
} from './pdf-tools';

/**
 * Hang tags for the quilts at the show: four tags of about 4 x 5 inches on each Letter page, with dashed
 * lines to cut along. Every piece of text is fitted to its own box before it is drawn (smaller type,
 * then shortened with "…"), so a long title can never run into the next tag.
 */

export interface HangTagEntry {
  entryNumber: number | null;
  title: string;
  categoryName: string;
  /** Already written for print, e.g. "60 1/2 x 72 in". */
  sizeText: string;
  makers: string[];
  /** Who quilted it; empty when not given. */
  quilter: string;
  forSale: boolean;
  /** Minor units of `currency`; null for "For sale" with no price. */
  priceCents: number | null;
}

export interface HangTagsInput {
  guildName: string;
  showName: string;
  /** While judging is on, the makers' names are left off the tags. */
  hideMakers: boolean;
  /** ISO 4217 code, e.g. "USD". */
  currency: string;
  entries: HangTagEntry[];
}

/** Tag size: 3 7/8 x 4 7/8 inches, so the cut lines stay well inside what printers can reach. */
export const TAG_WIDTH = 279;
export const TAG_HEIGHT = 351;
export const TAG_COLUMNS = 2;
export const TAG_ROWS = 2;
export const TAGS_PER_PAGE = TAG_COLUMNS * TAG_ROWS;
const [PAGE_W] = LETTER_PORTRAIT;
export const TAG_GRID_LEFT = (PAGE_W - TAG_COLUMNS * TAG_WIDTH) / 2;
export const TAG_GRID_TOP = 36;
const PAD = 18;
const INNER_W = TAG_WIDTH - 2 * PAD;
const GAP = 4;
const SALE_PAD_X = 6;
const SALE_PAD_Y = 4;

export const MAKERS_HIDDEN = "Maker's name hidden until judging is done";
export const NO_ENTRIES = 'There are no entries to print yet.';

/** The top-left corner of the tag in slot 0–3 of a page (left to right, then down). */
export function tagOrigin(slot: number): { x: number; y: number } {
  return { x: TAG_GRID_LEFT + (slot % TAG_COLUMNS) * TAG_WIDTH, y: TAG_GRID_TOP + Math.floor(slot / TAG_COLUMNS) * TAG_HEIGHT };
}

function priceText(doc: Doc, cents: number, currency: string): string {
  const shown = formatMoney(cents, currency).replace(/\s/gu, ' ');
  return covers(doc, shown) ? shown : formatMoney(cents, currency, 'en-US', 'code').replace(/\s/gu, ' ');
}

/** Type sizes for one tag, largest first; a tag with a long title or long names steps down until the title fits. */
const SCALES = [
  { number: 56, detail: 14, title: 26, titleMin: 12 },
  { number: 44, detail: 12.5, title: 22, titleMin: 12 },
  { number: 36, detail: 11, title: 20, titleMin: 10 },
  { number: 30, detail: 10, title: 18, titleMin: 9 },
] as const;

interface Placed {
  fitted: Fitted;
  rule: FitRule;
  x: number;
  y: number;
  /** Drawn with a box round it. */
  box?: { height: number };
}

/** Where every piece of one tag goes, at one scale; null when the title would have to be shortened and `last` is false. */
function layoutTag(doc: Doc, input: HangTagsInput, entry: HangTagEntry, x: number, y: number, scale: (typeof SCALES)[number], last: boolean): Placed[] | null {
  const left = x + PAD;
  const bottom = y + TAG_HEIGHT - PAD;
  const placed: Placed[] = [];
  const place = (raw: string, top: number, rule: FitRule): number => {
    const fitted = fitText(doc, raw, rule);
    placed.push({ fitted, rule, x: left, y: top });
    return top + fitted.height;
  };
  let cursor = y + PAD - 2;

  // Guild and show, small, at the top, over a thin rule (drawn by drawTag).
  cursor = place(input.guildName, cursor, { width: INNER_W, maxSize: 11, minSize: 8, maxLines: 1, color: MUTED });
  cursor = place(input.showName, cursor, { weight: 'bold', width: INNER_W, maxSize: 12, minSize: 9, maxLines: 2 });
  cursor += 8;

  // The entry number, as large as it fits on one line.
  cursor = place(entryLabel(entry.entryNumber), cursor, { weight: 'bold', width: INNER_W, maxSize: scale.number, minSize: 24, maxLines: 1 });
  cursor += GAP;

  // The details, stacked up from the bottom of the tag so the title gets whatever room is left.
  const details: { text: string; rule: FitRule; boxed?: boolean }[] = [];
  const detail = (text: string, extra: Partial<FitRule> = {}) =>
    details.push({ text, rule: { width: INNER_W, maxSize: scale.detail, minSize: Math.min(10, scale.detail), maxLines: 2, ...extra } });
  if (entry.categoryName?.trim()) detail(`Category: ${entry.categoryName}`);
  if (entry.sizeText?.trim()) detail(`Size: ${entry.sizeText}`, { maxLines: 1 });
  if (input.hideMakers) detail(MAKERS_HIDDEN, { weight: 'italic', maxSize: scale.detail - 1 });
  else {
    const makers = joinNames(entry.makers ?? []);
    if (makers) detail(`Made by ${makers}`);
    if (entry.quilter?.trim()) detail(`Quilted by ${entry.quilter.trim()}`);
  }
  if (entry.forSale) {
    const sale = entry.priceCents === null || entry.priceCents === undefined ? 'For sale' : `For sale: ${priceText(doc, entry.priceCents, input.currency)}`;
    details.push({ text: sale, boxed: true, rule: { weight: 'bold', width: INNER_W - 2 * SALE_PAD_X, maxSize: scale.detail + 2, minSize: 11, maxLines: 1 } });
  }
  const fitted = details.map((d) => ({ ...d, fitted: fitText(doc, d.text, d.rule) }));
  const heightOf = (d: (typeof fitted)[number]) => d.fitted.height + (d.boxed ? 2 * SALE_PAD_Y : 0);
  const detailsTop = bottom - fitted.reduce((sum, d) => sum + heightOf(d), 0) - GAP * Math.max(0, fitted.length - 1);

  // The title between the number and the details.
  const titleRule: FitRule = { weight: 'bold', width: INNER_W, maxSize: scale.title, minSize: scale.titleMin, maxHeight: Math.max(0, detailsTop - 8 - cursor) };
  const title = fitText(doc, entry.title, titleRule);
  if (title.shortened && !last) return null;
  placed.push({ fitted: title, rule: titleRule, x: left, y: cursor });

  let d = detailsTop;
  for (const item of fitted) {
    if (item.boxed) {
      placed.push({ fitted: item.fitted, rule: item.rule, x: left + SALE_PAD_X, y: d + SALE_PAD_Y, box: { height: heightOf(item) } });
      d += heightOf(item) + GAP;
    } else {
      placed.push({ fitted: item.fitted, rule: item.rule, x: left, y: d });
      d += item.fitted.height + GAP;
    }
  }
  return placed;
}

function drawTag(doc: Doc, input: HangTagsInput, entry: HangTagEntry, x: number, y: number): void {
  let placed: Placed[] | null = null;
  for (let i = 0; i < SCALES.length && !placed; i++) placed = layoutTag(doc, input, entry, x, y, SCALES[i], i === SCALES.length - 1);
  for (const [i, p] of placed!.entries()) {
    if (p.box) doc.save().lineWidth(1.25).strokeColor(INK).rect(x + PAD, p.y - SALE_PAD_Y, INNER_W, p.box.height).stroke().restore();
    drawFitted(doc, p.fitted, p.x, p.y, p.rule);
    // The rule under the guild and show names.
    if (i === 1) rule(doc, x + PAD, x + PAD + INNER_W, p.y + p.fitted.height + 4, 0.75, MUTED);
  }
}

/** The hang tags as a PDF, four to a page, in the order given. */
export async function renderHangTags(input: HangTagsInput, options: RenderOptions = {}): Promise<Buffer> {
  if (!input || !Array.isArray(input.entries)) throw new TypeError('Hang tags need a list of entries.');
  const { doc, finish } = openDocument(
    {
      size: LETTER_PORTRAIT,
      title: `Hang tags — ${input.showName}`,
      author: input.guildName,
      subject: `Hang tags for the quilts in ${input.showName}`,
    },
    options,
  );

  if (input.entries.length === 0) {
    let y = 72;
    y = fitAndDraw(doc, input.guildName, 72, y, { width: PAGE_W - 144, maxSize: 16, minSize: 11, maxLines: 2, color: MUTED });
    y = fitAndDraw(doc, input.showName, 72, y + 4, { weight: 'bold', width: PAGE_W - 144, maxSize: 24, minSize: 14, maxLines: 2 });
    drawText(doc, printable(doc, NO_ENTRIES), 72, y + 24, { size: 20, width: PAGE_W - 144 });
    return finish();
  }

  const pages = Math.ceil(input.entries.length / TAGS_PER_PAGE);
  for (let page = 0; page < pages; page++) {
    if (page > 0) doc.addPage();
    const onPage = input.entries.slice(page * TAGS_PER_PAGE, (page + 1) * TAGS_PER_PAGE);
    onPage.forEach((entry, slot) => {
      const { x, y } = tagOrigin(slot);
      drawTag(doc, input, entry, x, y);
    });
    // Cut lines round the rows in use (a last page with one or two tags cuts as a half sheet).
    const rows = Math.ceil(onPage.length / TAG_COLUMNS);
    drawCutGrid(doc, { left: TAG_GRID_LEFT, top: TAG_GRID_TOP, cellWidth: TAG_WIDTH, cellHeight: TAG_HEIGHT, columns: TAG_COLUMNS, rows });
    const captionTop = TAG_GRID_TOP + TAG_ROWS * TAG_HEIGHT + 14;
    fitAndDraw(doc, CUT_CAUTION, TAG_GRID_LEFT, captionTop, { width: TAG_COLUMNS * TAG_WIDTH, align: 'center', maxSize: 10, minSize: 8, maxLines: 2 });
  }
  return finish();
}
