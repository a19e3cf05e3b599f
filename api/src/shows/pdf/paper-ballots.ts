import { CUT_CAUTION, Doc, INK, LETTER_PORTRAIT, MUTED, RenderOptions, drawCutGrid, fitAndDraw, openDocument, rule } from './pdf-tools';

/**
 * Paper ballots for a hall without signal: two half-sheets on each Letter page, each with its own
 * code printed large (the volunteer keys the code, then the numbers written on it) and a box for
 * each choice the show's kind of ballot asks for. A visitor writes quilt numbers, which are on the
 * hang tags, so the sheet works whatever the entries are.
 */

export type PaperBallotKind = 'per_category' | 'approval' | 'ranked';

export interface PaperBallotsInput {
  guildName: string;
  showName: string;
  kind: PaperBallotKind;
  /** Places on a ranked ballot (2 to 5). */
  rankDepth: number;
  /** The categories in ballot order (ignored for a ranked ballot, which has one overall list). */
  categories: string[];
  /** Codes as printed, already grouped, e.g. "K7QM-3XHD-9PRW". */
  codes: string[];
}

const [PAGE_W, PAGE_H] = LETTER_PORTRAIT;
export const SHEET_HEIGHT = PAGE_H / 2;
const MARGIN = 36;
const INNER_W = PAGE_W - 2 * MARGIN;
const BOX_W = 64;
const COLUMN_GAP = 24;
const MIN_ROW = 17;
const MAX_ROW = 30;

export const PAPER_HEADING = "Viewer's choice: paper ballot";
export const HAND_IN = 'Hand this ballot in at the desk. Each code counts once.';
export const TOO_MANY = 'More categories than fit here: write each category and quilt number on the back.';

export function paperInstruction(kind: PaperBallotKind, rankDepth: number): string {
  if (kind === 'approval') return 'Write the numbers of every quilt you like in each category (as many as you like, or none). The numbers are on the hang tags.';
  if (kind === 'ranked') return `Write the numbers of your ${rankDepth} favourite quilts in order, best first. The numbers are on the hang tags.`;
  return 'Write the number of your favourite quilt in each category, or leave it empty. The numbers are on the hang tags.';
}

/** The labelled boxes of one ballot. */
export function paperRows(input: Pick<PaperBallotsInput, 'kind' | 'rankDepth' | 'categories'>): string[] {
  if (input.kind === 'ranked') {
    const places = ['1st choice', '2nd choice', '3rd choice', '4th choice', '5th choice'];
    return places.slice(0, Math.max(1, Math.min(5, input.rankDepth)));
  }
  return input.categories;
}

function drawSheet(doc: Doc, input: PaperBallotsInput, code: string, top: number): void {
  const left = MARGIN;
  let y = top + 28;
  y = fitAndDraw(doc, input.guildName, left, y, { width: INNER_W * 0.6, maxSize: 10, minSize: 8, maxLines: 1, color: MUTED });
  y = fitAndDraw(doc, input.showName, left, y, { weight: 'bold', width: INNER_W * 0.6, maxSize: 15, minSize: 10, maxLines: 2 });
  y = fitAndDraw(doc, PAPER_HEADING, left, y + 2, { weight: 'bold', width: INNER_W * 0.6, maxSize: 12, minSize: 9, maxLines: 1 });
  // The code at the top right, large: it is what the volunteer types first.
  fitAndDraw(doc, 'Code', left + INNER_W * 0.62, top + 28, { width: INNER_W * 0.38, align: 'right', maxSize: 10, minSize: 8, maxLines: 1, color: MUTED });
  fitAndDraw(doc, code, left + INNER_W * 0.62, top + 40, { weight: 'bold', width: INNER_W * 0.38, align: 'right', maxSize: 22, minSize: 12, maxLines: 1, characterSpacing: 0.8 });
  y = fitAndDraw(doc, paperInstruction(input.kind, input.rankDepth), left, y + 6, { width: INNER_W, maxSize: 11, minSize: 8.5, maxLines: 2 });
  rule(doc, left, left + INNER_W, y + 4, 0.75, MUTED);

  const footerTop = top + SHEET_HEIGHT - 40;
  const rows = paperRows(input);
  const available = footerTop - (y + 12);
  const columns = rows.length > 8 ? 2 : 1;
  const perColumn = Math.ceil(rows.length / columns);
  const rowHeight = Math.min(MAX_ROW, available / perColumn);
  const fits = rowHeight >= MIN_ROW;
  const shown = fits ? rows : rows.slice(0, Math.floor(available / MIN_ROW) * columns - 1);
  const height = fits ? rowHeight : MIN_ROW;
  const columnW = (INNER_W - (columns - 1) * COLUMN_GAP) / columns;
  const boxW = input.kind === 'approval' ? Math.min(columnW * 0.55, 200) : BOX_W;
  shown.forEach((label, i) => {
    const column = Math.floor(i / perColumn);
    const x = left + column * (columnW + COLUMN_GAP);
    const rowTop = y + 12 + (i % perColumn) * height;
    const box = { x: x + columnW - boxW, y: rowTop + 2, h: height - 5 };
    fitAndDraw(doc, label, x, rowTop + Math.max(0, (height - 16) / 2), { width: columnW - boxW - 8, maxSize: 12, minSize: 8, maxLines: 1 });
    doc.save().lineWidth(1).strokeColor(INK).rect(box.x, box.y, boxW, box.h).stroke().restore();
    fitAndDraw(doc, 'No.', box.x + 4, box.y + Math.max(0, (box.h - 12) / 2), { width: 24, maxSize: 9, minSize: 7, maxLines: 1, color: MUTED });
  });
  if (!fits) fitAndDraw(doc, TOO_MANY, left, footerTop - 14, { weight: 'italic', width: INNER_W, maxSize: 10, minSize: 8, maxLines: 1 });
  fitAndDraw(doc, HAND_IN, left, footerTop + 4, { weight: 'bold', width: INNER_W, align: 'center', maxSize: 11, minSize: 8, maxLines: 1 });
}

/** The paper ballots as a PDF, two to a page, in the order given. */
export async function renderPaperBallots(input: PaperBallotsInput, options: RenderOptions = {}): Promise<Buffer> {
  if (!input || !Array.isArray(input.codes) || input.codes.length === 0) throw new TypeError('Paper ballots need at least one code.');
  const { doc, finish } = openDocument(
    { size: LETTER_PORTRAIT, title: `Paper ballots — ${input.showName}`, author: input.guildName, subject: `Paper ballots for ${input.showName}` },
    options,
  );
  for (let i = 0; i < input.codes.length; i += 2) {
    if (i > 0) doc.addPage();
    const onPage = input.codes.slice(i, i + 2);
    onPage.forEach((code, slot) => drawSheet(doc, input, code, slot * SHEET_HEIGHT));
    if (onPage.length === 2) {
      drawCutGrid(doc, { left: 0, top: 0, cellWidth: PAGE_W, cellHeight: SHEET_HEIGHT, columns: 1, rows: 2 });
      fitAndDraw(doc, CUT_CAUTION, MARGIN, SHEET_HEIGHT - 14, { width: INNER_W, align: 'center', maxSize: 8, minSize: 7, maxLines: 1, color: MUTED });
    }
  }
  return finish();
}
