import {
  Cell,
  Column,
  Doc,
  Flow,
  INK,
  LETTER_PORTRAIT,
  MUTED,
  RenderOptions,
  TableLook,
  drawTable,
  eachPage,
  fitAndDraw,
  joinNames,
  lineHeight,
  measure,
  drawText,
  openDocument,
  printable,
  rule,
} from './pdf-tools';

/**
 * The viewer's choice results: how the count was checked, then each category's ballots, standings and
 * ribbons, and for instant runoff the count round by round. Until the results are announced every page
 * says so at the top. The input holds no voters, so none can be printed.
 */

export interface ResultStanding {
  /** Competition ranking: tied entries share a rank. */
  rank: number;
  entryNumber: number | null;
  title: string;
  makers: string[];
  /** Votes, approvals or points. */
  score: number;
  ribbon: 1 | 2 | 3 | null;
  /** The chair settled a tie to give this ribbon. */
  byDecision: boolean;
}

export interface ResultRound {
  /** Ballots for each entry still in the count, keyed by entry number (as text). */
  counts: Record<string, number>;
  /** Entry numbers that went out after this round. */
  eliminated: string[];
  /** Ballots with no entry left to count for. */
  exhausted: number;
}

export interface ResultCategory {
  name: string;
  /** Ballots handed in for this category: counted + blank + spoiled. */
  ballots: number;
  blank: number;
  spoiled: number;
  /** In the order to print, best first. */
  standings: ResultStanding[];
  /** Instant runoff only: the count round by round. */
  rounds?: ResultRound[];
}

export interface ResultsInput {
  guildName: string;
  showName: string;
  /** Already written for print, e.g. "10 May 2026"; null while voting is open. */
  closedOn: string | null;
  published: boolean;
  /** The score column's heading: "Votes", "Approvals" or "Points". */
  scoreLabel: string;
  /** How the count was checked, in plain words; blank lines separate paragraphs. */
  auditText: string;
  categories: ResultCategory[];
}

const [PAGE_W, PAGE_H] = LETTER_PORTRAIT;
const MARGIN = 54;
const WIDTH = PAGE_W - 2 * MARGIN;
const BANNER_TOP = 26;
const BANNER_H = 26;
const CONTENT_BOTTOM = PAGE_H - MARGIN - 6;
const LOOK: TableLook = { size: 12, headerSize: 11.5, padX: 4, padY: 4, maxLines: 6 };
const ROUNDS_LOOK: TableLook = { size: 11.5, headerSize: 11, padX: 4, padY: 3, maxLines: 3 };
const ROUNDS_PER_TABLE = 6;

export const CONFIDENTIAL = 'Not yet announced — keep confidential';
export const BY_DECISION = "(by the chair's decision)";

const ORDINAL: Record<1 | 2 | 3, string> = { 1: '1st', 2: '2nd', 3: '3rd' };

export function ribbonText(ribbon: 1 | 2 | 3 | null, byDecision: boolean): string {
  if (ribbon === null || ribbon === undefined) return '';
  return byDecision ? `${ORDINAL[ribbon]} ${BY_DECISION}` : ORDINAL[ribbon];
}

function ribbonCell(ribbon: 1 | 2 | 3 | null, byDecision: boolean): Cell {
  if (ribbon === null || ribbon === undefined) return { text: '' };
  return { text: ORDINAL[ribbon], weight: 'bold', note: byDecision ? BY_DECISION : undefined };
}

export function scoreText(score: number): string {
  if (!Number.isFinite(score)) return '';
  return Number.isInteger(score) ? score.toLocaleString('en-US') : score.toLocaleString('en-US', { maximumFractionDigits: 2 });
}

const plural = (n: number, one: string, many: string) => `${n.toLocaleString('en-US')} ${n === 1 ? one : many}`;

/** "44 ballots: 40 counted, 3 blank, 1 spoiled". */
export function ballotLine(c: Pick<ResultCategory, 'ballots' | 'blank' | 'spoiled'>): string {
  const counted = c.ballots - c.blank - c.spoiled;
  return `${plural(c.ballots, 'ballot', 'ballots')}: ${counted.toLocaleString('en-US')} counted, ${c.blank.toLocaleString('en-US')} blank, ${c.spoiled.toLocaleString('en-US')} spoiled`;
}

function entryNumberText(n: number | null): string {
  return n === null || n === undefined ? '—' : String(n);
}

function check(input: ResultsInput): void {
  if (!input || !Array.isArray(input.categories)) throw new TypeError('The results need a list of categories.');
  for (const c of input.categories) {
    for (const key of ['ballots', 'blank', 'spoiled'] as const)
      if (!Number.isInteger(c[key]) || c[key] < 0) throw new RangeError(`${c.name}: ${key} must be a whole number, 0 or more.`);
    if (c.blank + c.spoiled > c.ballots) throw new RangeError(`${c.name}: blank and spoiled ballots add up to more than the ballots.`);
    if (!Array.isArray(c.standings)) throw new TypeError(`${c.name}: the standings are missing.`);
  }
}

function drawBanner(doc: Doc): void {
  doc.save().lineWidth(1.5).strokeColor(INK).rect(MARGIN, BANNER_TOP, WIDTH, BANNER_H).stroke().restore();
  fitAndDraw(doc, CONFIDENTIAL, MARGIN + 8, BANNER_TOP + 5, { weight: 'bold', width: WIDTH - 16, align: 'center', maxSize: 13, minSize: 10, maxLines: 1 });
}

/**
 * Paragraphs that flow down the pages: a paragraph that does not fit in the room left is split between
 * lines and carries on at the top of the next page, so nothing is ever cut short.
 */
function drawParagraphs(flow: Flow, text: string, size: number): void {
  const doc = flow.doc;
  const style = { size, width: flow.width };
  const paragraphs = String(text ?? '')
    .split(/\n\s*\n/)
    .map((p) => printable(doc, p))
    .filter((p) => p !== '');
  for (const paragraph of paragraphs) {
    let rest = paragraph;
    while (rest !== '') {
      if (measure(doc, rest, style) <= flow.room) {
        flow.y = drawText(doc, rest, flow.left, flow.y, style);
        break;
      }
      // The most words that fit in the room left.
      const words = rest.split(' ');
      let lo = 0;
      let hi = words.length - 1;
      while (lo < hi) {
        const mid = Math.ceil((lo + hi) / 2);
        if (measure(doc, words.slice(0, mid).join(' '), style) <= flow.room) lo = mid;
        else hi = mid - 1;
      }
      if (lo === 0 && flow.y === flow.top) lo = 1; // a single word taller than a page: print it anyway
      if (lo > 0) {
        drawText(doc, words.slice(0, lo).join(' '), flow.left, flow.y, style);
        rest = words.slice(lo).join(' ');
      }
      flow.newPage();
    }
    flow.y += size * 0.6;
  }
}

function roundsRows(category: ResultCategory, rounds: ResultRound[], from: number, to: number): (string | Cell)[][] {
  const titles = new Map<string, string>();
  for (const s of category.standings) if (s.entryNumber !== null && s.entryNumber !== undefined) titles.set(String(s.entryNumber), s.title);
  // Entries in standings order, then any others in the order the rounds name them.
  const keys: string[] = [];
  const add = (k: string) => {
    if (!keys.includes(k)) keys.push(k);
  };
  for (const s of category.standings) if (s.entryNumber !== null && s.entryNumber !== undefined && rounds.some((r) => String(s.entryNumber) in r.counts)) add(String(s.entryNumber));
  for (const r of rounds) for (const k of Object.keys(r.counts)) add(k);
  const label = (k: string) => {
    const number = /^\d+$/.test(k) ? `No. ${k}` : k;
    const title = titles.get(k);
    return title ? `${number} ${title}` : number;
  };
  const shown = rounds.slice(from, to);
  const rows: (string | Cell)[][] = keys.map((k) => [label(k), ...shown.map((r) => (k in r.counts ? scoreText(r.counts[k]) : '—'))]);
  rows.push([{ text: 'Exhausted', weight: 'italic' }, ...shown.map((r) => scoreText(r.exhausted))]);
  rows.push([
    { text: 'Out after this round', weight: 'italic' },
    ...shown.map((r) => (r.eliminated ?? []).map((k) => (/^\d+$/.test(k) ? `No. ${k}` : k)).join(', ')),
  ]);
  return rows;
}

function drawCategory(flow: Flow, input: ResultsInput, category: ResultCategory): void {
  const doc = flow.doc;
  const nameRule = { weight: 'bold' as const, width: WIDTH, maxSize: 18, minSize: 14, maxLines: 2 };
  const lineRule = { width: WIDTH, maxSize: 12.5, maxLines: 2 };
  const headingHeight = lineHeight(doc, { weight: 'bold', size: 18 }) + lineHeight(doc, { size: 12.5 }) + 8;
  const heading = (continued: boolean) => {
    flow.y = fitAndDraw(doc, continued ? `${category.name} (continued)` : category.name, MARGIN, flow.y, nameRule);
    if (!continued) flow.y = fitAndDraw(doc, ballotLine(category), MARGIN, flow.y + 2, lineRule);
    flow.y += 6;
  };

  if (category.standings.length === 0) {
    flow.need(headingHeight + lineHeight(doc, { size: 12 }));
    heading(false);
    flow.y = fitAndDraw(doc, 'No entries in this category.', MARGIN, flow.y, { width: WIDTH, maxSize: 12, maxLines: 1, color: MUTED });
  } else {
    const columns: Column[] = [
      { header: 'Rank', width: 38 },
      { header: 'No.', width: 42 },
      { header: 'Title', width: 130 },
      { header: 'Made by', width: 108 },
      { header: input.scoreLabel, width: 66, align: 'right' },
      { header: 'Ribbon', width: 120 },
    ];
    const rows = category.standings.map((s) => [
      String(s.rank),
      { text: entryNumberText(s.entryNumber), weight: 'bold' as const },
      s.title,
      joinNames(s.makers ?? []),
      scoreText(s.score),
      ribbonCell(s.ribbon, s.byDecision),
    ]);
    drawTable(flow, columns, rows, { look: LOOK, heading, headingHeight });
  }

  const rounds = category.rounds ?? [];
  if (rounds.length > 0) {
    flow.y += 12;
    const label = lineHeight(doc, { weight: 'bold', size: 13 }) + 4;
    for (let from = 0; from < rounds.length; from += ROUNDS_PER_TABLE) {
      const to = Math.min(rounds.length, from + ROUNDS_PER_TABLE);
      const span = rounds.length <= ROUNDS_PER_TABLE ? '' : ` (rounds ${from + 1}–${to})`;
      const roundW = 58;
      const columns: Column[] = [
        { header: 'Entry', width: WIDTH - ROUNDS_PER_TABLE * roundW },
        ...Array.from({ length: to - from }, (_, i) => ({ header: `Round ${from + i + 1}`, width: roundW, align: 'right' as const })),
      ];
      const heading = (continued: boolean) => {
        const text = `${category.name}: instant-runoff rounds${span}${continued ? ' (continued)' : ''}`;
        flow.y = fitAndDraw(doc, text, MARGIN, flow.y, { weight: 'bold', width: WIDTH, maxSize: 13, maxLines: 1 }) + 4;
      };
      drawTable(flow, columns, roundsRows(category, rounds, from, to), { look: ROUNDS_LOOK, heading, headingHeight: label });
      flow.y += 10;
    }
  }
}

/** The viewer's choice results as a PDF. */
export async function renderResults(input: ResultsInput, options: RenderOptions = {}): Promise<Buffer> {
  check(input);
  const { doc, finish } = openDocument(
    {
      size: LETTER_PORTRAIT,
      title: `Viewer's choice results — ${input.showName}`,
      author: input.guildName,
      subject: input.published ? `Viewer's choice results for ${input.showName}` : `${CONFIDENTIAL}: viewer's choice results for ${input.showName}`,
    },
    options,
  );
  // The confidential banner sits above the content on every page.
  const top = input.published ? MARGIN : BANNER_TOP + BANNER_H + 16;
  const flow = new Flow(doc, MARGIN, WIDTH, top, CONTENT_BOTTOM);

  let y = top;
  y = fitAndDraw(doc, input.guildName, MARGIN, y, { width: WIDTH, maxSize: 14, minSize: 10, maxLines: 1, color: MUTED });
  y = fitAndDraw(doc, "Viewer's choice results", MARGIN, y + 2, { weight: 'bold', width: WIDTH, maxSize: 26, maxLines: 1 });
  y = fitAndDraw(doc, input.showName, MARGIN, y + 2, { weight: 'bold', width: WIDTH, maxSize: 17, minSize: 13, maxLines: 2 });
  y = fitAndDraw(doc, input.closedOn ? `Closed ${input.closedOn}` : 'Voting has not closed yet', MARGIN, y + 2, { width: WIDTH, maxSize: 13, maxLines: 1 });
  y += 8;
  rule(doc, MARGIN, MARGIN + WIDTH, y, 1.25);
  flow.y = y + 12;

  if (String(input.auditText ?? '').trim() !== '') {
    flow.need(lineHeight(doc, { weight: 'bold', size: 13 }) + 3 * lineHeight(doc, { size: 12 }));
    flow.y = fitAndDraw(doc, 'How the count was checked', MARGIN, flow.y, { weight: 'bold', width: WIDTH, maxSize: 13, maxLines: 1 }) + 2;
    drawParagraphs(flow, input.auditText, 12);
    flow.y += 8;
  }

  if (input.categories.length === 0) {
    fitAndDraw(doc, 'There are no categories to report.', MARGIN, flow.y, { width: WIDTH, maxSize: 16, maxLines: 1 });
  }
  for (const category of input.categories) {
    drawCategory(flow, input, category);
    flow.y += 20;
  }

  eachPage(doc, (i, count) => {
    if (!input.published) drawBanner(doc);
    const footY = PAGE_H - MARGIN + 14;
    fitAndDraw(doc, `Viewer's choice results — ${input.showName}`, MARGIN, footY, { width: WIDTH * 0.7, maxSize: 10.5, minSize: 8, maxLines: 1, color: MUTED });
    fitAndDraw(doc, `Page ${i + 1} of ${count}`, MARGIN + WIDTH * 0.7, footY, { width: WIDTH * 0.3, align: 'right', maxSize: 10.5, maxLines: 1 });
  });
  return finish();
}
