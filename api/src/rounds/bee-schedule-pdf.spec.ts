import { pageCount, pageTexts, squash } from '../shows/pdf/pdf-test-helpers';
import { NOT_SET_YET, renderBeeSchedule, SKIPPED, type ScheduleInput } from './bee-schedule-pdf';

// An invented bee in an invented town.
const input: ScheduleInput = {
  guildName: 'Wrenfield Quilt Guild',
  beeName: 'Lantern Street Bee',
  description: 'Scrappy stars by mail.',
  organiserName: 'Agnes Hollowell',
  handoverText: 'Blocks go by mail',
  makers: ['Agnes Hollowell', 'Mabel Thornbury', 'June Pettigrew'],
  printedOn: '2 December 2026',
  size: [612, 792],
  months: [
    {
      label: 'January 2027',
      skipped: false,
      queenName: 'Mabel Thornbury',
      block: {
        title: 'Snowy Star',
        sizeText: '12 x 12 inches finished (12 1/2 x 12 1/2 inches with seam allowance)',
        colours: 'Marigold, Lagoon; background Cream',
        fabric: 'From your own stash',
        dueText: 'Friday 26 February 2027',
        deliveryText: 'Mail it to: 3 Orchard Row, Wrenfield',
      },
    },
    { label: 'February 2027', skipped: true, queenName: null, block: null },
    { label: 'March 2027', skipped: false, queenName: 'June Pettigrew', block: null },
  ],
};

describe('renderBeeSchedule', () => {
  it('lists the makers and, month by month, the queen and her block', async () => {
    const pdf = await renderBeeSchedule(input);
    expect(await pageCount(pdf)).toBe(1);
    const text = squash((await pageTexts(pdf)).join(' '));
    expect(text).toContain('Lantern Street Bee');
    expect(text).toContain('Makers: Agnes Hollowell, Mabel Thornbury and June Pettigrew');
    expect(text).toContain('January 2027 — Queen: Mabel Thornbury');
    expect(text).toContain('Block: Snowy Star');
    expect(text).toContain('Size: 12 x 12 inches finished');
    expect(text).toContain('Colours: Marigold, Lagoon; background Cream');
    expect(text).toContain('Due: Friday 26 February 2027');
    expect(text).toContain('Mail it to: 3 Orchard Row, Wrenfield');
    expect(text).toContain(`February 2027 — skipped ${SKIPPED}`);
    expect(text).toContain(`March 2027 — Queen: June Pettigrew ${NOT_SET_YET}`);
    expect(text).toContain('Page 1 of 1');
  });

  it('runs a two-year bee over pages on A4 without losing a month', async () => {
    const months = Array.from({ length: 24 }, (_, i) => ({ ...input.months[0], label: `Month ${i + 1}`, queenName: `Queen ${i + 1}` }));
    const pdf = await renderBeeSchedule({ ...input, size: [595.28, 841.89], months });
    const count = await pageCount(pdf);
    expect(count).toBeGreaterThan(1);
    const pages = await pageTexts(pdf);
    const text = squash(pages.join(' '));
    for (let i = 1; i <= 24; i++) expect(text).toContain(`Month ${i} — Queen: Queen ${i}`);
    pages.forEach((p, i) => expect(squash(p)).toContain(`Page ${i + 1} of ${count}`));
  });
});
