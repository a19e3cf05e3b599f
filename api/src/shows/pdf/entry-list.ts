import {
  Column,
  Doc,
  Flow,
  LETTER_LANDSCAPE,
  MUTED,
  RenderOptions,
  TableLook,
  drawTable,
  eachPage,
  fitAndDraw,
  joinNames,
  lineHeight,
  openDocument,
  rule,
} from './pdf-tools';

/**
 * The show's full entry list for the committee: every entry, grouped by category, in a table that
 * repeats its header on each page. Landscape Letter so the columns keep large type; page numbers
 * ("Page 2 of 5") and the date it was printed at the foot of every page.
 */

export interface EntryListEntry {
  entryNumber: number | null;
  title: string;
  makers: string[];
  /** Who quilted it; empty when not given. */
  quilter: string;
  /** Already written for print, e.g. "60 1/2 x 72 in". */
  sizeText: string;
  /** "accepted", "submitted", "declined" or "withdrawn" (any case); anything else is printed as given. */
  status: string;
  forSale: boolean;
}

export interface EntryListCategory {
  name: string;
  /** Printed in the order given. */
  entries: EntryListEntry[];
}

export interface EntryListInput {
  guildName: string;
  showName: string;
  venue: string;
  /** Already written for print, e.g. "Friday 8 May – Sunday 10 May 2026". */
  datesText: string;
  /** Already written for print, e.g. "2 May 2026". */
  printedOn: string;
  categories: EntryListCategory[];
}

const [PAGE_W, PAGE_H] = LETTER_LANDSCAPE;
const MARGIN = 36;
const WIDTH = PAGE_W - 2 * MARGIN;
const FOOTER_SIZE = 11;
const CONTENT_BOTTOM = PAGE_H - MARGIN - 16;
const HEADING_SIZE = 16;
const LOOK: TableLook = { size: 12, headerSize: 11.5, padX: 4, padY: 4, maxLines: 8 };

const COLUMNS: Column[] = [
  { header: 'No.', width: 44 },
  { header: 'Title', width: 188 },
  { header: 'Made by', width: 150 },
  { header: 'Quilted by', width: 118 },
  { header: 'Size', width: 88 },
  { header: 'Status', width: 74 },
  { header: 'For sale', width: 58 },
];

const STATUS_WORDS: Record<string, string> = {
  accepted: 'Accepted',
  submitted: 'Submitted',
  declined: 'Declined',
  withdrawn: 'Withdrawn',
};

export function statusLabel(status: string): string {
  const key = String(status ?? '').trim();
  return STATUS_WORDS[key.toLowerCase()] ?? key;
}

export const NO_ENTRIES_YET = 'There are no entries yet.';
export const EMPTY_CATEGORY = 'No entries in this category.';

function entryNumberText(n: number | null): string {
  return n === null || n === undefined ? '—' : String(n);
}

function drawFirstPageHeader(doc: Doc, input: EntryListInput): number {
  let y = MARGIN;
  y = fitAndDraw(doc, input.guildName, MARGIN, y, { width: WIDTH, maxSize: 14, minSize: 10, maxLines: 1, color: MUTED });
  y = fitAndDraw(doc, `Entry list — ${input.showName}`, MARGIN, y + 2, { weight: 'bold', width: WIDTH, maxSize: 24, minSize: 16, maxLines: 2 });
  const where = [input.venue, input.datesText].map((s) => String(s ?? '').trim()).filter((s) => s !== '').join(' · ');
  if (where) y = fitAndDraw(doc, where, MARGIN, y + 2, { width: WIDTH, maxSize: 14, minSize: 11, maxLines: 2 });
  y = fitAndDraw(doc, `Printed on ${input.printedOn}`, MARGIN, y + 2, { width: WIDTH, maxSize: 12, minSize: 10, maxLines: 1, color: MUTED });
  return y + 14;
}

/** The show's entry list as a PDF. */
export async function renderEntryList(input: EntryListInput, options: RenderOptions = {}): Promise<Buffer> {
  if (!input || !Array.isArray(input.categories)) throw new TypeError('The entry list needs a list of categories.');
  const { doc, finish } = openDocument(
    {
      size: LETTER_LANDSCAPE,
      title: `Entry list — ${input.showName}`,
      author: input.guildName,
      subject: `Every entry in ${input.showName}, by category`,
    },
    options,
  );

  // Pages after the first carry a one-line running header instead of the full one.
  const flow = new Flow(doc, MARGIN, WIDTH, MARGIN, CONTENT_BOTTOM, (f) => {
    const y = fitAndDraw(doc, `${input.showName} — entry list`, MARGIN, f.y, { weight: 'bold', width: WIDTH, maxSize: 12, minSize: 9, maxLines: 1, color: MUTED });
    rule(doc, MARGIN, MARGIN + WIDTH, y + 3, 0.75, MUTED);
    f.y = y + 12;
  });
  flow.y = drawFirstPageHeader(doc, input);

  const headingHeight = lineHeight(doc, { weight: 'bold', size: HEADING_SIZE }) + 4;
  const heading = (name: string) => (continued: boolean) => {
    flow.y = fitAndDraw(doc, continued ? `${name} (continued)` : name, MARGIN, flow.y, {
      weight: 'bold',
      width: WIDTH,
      maxSize: HEADING_SIZE,
      minSize: HEADING_SIZE,
      maxLines: 1,
    });
    flow.y += 4;
  };

  if (input.categories.length === 0 || input.categories.every((c) => (c.entries ?? []).length === 0)) {
    fitAndDraw(doc, NO_ENTRIES_YET, MARGIN, flow.y + 12, { width: WIDTH, maxSize: 18, maxLines: 2 });
  } else {
    for (const category of input.categories) {
      const entries = category.entries ?? [];
      if (entries.length === 0) {
        const emptyHeight = lineHeight(doc, { size: LOOK.size });
        flow.need(headingHeight + emptyHeight);
        heading(category.name)(false);
        flow.y = fitAndDraw(doc, EMPTY_CATEGORY, MARGIN, flow.y, { width: WIDTH, maxSize: LOOK.size, maxLines: 1, color: MUTED });
      } else {
        const rows = entries.map((e) => [
          { text: entryNumberText(e.entryNumber), weight: 'bold' as const },
          e.title,
          joinNames(e.makers ?? []),
          e.quilter ?? '',
          e.sizeText ?? '',
          statusLabel(e.status),
          e.forSale ? 'Yes' : '',
        ]);
        drawTable(flow, COLUMNS, rows, { look: LOOK, heading: heading(category.name), headingHeight });
      }
      flow.y += 18;
    }
  }

  // Footers once every page exists, so each knows the page count.
  eachPage(doc, (i, count) => {
    const y = PAGE_H - MARGIN - 4;
    fitAndDraw(doc, `Printed on ${input.printedOn}`, MARGIN, y, { width: WIDTH / 2, maxSize: FOOTER_SIZE, minSize: 8, maxLines: 1, color: MUTED });
    fitAndDraw(doc, `Page ${i + 1} of ${count}`, MARGIN + WIDTH / 2, y, { width: WIDTH / 2, align: 'right', maxSize: FOOTER_SIZE, maxLines: 1 });
  });
  return finish();
}
