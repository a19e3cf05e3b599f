import QRCode from 'qrcode';
import {
  CUT_CAUTION,
  Doc,
  INK,
  LETTER_PORTRAIT,
  MUTED,
  RenderOptions,
  drawCutGrid,
  drawText,
  fitAndDraw,
  openDocument,
  printable,
} from './pdf-tools';

/**
 * Visitor ballot cards: ten business-card-sized cards on each Letter page (two across, five down) with
 * dashed lines to cut along. Each card carries its own code twice: as a QR code that opens the voting
 * page with the code filled in, and printed large for typing in by hand.
 *
 * The QR code is drawn as filled squares (vector, so it prints crisp at any resolution) with its
 * four-module quiet zone left white.
 */

export interface BallotCard {
  /** The code as it should be printed, already grouped, e.g. "K7QM-3XHD-9PRW". */
  code: string;
  /** The full address the QR code opens. */
  url: string;
}

export interface BallotCardsInput {
  guildName: string;
  showName: string;
  /** The voting page without a code, e.g. "https://selvage.example/vote"; printed without its scheme. */
  voteUrlBase: string;
  cards: BallotCard[];
}

export const CARD_WIDTH = 252; // 3.5 in
export const CARD_HEIGHT = 144; // 2 in
export const CARD_COLUMNS = 2;
export const CARD_ROWS = 5;
export const CARDS_PER_PAGE = CARD_COLUMNS * CARD_ROWS;
const [PAGE_W] = LETTER_PORTRAIT;
export const CARD_GRID_LEFT = (PAGE_W - CARD_COLUMNS * CARD_WIDTH) / 2;
export const CARD_GRID_TOP = 30;
const PAD = 8;
/** The QR code's square, quiet zone included. */
const QR_BOX = 92;
const QUIET_ZONE = 4;
/** Below this a phone camera starts to struggle with a printed module. */
const MIN_MODULE_PT = 1.2;
const RIGHT_X = PAD + QR_BOX + 6;
const RIGHT_W = CARD_WIDTH - RIGHT_X - PAD;
const FULL_W = CARD_WIDTH - 2 * PAD;

export const BALLOT_HEADING = "Viewer's choice ballot";
export const ONCE_ONLY = 'One ballot per card. Each code works once.';

/** The voting address as people type it: no scheme, no trailing slash. */
export function shortUrl(voteUrlBase: string): string {
  return String(voteUrlBase ?? '')
    .trim()
    .replace(/^[a-z][a-z0-9+.-]*:\/\//i, '')
    .replace(/\/+$/, '');
}

export function instruction(voteUrlBase: string): string {
  return `Scan with your phone camera, or go to ${shortUrl(voteUrlBase)} and type the code.`;
}

/** The top-left corner of the card in slot 0–9 of a page (left to right, then down). */
export function cardOrigin(slot: number): { x: number; y: number } {
  return { x: CARD_GRID_LEFT + (slot % CARD_COLUMNS) * CARD_WIDTH, y: CARD_GRID_TOP + Math.floor(slot / CARD_COLUMNS) * CARD_HEIGHT };
}

/** The QR code's dark modules, true = dark, row by row. */
function qrModules(url: string): boolean[][] {
  const qr = QRCode.create(url, { errorCorrectionLevel: 'M' });
  const n = qr.modules.size;
  return Array.from({ length: n }, (_, r) => Array.from({ length: n }, (_, c) => qr.modules.get(r, c) === 1));
}

/** Draws the QR code in a `box`-point square at (x, y), quiet zone included. */
function drawQr(doc: Doc, modules: boolean[][], x: number, y: number, box: number): void {
  const n = modules.length;
  const cell = box / (n + 2 * QUIET_ZONE);
  if (cell < MIN_MODULE_PT) throw new Error(`A ballot link of this length makes a QR code too fine to scan from a card; shorten the link.`);
  const origin = { x: x + QUIET_ZONE * cell, y: y + QUIET_ZONE * cell };
  // Dark modules merged into horizontal runs and filled as one path, so no hairline seams show.
  for (let r = 0; r < n; r++) {
    let c = 0;
    while (c < n) {
      if (!modules[r][c]) {
        c++;
        continue;
      }
      const start = c;
      while (c < n && modules[r][c]) c++;
      doc.rect(origin.x + start * cell, origin.y + r * cell, (c - start) * cell, cell);
    }
  }
  doc.fill(INK);
}

function drawCard(doc: Doc, input: BallotCardsInput, card: BallotCard, x: number, y: number): void {
  drawQr(doc, qrModules(card.url), x + PAD, y + PAD, QR_BOX);

  let right = y + PAD + 2;
  right = fitAndDraw(doc, input.showName, x + RIGHT_X, right, { weight: 'bold', width: RIGHT_W, maxSize: 11, minSize: 8, maxLines: 2 });
  right = fitAndDraw(doc, BALLOT_HEADING, x + RIGHT_X, right + 1, { weight: 'bold', width: RIGHT_W, maxSize: 13, minSize: 10, maxLines: 1 });
  const qrBottom = y + PAD + QR_BOX;
  fitAndDraw(doc, instruction(input.voteUrlBase), x + RIGHT_X, right + 3, {
    width: RIGHT_W,
    maxSize: 10,
    minSize: 7.5,
    maxHeight: qrBottom - (right + 3),
    color: MUTED,
  });

  // The code across the card, large, a little letter-spaced so each character stands apart.
  const bottom = fitAndDraw(doc, card.code, x + PAD, qrBottom + 1, {
    weight: 'bold',
    width: FULL_W,
    align: 'center',
    maxSize: 20,
    minSize: 12,
    maxLines: 1,
    characterSpacing: 0.8,
  });
  fitAndDraw(doc, ONCE_ONLY, x + PAD, bottom, { width: FULL_W, align: 'center', maxSize: 10, minSize: 7.5, maxLines: 1 });
}

/** The ballot cards as a PDF, ten to a page, in the order given. */
export async function renderBallotCards(input: BallotCardsInput, options: RenderOptions = {}): Promise<Buffer> {
  if (!input || !Array.isArray(input.cards)) throw new TypeError('Ballot cards need a list of cards.');
  input.cards.forEach((card, i) => {
    if (!card || typeof card.url !== 'string' || card.url.trim() === '') throw new TypeError(`Ballot card ${i + 1} has no link for its QR code.`);
    if (typeof card.code !== 'string' || card.code.trim() === '') throw new TypeError(`Ballot card ${i + 1} has no code.`);
  });
  const { doc, finish } = openDocument(
    {
      size: LETTER_PORTRAIT,
      title: `Viewer's choice ballots — ${input.showName}`,
      author: input.guildName,
      subject: `Ballot cards for ${input.showName}`,
    },
    options,
  );

  if (input.cards.length === 0) {
    const y = fitAndDraw(doc, input.showName, 72, 72, { weight: 'bold', width: PAGE_W - 144, maxSize: 24, minSize: 14, maxLines: 2 });
    drawText(doc, printable(doc, 'There are no ballot cards to print.'), 72, y + 24, { size: 20, width: PAGE_W - 144 });
    return finish();
  }

  const pages = Math.ceil(input.cards.length / CARDS_PER_PAGE);
  for (let page = 0; page < pages; page++) {
    if (page > 0) doc.addPage();
    const onPage = input.cards.slice(page * CARDS_PER_PAGE, (page + 1) * CARDS_PER_PAGE);
    onPage.forEach((card, slot) => {
      const { x, y } = cardOrigin(slot);
      drawCard(doc, input, card, x, y);
    });
    const rows = Math.ceil(onPage.length / CARD_COLUMNS);
    drawCutGrid(doc, { left: CARD_GRID_LEFT, top: CARD_GRID_TOP, cellWidth: CARD_WIDTH, cellHeight: CARD_HEIGHT, columns: CARD_COLUMNS, rows });
    fitAndDraw(doc, CUT_CAUTION, CARD_GRID_LEFT, CARD_GRID_TOP + CARD_ROWS * CARD_HEIGHT + 10, {
      width: CARD_COLUMNS * CARD_WIDTH,
      align: 'center',
      maxSize: 10,
      minSize: 8,
      maxLines: 1,
    });
  }
  return finish();
}
