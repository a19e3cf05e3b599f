import { eachPage, fitAndDraw, Flow, joinNames, measure, MUTED, openDocument, printable, rule, type RenderOptions } from '../shows/pdf/pdf-tools';

/**
 * A bee's year on paper, for a maker who does not use the app: the makers, then month by month who is
 * queen and, once the queen has set it, the block (size, colours, fabric, due date, where it goes).
 * A pure function from plain data to PDF bytes, US Letter or A4, in large type.
 */

export interface ScheduleBlock {
  title: string;
  /** "12 x 12 inches finished (12 1/2 x 12 1/2 inches with seam allowance)" */
  sizeText: string;
  colours: string | null;
  fabric: string;
  /** "Friday 26 March 2027" */
  dueText: string;
  /** "Mail it to: 3 Orchard Row, Wrenfield" or "Bring it to: the March meeting" */
  deliveryText: string;
  patternLink?: string | null;
}

export interface ScheduleMonth {
  /** "March 2027" */
  label: string;
  skipped: boolean;
  queenName: string | null;
  block: ScheduleBlock | null;
}

export interface ScheduleInput {
  guildName: string;
  beeName: string;
  description?: string | null;
  organiserName: string;
  /** "Blocks go by mail" / "Blocks are handed over at meetings" */
  handoverText: string;
  makers: string[];
  months: ScheduleMonth[];
  printedOn: string;
  size: [number, number];
}

export const NOT_SET_YET = 'The queen has not set her block yet. Ask the organiser nearer the time.';
export const SKIPPED = 'No block this month.';

const MARGIN = 54;
const BODY = 13;
const FOOTER_SIZE = 11;

export async function renderBeeSchedule(input: ScheduleInput, options: RenderOptions = {}): Promise<Buffer> {
  const [pageWidth, pageHeight] = input.size;
  const width = pageWidth - 2 * MARGIN;
  const { doc, finish } = openDocument({ size: input.size, title: `${input.beeName}: schedule`, author: input.guildName, subject: 'Bee schedule' }, options);

  let y = MARGIN;
  y = fitAndDraw(doc, input.guildName, MARGIN, y, { width, maxSize: 14, minSize: 11, maxLines: 1, color: MUTED });
  y = fitAndDraw(doc, input.beeName, MARGIN, y + 2, { weight: 'bold', width, maxSize: 26, minSize: 16, maxLines: 2 });
  if (input.description) y = fitAndDraw(doc, input.description, MARGIN, y + 4, { width, maxSize: BODY, minSize: 11, maxLines: 4 });
  y = fitAndDraw(doc, `Organiser: ${input.organiserName}. ${input.handoverText}.`, MARGIN, y + 6, { width, maxSize: BODY, minSize: 11, maxLines: 2 });
  y = fitAndDraw(doc, `Makers: ${joinNames(input.makers)}`, MARGIN, y + 4, { width, maxSize: BODY, minSize: 11, maxLines: 6 });
  y = fitAndDraw(doc, `Printed on ${input.printedOn}. Dates can change; the organiser will tell you.`, MARGIN, y + 4, { width, maxSize: 12, minSize: 11, maxLines: 2, color: MUTED });
  rule(doc, MARGIN, MARGIN + width, y + 8, 1.5);

  const flow = new Flow(doc, MARGIN, width, MARGIN, pageHeight - MARGIN - 10);
  flow.y = y + 20;
  const indent = 16;
  const lineStyle = { size: BODY, width: width - indent };

  for (const month of input.months) {
    const heading = month.skipped ? `${month.label} — skipped` : `${month.label} — Queen: ${month.queenName ?? 'not planned yet'}`;
    const lines: { label: string; text: string }[] = [];
    if (month.skipped) lines.push({ label: '', text: SKIPPED });
    else if (!month.block) lines.push({ label: '', text: NOT_SET_YET });
    else {
      const b = month.block;
      lines.push({ label: 'Block', text: b.title });
      lines.push({ label: 'Size', text: b.sizeText });
      if (b.colours) lines.push({ label: 'Colours', text: b.colours });
      lines.push({ label: 'Fabric', text: b.fabric });
      lines.push({ label: 'Due', text: b.dueText });
      lines.push({ label: '', text: b.deliveryText });
      if (b.patternLink) lines.push({ label: 'Pattern', text: b.patternLink });
    }
    const texts = lines.map((l) => printable(doc, l.label ? `${l.label}: ${l.text}` : l.text));
    const headingHeight = measure(doc, printable(doc, heading), { weight: 'bold', size: 16, width });
    const bodyHeight = texts.reduce((h, t) => h + measure(doc, t, lineStyle) + 3, 0);
    flow.need(headingHeight + bodyHeight + 14);
    flow.y = fitAndDraw(doc, heading, MARGIN, flow.y, { weight: 'bold', width, maxSize: 16, minSize: 13, maxLines: 2 }) + 4;
    for (const t of texts) {
      doc.font('regular').fontSize(BODY).fillColor('#000000');
      const h = measure(doc, t, lineStyle);
      doc.text(t, MARGIN + indent, flow.y, { width: width - indent, lineGap: 0 });
      flow.y += h + 3;
    }
    rule(doc, MARGIN, MARGIN + width, flow.y + 4, 0.5, MUTED);
    flow.y += 14;
  }

  const footerTop = pageHeight - MARGIN + 10;
  eachPage(doc, (i, count) => {
    fitAndDraw(doc, `${input.beeName} — schedule`, MARGIN, footerTop, { width: width * 0.7, maxSize: FOOTER_SIZE, minSize: 9, maxLines: 1, color: MUTED });
    fitAndDraw(doc, `Page ${i + 1} of ${count}`, MARGIN + width * 0.7, footerTop, { width: width * 0.3, align: 'right', maxSize: FOOTER_SIZE, maxLines: 1 });
  });
  return finish();
}
