import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import PDFDocument from 'pdfkit';
import { findUp } from '../common/find-up';
import { CARD } from './card-geometry';
import { loadOpenCv } from './measure/opencv';

/**
 * The printable reference card: one page with the card (markers, test square, two ruler bars) drawn
 * from card-geometry.ts, then large-type instructions. Every length on the card comes from CARD; this
 * file only decides where text goes.
 */

export type Paper = 'letter' | 'a4';
export const PAPERS: readonly Paper[] = ['letter', 'a4'];

/** Page sizes in PDF points (1/72 inch). */
export const PAGE_SIZE_PT: Record<Paper, [number, number]> = {
  letter: [612, 792],
  a4: [595.28, 841.89],
};

/** Millimetres to PDF points, exactly (1 inch = 25.4 mm = 72 pt). */
export const mm = (value: number): number => (value * 72) / 25.4;

export interface RenderOptions {
  /** Leave content streams uncompressed (tests read the text); production output is compressed. */
  compress?: boolean;
}

// Layout choices (mm) that are not card geometry.
const CARD_TOP_MM = 16;
const CUT_MARGIN_MM = 4;
const PAGE_BOTTOM_MARGIN_MM = 12;
const INK = '#000000';
const PAPER_WHITE = '#ffffff';
/** Cells across a marker, border included (a 4x4 dictionary plus a one-cell black border). */
const MARKER_CELLS = 6;

const FONT_FILES = {
  regular: 'atkinson-hyperlegible-next-latin-400-normal.woff',
  bold: 'atkinson-hyperlegible-next-latin-700-normal.woff',
  italic: 'atkinson-hyperlegible-next-latin-400-italic.woff',
} as const;
type FontName = keyof typeof FONT_FILES;

let fontCache: Record<FontName, Buffer> | null = null;
function fonts(): Record<FontName, Buffer> {
  if (!fontCache) {
    const dir = findUp('fonts', __dirname);
    fontCache = {
      regular: readFileSync(join(dir, FONT_FILES.regular)),
      bold: readFileSync(join(dir, FONT_FILES.bold)),
      italic: readFileSync(join(dir, FONT_FILES.italic)),
    };
  }
  return fontCache;
}

/** Minimal view of the ArUco parts of opencv-js (its typings do not cover them). */
interface ArucoCv {
  DICT_4X4_50: number;
  Mat: new () => { rows: number; cols: number; data: Uint8Array; delete(): void };
  getPredefinedDictionary(type: number): { delete(): void };
  generateImageMarker(dictionary: unknown, id: number, sidePixels: number, img: unknown, borderBits: number): void;
}

let bitsCache: Map<number, boolean[][]> | null = null;

/**
 * Each card marker as a 6x6 grid, true = black, border included, rendered by OpenCV itself from the
 * predefined dictionary so the card always matches what the detector looks for.
 */
export async function markerBits(): Promise<Map<number, boolean[][]>> {
  if (bitsCache) return bitsCache;
  const cv = (await loadOpenCv()) as unknown as ArucoCv;
  if (CARD.dictionary !== 'DICT_4X4_50') throw new Error(`Unsupported marker dictionary ${CARD.dictionary}`);
  const dictionary = cv.getPredefinedDictionary(cv.DICT_4X4_50);
  const result = new Map<number, boolean[][]>();
  try {
    for (const { id } of CARD.markers) {
      const image = new cv.Mat();
      try {
        // One pixel per cell, one cell of border.
        cv.generateImageMarker(dictionary, id, MARKER_CELLS, image, 1);
        if (image.rows !== MARKER_CELLS || image.cols !== MARKER_CELLS)
          throw new Error(`Marker ${id} came out ${image.cols}x${image.rows}`);
        const rows: boolean[][] = [];
        for (let r = 0; r < MARKER_CELLS; r++) {
          rows.push(Array.from({ length: MARKER_CELLS }, (_, c) => image.data[r * MARKER_CELLS + c] < 128));
        }
        result.set(id, rows);
      } finally {
        image.delete();
      }
    }
  } finally {
    dictionary.delete();
  }
  bitsCache = result;
  return result;
}

/** Where the card's top-left corner lands on the page, in points from the page's top-left. */
export function cardOriginPt(paper: Paper): { left: number; top: number } {
  const [pageW] = PAGE_SIZE_PT[paper];
  return { left: (pageW - mm(CARD.widthMm)) / 2, top: mm(CARD_TOP_MM) };
}

export async function renderReferenceCard(paper: Paper, options: RenderOptions = {}): Promise<Buffer> {
  if (!PAPERS.includes(paper)) throw new Error(`Unknown paper ${String(paper)}`);
  const bits = await markerBits();
  const [pageW, pageH] = PAGE_SIZE_PT[paper];

  const doc = new PDFDocument({
    size: [pageW, pageH],
    margin: 0,
    compress: options.compress ?? true,
    // PrintScaling (below) is a PDF 1.6 entry.
    pdfVersion: '1.6',
    displayTitle: true,
    lang: 'en',
    info: {
      Title: 'Selvage reference card',
      Author: 'Selvage',
      Subject: 'Print at 100% and photograph beside your finished block',
    },
  });
  // Ask viewers to default their print dialog to "actual size" (PDF 1.6 PrintScaling); not every one honours it.
  const prefs = (doc as unknown as { _root: { data: { ViewerPreferences?: { data: Record<string, unknown> } } } })._root
    .data.ViewerPreferences;
  if (prefs) prefs.data.PrintScaling = 'None';

  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const finished = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const f = fonts();
  doc.registerFont('regular', f.regular);
  doc.registerFont('bold', f.bold);
  doc.registerFont('italic', f.italic);

  const { left, top } = cardOriginPt(paper);
  /** Card millimetres to page points. */
  const X = (xMm: number) => left + mm(xMm);
  const Y = (yMm: number) => top + mm(yMm);

  doc.fillColor(INK).strokeColor(INK);
  drawOutlines(doc, X, Y);
  drawHeading(doc, X, Y);
  drawTestSquare(doc, X, Y);
  drawInchBar(doc, X, Y);
  drawCmBar(doc, X, Y);
  drawCardNote(doc, X, Y);
  // Markers last, each on a white quiet zone, so nothing drawn above can stray into them.
  drawMarkers(doc, X, Y, bits);
  drawInstructions(doc, left, Y(CARD.heightMm + CUT_MARGIN_MM), pageH);

  doc.end();
  return finished;
}

type Doc = PDFKit.PDFDocument;
type Map1 = (v: number) => number;

function drawOutlines(doc: Doc, X: Map1, Y: Map1): void {
  // The card's own edge: a thin solid line.
  doc.save().lineWidth(0.5).rect(X(0), Y(0), mm(CARD.widthMm), mm(CARD.heightMm)).stroke().restore();
  // The cutting line a few millimetres outside it.
  const c = CUT_MARGIN_MM;
  doc
    .save()
    .lineWidth(0.6)
    .dash(mm(3), { space: mm(2) })
    .rect(X(-c), Y(-c), mm(CARD.widthMm + 2 * c), mm(CARD.heightMm + 2 * c))
    .stroke()
    .undash()
    .restore();
  const label = 'Cut along the dashed line if you like.';
  doc.font('italic').fontSize(10);
  doc.text(label, X(-c), Y(CARD.heightMm + c) + mm(1), { width: mm(CARD.widthMm + 2 * c), align: 'right', lineBreak: false });
}

function drawHeading(doc: Doc, X: Map1, Y: Map1): void {
  const sq = CARD.testSquare;
  const marker1 = CARD.markers.find((m) => m.id === 1)!;
  const x0 = sq.x + sq.sizeMm + 5;
  const width = mm(marker1.x - 5 - x0);
  doc.font('bold').fontSize(15).text('Selvage reference card', X(x0), Y(sq.y) - 1, { width, lineBreak: false });
  doc
    .font('regular')
    .fontSize(11)
    .text('Lay it flat beside your block,\non the same surface.\nKeep all four black squares in the photo.', X(x0), Y(sq.y + 7.5), {
      width,
      lineGap: 1,
    });
}

function drawTestSquare(doc: Doc, X: Map1, Y: Map1): void {
  const sq = CARD.testSquare;
  const w = 0.6; // pt; drawn inside the square so its outer edge is exactly 1 inch across
  doc
    .save()
    .lineWidth(w)
    .rect(X(sq.x) + w / 2, Y(sq.y) + w / 2, mm(sq.sizeMm) - w, mm(sq.sizeMm) - w)
    .stroke()
    .restore();
  doc.font('bold').fontSize(13);
  const lineH = doc.currentLineHeight();
  doc.text('1 inch', X(sq.x), Y(sq.y + sq.sizeMm / 2) - lineH / 2 - mm(1.8), { width: mm(sq.sizeMm), align: 'center', lineBreak: false });
  doc.font('regular').fontSize(9.5);
  doc.text('test square', X(sq.x), Y(sq.y + sq.sizeMm / 2) + mm(1.2), { width: mm(sq.sizeMm), align: 'center', lineBreak: false });
}

const STRIP_MM = 1.6;
const TICK_W_MM = 0.2;

interface Tick {
  atMm: number;
  lengthMm: number;
  number?: string;
}

/**
 * A ruler bar: a black strip exactly `lengthMm` long with its ends flush to the true ends, ticks hanging
 * below it, numbers under the major ticks and a label above.
 */
function drawBar(doc: Doc, X: Map1, Y: Map1, bar: { x: number; y: number; lengthMm: number }, ticks: Tick[], label: string, hint: string): void {
  // Strip, and the two end ticks kept inside the true length so the bar measures end to end.
  const endTick = Math.max(...ticks.map((t) => t.lengthMm));
  doc.rect(X(bar.x), Y(bar.y), mm(bar.lengthMm), mm(STRIP_MM)).fill(INK);
  doc.rect(X(bar.x), Y(bar.y), mm(TICK_W_MM * 1.5), mm(STRIP_MM + endTick)).fill(INK);
  doc.rect(X(bar.x + bar.lengthMm - TICK_W_MM * 1.5), Y(bar.y), mm(TICK_W_MM * 1.5), mm(STRIP_MM + endTick)).fill(INK);

  doc.save().lineWidth(mm(TICK_W_MM)).lineCap('butt');
  for (const t of ticks) {
    if (t.atMm <= 0 || t.atMm >= bar.lengthMm) continue;
    doc.moveTo(X(bar.x + t.atMm), Y(bar.y + STRIP_MM)).lineTo(X(bar.x + t.atMm), Y(bar.y + STRIP_MM + t.lengthMm));
  }
  doc.stroke().restore();

  doc.font('regular').fontSize(10);
  for (const t of ticks) {
    if (t.number === undefined) continue;
    const w = mm(8);
    doc.text(t.number, X(bar.x + t.atMm) - w / 2, Y(bar.y + STRIP_MM + endTick + 0.6), { width: w, align: 'center', lineBreak: false });
  }

  doc.font('bold').fontSize(13);
  const labelH = doc.currentLineHeight();
  const labelY = Y(bar.y) - labelH - mm(0.8);
  doc.text(label, X(bar.x), labelY, { lineBreak: false });
  doc.font('regular').fontSize(10.5);
  doc.text(hint, X(bar.x), labelY + mm(0.9), { width: mm(bar.lengthMm), align: 'right', lineBreak: false });
}

function drawInchBar(doc: Doc, X: Map1, Y: Map1): void {
  const bar = CARD.inchBar;
  const inch = 25.4;
  const eighths = Math.round((bar.lengthMm / inch) * 8);
  const ticks: Tick[] = [];
  for (let i = 0; i <= eighths; i++) {
    const lengthMm = i % 8 === 0 ? 5 : i % 4 === 0 ? 3.6 : i % 2 === 0 ? 2.6 : 1.7;
    ticks.push({ atMm: (i * inch) / 8, lengthMm, number: i % 8 === 0 ? String(i / 8) : undefined });
  }
  drawBar(doc, X, Y, bar, ticks, bar.label, 'inch marks every 1/8 inch · measure the bar end to end');
}

function drawCmBar(doc: Doc, X: Map1, Y: Map1): void {
  const bar = CARD.cmBar;
  const ticks: Tick[] = [];
  for (let i = 0; i <= Math.round(bar.lengthMm); i++) {
    const lengthMm = i % 10 === 0 ? 5 : i % 5 === 0 ? 3.6 : 2.2;
    ticks.push({ atMm: i, lengthMm, number: i % 10 === 0 ? String(i / 10) : undefined });
  }
  drawBar(doc, X, Y, bar, ticks, bar.label, 'millimetre marks · numbered in centimetres · measure end to end');
}

function drawCardNote(doc: Doc, X: Map1, Y: Map1): void {
  const m3 = CARD.markers.find((m) => m.id === 3)!;
  const m2 = CARD.markers.find((m) => m.id === 2)!;
  const x0 = m3.x + CARD.markerSizeMm + 6;
  const width = mm(m2.x - 6 - x0);
  doc.font('regular').fontSize(11);
  const text = 'Keep the card flat and clean.\nDo not fold it, trim into it, or cover the black squares.';
  const h = doc.heightOfString(text, { width, align: 'center', lineGap: 1 });
  doc.text(text, X(x0), Y(m3.y + CARD.markerSizeMm / 2) - h / 2, { width, align: 'center', lineGap: 1 });
}

function drawMarkers(doc: Doc, X: Map1, Y: Map1, bits: Map<number, boolean[][]>): void {
  const cell = CARD.markerSizeMm / MARKER_CELLS;
  for (const m of CARD.markers) {
    const grid = bits.get(m.id);
    if (!grid) throw new Error(`No bits for marker ${m.id}`);
    // Quiet zone: one cell of white all round.
    doc.rect(X(m.x - cell), Y(m.y - cell), mm(CARD.markerSizeMm + 2 * cell), mm(CARD.markerSizeMm + 2 * cell)).fill(PAPER_WHITE);
    // Black cells, merged into horizontal runs and filled as one path so no hairline seams show.
    for (let r = 0; r < MARKER_CELLS; r++) {
      let c = 0;
      while (c < MARKER_CELLS) {
        if (!grid[r][c]) {
          c++;
          continue;
        }
        const start = c;
        while (c < MARKER_CELLS && grid[r][c]) c++;
        doc.rect(X(m.x + start * cell), Y(m.y + r * cell), mm((c - start) * cell), mm(cell));
      }
    }
    doc.fill(INK);
  }
}

interface Block {
  kind: 'lead' | 'para' | 'heading' | 'bullet';
  text: string;
}

export const INSTRUCTIONS: readonly Block[] = [
  { kind: 'lead', text: 'Print this page at 100% (actual size).\nTurn off “fit to page” or “shrink to fit”.' },
  {
    kind: 'para',
    text:
      'Check your print: measure the long bar with your own ruler and type what it reads when you upload a photo. ' +
      'Use the 6 inch bar, or the 15 cm bar if your ruler is metric. The test square should be 1 inch on each side.',
  },
  { kind: 'heading', text: 'Taking the photo' },
  { kind: 'bullet', text: 'Lay the block flat on a background that contrasts with it.' },
  { kind: 'bullet', text: 'Put the card beside the block on the same surface — not on top of it, not propped up.' },
  { kind: 'bullet', text: 'Get the whole block and the whole card in the picture, all four black squares included.' },
  { kind: 'bullet', text: 'Hold the camera straight above, looking down.' },
  { kind: 'bullet', text: 'Use good, even light, with no shadow across the block.' },
  { kind: 'heading', text: 'Safety' },
  { kind: 'bullet', text: 'Close the rotary cutter guard after every cut.' },
  { kind: 'bullet', text: 'Unplug the iron when you finish.' },
];

export const FOOTER = 'Selvage reference card — the same card serves every round';

function drawInstructions(doc: Doc, left: number, cutBottom: number, pageH: number): void {
  const width = mm(CARD.widthMm);
  const bulletIndent = mm(6);
  const startY = cutBottom + mm(9);
  const bottom = pageH - mm(PAGE_BOTTOM_MARGIN_MM);

  doc.font('regular').fontSize(12);
  const footerH = doc.currentLineHeight();
  const limit = bottom - footerH - mm(4);

  // Largest body size (never below 12 pt) at which everything fits above the footer.
  const sizes = [14, 13.5, 13, 12.5, 12];
  let body = sizes[sizes.length - 1];
  for (const size of sizes) {
    if (startY + layoutHeight(doc, size, width, bulletIndent) <= limit) {
      body = size;
      break;
    }
  }
  const end = layout(doc, body, left, startY, width, bulletIndent, true);
  if (end > limit) throw new Error(`Reference card instructions overflow the page by ${(end - limit).toFixed(1)} pt`);

  doc.font('regular').fontSize(12).text(FOOTER, left, bottom - footerH, { width, align: 'center', lineBreak: false });
}

function layoutHeight(doc: Doc, body: number, width: number, indent: number): number {
  return layout(doc, body, 0, 0, width, indent, false);
}

/** Lays the instruction blocks out from y; draws them when `draw`. Returns the y below the last one. */
function layout(doc: Doc, body: number, x: number, y: number, width: number, indent: number, draw: boolean): number {
  let cursor = y;
  let previous: Block['kind'] | null = null;
  for (const block of INSTRUCTIONS) {
    const font = block.kind === 'lead' || block.kind === 'heading' ? 'bold' : 'regular';
    const size = block.kind === 'lead' ? body + 2 : block.kind === 'heading' ? body + 1 : body;
    const gapBefore =
      previous === null ? 0 : block.kind === 'heading' ? body * 0.9 : block.kind === 'bullet' && previous === 'bullet' ? body * 0.2 : body * 0.6;
    cursor += gapBefore;
    doc.font(font).fontSize(size);
    const opts = { width: block.kind === 'bullet' ? width - indent : width, lineGap: size * 0.15 };
    const h = doc.heightOfString(block.text, opts);
    if (draw) {
      if (block.kind === 'bullet') {
        doc.text('•', x + indent * 0.3, cursor, { lineBreak: false });
        doc.text(block.text, x + indent, cursor, opts);
      } else {
        doc.text(block.text, x, cursor, opts);
      }
    }
    cursor += h;
    previous = block.kind;
  }
  return cursor;
}
