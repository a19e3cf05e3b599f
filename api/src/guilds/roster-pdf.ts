import { eachPage, fitAndDraw, fitText, drawFitted, Flow, lineHeight, MUTED, openDocument, printable, rule, type RenderOptions } from '../shows/pdf/pdf-tools';

/**
 * The printed roster: every member's name and, beside it, only the contact details the reader may see
 * (the caller decides that; this renderer prints what it is given). Large type, grouped by the first
 * letter of the surname, with "for members only" on every page. A pure function from plain data to PDF.
 */

export type Paper = 'a4' | 'letter';
export const PAPER_SIZES: Record<Paper, [number, number]> = { a4: [595.28, 841.89], letter: [612, 792] };
/** Guilds that pay in these currencies print on US Letter; everyone else on A4. */
const LETTER_CURRENCIES = new Set(['USD', 'CAD', 'MXN', 'PHP', 'CLP', 'COP', 'VES', 'GTQ', 'CRC', 'DOP', 'PAB']);
export function paperFor(currency: string | null | undefined): Paper {
  return LETTER_CURRENCIES.has((currency ?? '').toUpperCase()) ? 'letter' : 'a4';
}
export const MEMBERS_ONLY = 'For members only — please do not share';

export interface RosterPerson {
  name: string;
  email?: string | null;
  phone?: string | null;
  town?: string | null;
}

export interface RosterInput {
  guildName: string;
  guildTown?: string | null;
  /** "2 December 2026" */
  printedOn: string;
  paper: Paper;
  members: RosterPerson[];
}

/** The word a roster is sorted by: the last word of the name ("Vasquez-Orr" for "Edith Vasquez-Orr"). */
export function surnameOf(name: string): string {
  const words = name.trim().split(/\s+/).filter(Boolean);
  return (words[words.length - 1] ?? '').replace(/^[^\p{L}\p{N}]+|[^\p{L}\p{N}]+$/gu, '');
}

/** The heading a name is grouped under: the surname's first letter without accents, or "#". */
export function letterOf(name: string): string {
  const first = surnameOf(name).normalize('NFD').replace(/\p{M}/gu, '').charAt(0).toUpperCase();
  return /^[A-Z]$/.test(first) ? first : '#';
}

/** Members sorted by surname, then whole name, in groups by letter. */
export function rosterGroups<T extends { name: string }>(people: readonly T[]): { letter: string; people: T[] }[] {
  const collator = new Intl.Collator('en', { sensitivity: 'base', numeric: true });
  const sorted = [...people].sort(
    (a, b) => collator.compare(letterOf(a.name), letterOf(b.name)) || collator.compare(surnameOf(a.name), surnameOf(b.name)) || collator.compare(a.name, b.name),
  );
  const groups: { letter: string; people: T[] }[] = [];
  for (const p of sorted) {
    const letter = letterOf(p.name);
    const last = groups[groups.length - 1];
    if (last?.letter === letter) last.people.push(p);
    else groups.push({ letter, people: [p] });
  }
  return groups;
}

const MARGIN = 54;
const FOOTER_SIZE = 11;
const NAME_SIZE = 14;
const DETAIL_SIZE = 12;
const LETTER_SIZE = 18;

export async function renderRoster(input: RosterInput, options: RenderOptions = {}): Promise<Buffer> {
  const size = PAPER_SIZES[input.paper];
  const [pageWidth, pageHeight] = size;
  const width = pageWidth - 2 * MARGIN;
  const { doc, finish } = openDocument({ size, title: `${input.guildName}: member roster`, author: input.guildName, subject: MEMBERS_ONLY }, options);

  let y = MARGIN;
  y = fitAndDraw(doc, input.guildName, MARGIN, y, { weight: 'bold', width, maxSize: 24, minSize: 16, maxLines: 2 });
  y = fitAndDraw(doc, input.guildTown ? `Member roster · ${input.guildTown}` : 'Member roster', MARGIN, y + 4, { width, maxSize: 16, minSize: 12, maxLines: 1 });
  y = fitAndDraw(doc, `Printed on ${input.printedOn}`, MARGIN, y + 4, { width, maxSize: 12, minSize: 11, maxLines: 1, color: MUTED });
  y = fitAndDraw(doc, MEMBERS_ONLY, MARGIN, y + 4, { weight: 'bold', width, maxSize: 13, minSize: 11, maxLines: 1 });
  rule(doc, MARGIN, MARGIN + width, y + 8, 1.5);
  y += 20;

  const footerTop = pageHeight - MARGIN + 10;
  const flow = new Flow(doc, MARGIN, width, MARGIN, pageHeight - MARGIN - 10);
  flow.y = y;

  if (input.members.length === 0) {
    fitAndDraw(doc, 'No members yet.', MARGIN, flow.y, { width, maxSize: NAME_SIZE });
  }

  const nameLine = lineHeight(doc, { weight: 'bold', size: NAME_SIZE });
  const detailLine = lineHeight(doc, { size: DETAIL_SIZE });
  for (const group of rosterGroups(input.members)) {
    const letterHeight = lineHeight(doc, { weight: 'bold', size: LETTER_SIZE }) + 6;
    // A letter heading never sits alone at the foot of a page.
    flow.need(letterHeight + nameLine + detailLine + 8);
    fitAndDraw(doc, group.letter, MARGIN, flow.y, { weight: 'bold', width, maxSize: LETTER_SIZE });
    rule(doc, MARGIN, MARGIN + width, flow.y + letterHeight - 3, 0.75, MUTED);
    flow.y += letterHeight + 2;
    for (const person of group.people) {
      const details = [person.town, person.phone, person.email].map((d) => (d ? printable(doc, d) : '')).filter(Boolean);
      const name = fitText(doc, person.name, { weight: 'bold', width, maxSize: NAME_SIZE, minSize: 12, maxLines: 2 });
      const detailText = details.length ? fitText(doc, details.join('  ·  '), { width: width - 16, maxSize: DETAIL_SIZE, minSize: 11, maxLines: 3 }) : null;
      const height = name.height + (detailText ? detailText.height + 2 : 0) + 8;
      flow.need(height);
      let at = drawFitted(doc, name, MARGIN, flow.y, { weight: 'bold', width, maxSize: NAME_SIZE });
      if (detailText) at = drawFitted(doc, detailText, MARGIN + 16, at + 2, { width: width - 16, maxSize: DETAIL_SIZE });
      flow.y = at + 8;
    }
    flow.y += 6;
  }

  eachPage(doc, (i, count) => {
    rule(doc, MARGIN, MARGIN + width, footerTop - 4, 0.75, MUTED);
    fitAndDraw(doc, MEMBERS_ONLY, MARGIN, footerTop, { width: width * 0.7, maxSize: FOOTER_SIZE, minSize: 9, maxLines: 1, color: MUTED });
    fitAndDraw(doc, `Page ${i + 1} of ${count}`, MARGIN + width * 0.7, footerTop, { width: width * 0.3, align: 'right', maxSize: FOOTER_SIZE, maxLines: 1 });
  });
  return finish();
}
