import PDFDocument from 'pdfkit';
import { HangTagEntry, HangTagsInput, MAKERS_HIDDEN, NO_ENTRIES, TAG_HEIGHT, TAG_WIDTH, renderHangTags, tagOrigin } from './hang-tags';
import { CUT_CAUTION } from './pdf-tools';
import { Word, pageCount, pageTexts, squash, wordBoxes } from './pdf-test-helpers';

// An invented guild, show and people.
const entry = (over: Partial<HangTagEntry>): HangTagEntry => ({
  entryNumber: 1,
  title: 'Harbour Lights',
  categoryName: 'Bed quilts',
  sizeText: '60 1/2 x 72 in',
  makers: ['Hazel Ormsby'],
  quilter: 'June Pettigrew',
  forSale: false,
  priceCents: null,
  ...over,
});

const show: HangTagsInput = {
  guildName: 'Wrenfield Quilt Guild',
  showName: 'Wrenfield Spring Quilt Show 2026',
  hideMakers: false,
  currency: 'USD',
  entries: [
    entry({ entryNumber: 17, makers: ['Hazel Ormsby', 'Doreen Achterberg'], forSale: true, priceCents: 45000 }),
    entry({ entryNumber: 18, title: 'Bramble Path', categoryName: 'Wall quilts', sizeText: '24 x 36 in', quilter: '', forSale: true }),
    entry({ entryNumber: null, title: 'Saltbox Morning', makers: ['Zoë Ångström-Núñez'], quilter: 'Priya Castellano' }),
    entry({ entryNumber: 20, title: 'Cobble Lane', makers: ['Lottie Faraday'], quilter: 'Lottie Faraday' }),
    entry({ entryNumber: 21, title: 'Thistle Down', makers: ['June Pettigrew'], quilter: 'Rosa Lindqvist' }),
  ],
};

const created = { createdAt: new Date('2026-05-01T12:00:00Z') };

/** The tag slot (0–3) a word's centre falls in, or -1 outside every tag. */
function slotOf(w: Word): number {
  const cx = (w.xMin + w.xMax) / 2;
  const cy = (w.yMin + w.yMax) / 2;
  for (let slot = 0; slot < 4; slot++) {
    const { x, y } = tagOrigin(slot);
    if (cx >= x && cx <= x + TAG_WIDTH && cy >= y && cy <= y + TAG_HEIGHT) return slot;
  }
  return -1;
}

const INSET = 10; // the tags keep 18 pt of white inside their edges; any word closer than 10 pt is out of place

/** Words in reading order: top to bottom, then left to right. */
const reading = (words: Word[]) => [...words].sort((a, b) => a.yMin - b.yMin || a.xMin - b.xMin);

/**
 * Everything wrong with where a page's words landed: a word outside its tag's inset box, two words
 * overlapping, a title word not in the tag it belongs to, or above the number, or below the first detail.
 * `titleWords[slot]` lists the words of that slot's title; each must appear once, in order.
 */
function placementProblems(words: Word[], titleWords: string[][]): string[] {
  const problems: string[] = [];
  const inTags = words.filter((w) => !CUT_CAUTION.includes(w.text) || w.yMin < tagOrigin(2).y + TAG_HEIGHT);
  for (const w of inTags) {
    const slot = slotOf(w);
    if (slot < 0) {
      problems.push(`"${w.text}" is outside every tag`);
      continue;
    }
    const { x, y } = tagOrigin(slot);
    if (w.xMin < x + INSET || w.xMax > x + TAG_WIDTH - INSET || w.yMin < y + INSET || w.yMax > y + TAG_HEIGHT - INSET)
      problems.push(`"${w.text}" runs to the edge of tag ${slot}`);
  }
  for (let i = 0; i < words.length; i++)
    for (let j = i + 1; j < words.length; j++) {
      const a = words[i];
      const b = words[j];
      const overlapX = Math.min(a.xMax, b.xMax) - Math.max(a.xMin, b.xMin);
      const overlapY = Math.min(a.yMax, b.yMax) - Math.max(a.yMin, b.yMin);
      if (overlapX > 0.5 && overlapY > 0.5) problems.push(`"${a.text}" overlaps "${b.text}"`);
    }
  titleWords.forEach((expected, slot) => {
    const mine = new Set(expected);
    const found = reading(words.filter((w) => mine.has(w.text)));
    const elsewhere = found.filter((w) => slotOf(w) !== slot);
    for (const w of elsewhere) problems.push(`title word "${w.text}" of tag ${slot} is in tag ${slotOf(w)}`);
    if (found.map((w) => w.text).join(' ') !== expected.join(' ')) problems.push(`the title of tag ${slot} is not printed whole and in order`);
    const tagWords = words.filter((w) => slotOf(w) === slot);
    const number = tagWords.find((w) => w.text === 'No.');
    const firstDetail = reading(tagWords.filter((w) => w.text === 'Category:' || w.text === 'Size:'))[0];
    for (const w of found) {
      if (number && w.yMin < number.yMax - 0.5) problems.push(`title word "${w.text}" is level with or above the number in tag ${slot}`);
      if (firstDetail && w.yMax > firstDetail.yMin + 0.5) problems.push(`title word "${w.text}" runs into the details in tag ${slot}`);
    }
  });
  return problems;
}

/** A title of at least `length` characters made of words that name their tag, e.g. "t2w0 t2w1 …". */
function markedTitle(slot: number, length: number): string[] {
  const words: string[] = [];
  while (words.join(' ').length < length) words.push(`t${slot}w${words.length}`);
  return words;
}

describe('renderHangTags', () => {
  it('prints every part of each tag, four to a page in the order given', async () => {
    const pdf = await renderHangTags(show, created);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(await pageCount(pdf)).toBe(2);
    // Raw text follows the drawing order, one tag after another.
    const [one, two] = await pageTexts(pdf, 'raw');
    for (const needle of [
      'Wrenfield Quilt Guild',
      'Wrenfield Spring Quilt Show 2026',
      'No. 17',
      'Harbour Lights',
      'Category: Bed quilts',
      'Size: 60 1/2 x 72 in',
      'Made by Hazel Ormsby and Doreen Achterberg',
      'Quilted by June Pettigrew',
      'For sale: $450.00',
      'Bramble Path',
      'Category: Wall quilts',
      'Size: 24 x 36 in',
      'No. —',
      'Made by Zoë Ångström-Núñez',
      'No. 20',
    ])
      expect(squash(one)).toContain(needle);
    // "For sale" with no price on the second tag; no quilter line where none was given.
    expect(squash(one).match(/For sale(?!:)/g)).toHaveLength(1);
    expect(squash(one).match(/Quilted by/g)).toHaveLength(3);
    expect(squash(one)).toContain(CUT_CAUTION);
    expect(squash(two)).toContain('No. 21');
    expect(squash(two)).toContain('Thistle Down');
    expect(squash(two)).toContain(CUT_CAUTION);
    expect(squash(two)).not.toContain('Harbour Lights');

    // Each number sits in its own slot: left to right, then down.
    const [words] = await wordBoxes(pdf);
    const numberSlot = (n: string) => slotOf(words.find((w) => w.text === n)!);
    expect(['17', '18', '—', '20'].map(numberSlot)).toEqual([0, 1, 2, 3]);
    expect(placementProblems(words, [])).toEqual([]);
  });

  it('hides the makers and quilters while judging is on', async () => {
    const text = squash((await pageTexts(await renderHangTags({ ...show, hideMakers: true }, created), 'raw')).join(' '));
    expect(text.split(MAKERS_HIDDEN)).toHaveLength(show.entries.length + 1);
    for (const name of ['Hazel', 'Achterberg', 'Pettigrew', 'Ångström', 'Castellano', 'Faraday', 'Lindqvist', 'Made by', 'Quilted by'])
      expect(text).not.toContain(name);
    expect(text).toContain('Harbour Lights');
  });

  it('keeps 200-character titles whole and inside their own tags', async () => {
    const titles = [0, 1, 2, 3].map((slot) => markedTitle(slot, 200));
    titles.forEach((t) => expect(t.join(' ').length).toBeGreaterThanOrEqual(200));
    const entries = titles.map((t, slot) =>
      entry({ entryNumber: 1000 + slot, title: t.join(' '), forSale: slot % 2 === 0, priceCents: slot === 0 ? 125000 : null }),
    );
    const pdf = await renderHangTags({ ...show, entries }, created);
    expect(await pageCount(pdf)).toBe(1);
    const [words] = await wordBoxes(pdf);
    expect(placementProblems(words, titles)).toEqual([]);
  });

  it('fits the longest of everything on one tag without overlaps, shrinking before it shortens', async () => {
    const title =
      'Evening Tide over the Salt Marsh, with Herons, Reeds and a Thousand Tiny Flying Geese Gathered in Rows from the Scrap Bag of Three Generations of Wrenfield Stitchers';
    const unbroken = 'Pinwheelsandflyinggeeseandbearpawsandlogcabinsandmore';
    const worst = entry({
      entryNumber: 99999,
      title: `${title} ${unbroken}`,
      categoryName: 'Art quilts and wall hangings made by small groups of friends',
      makers: ['Doreen Achterberg', 'Priya Castellano', 'Lottie Faraday', 'Rosa Lindqvist'],
      quilter: 'Maud Ellery-Pike of the Thursday Evening Longarm Circle',
      forSale: true,
      priceCents: 123456789,
    });
    const pdf = await renderHangTags({ ...show, showName: 'Wrenfield Spring Quilt Show and Members’ Challenge Exhibition 2026', entries: [worst, worst, worst, worst] }, created);
    const [words] = await wordBoxes(pdf);
    expect(placementProblems(words, [])).toEqual([]);
    // The whole title is there in tag 0 (the long word broken across lines, but every letter printed).
    const tag0 = reading(words.filter((w) => slotOf(w) === 0))
      .map((w) => w.text)
      .join('');
    expect(tag0).toContain(`${title} ${unbroken}`.replace(/\s/g, ''));
    expect(tag0).toContain('$1,234,567.89');
    expect(tag0).not.toContain('…');
  });

  it('shortens a title too long for any size with "…", still inside its tag', async () => {
    const title = markedTitle(0, 1500);
    const pdf = await renderHangTags({ ...show, entries: [entry({ entryNumber: 5, title: title.join(' ') })] }, created);
    const [words] = await wordBoxes(pdf);
    expect(placementProblems(words, [])).toEqual([]);
    const printed = reading(words.filter((w) => w.text.startsWith('t0w'))).map((w) => w.text);
    expect(printed.length).toBeGreaterThan(40);
    expect(printed.length).toBeLessThan(title.length);
    // The words that are printed are the title's first ones, and the last one ends the title with "…".
    expect(printed.slice(0, -1)).toEqual(title.slice(0, printed.length - 1));
    expect(printed[printed.length - 1]).toMatch(/…$/);
  });

  it('prints one page saying so when there are no entries', async () => {
    const pdf = await renderHangTags({ ...show, entries: [] }, created);
    expect(await pageCount(pdf)).toBe(1);
    const [text] = await pageTexts(pdf);
    expect(squash(text)).toContain(NO_ENTRIES);
    expect(text).not.toContain('No. ');
  });

  it('renders the same bytes for the same tags', async () => {
    const [a, b] = await Promise.all([renderHangTags(show, created), renderHangTags(show, created)]);
    expect(a.equals(b)).toBe(true);
  });
});

describe('the placement check', () => {
  /** A page drawn by hand, to prove the check notices what it is meant to notice. */
  async function handDrawn(draw: (doc: PDFKit.PDFDocument) => void): Promise<Word[]> {
    const doc = new PDFDocument({ size: [612, 792], margin: 0 });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
    draw(doc);
    doc.end();
    return (await wordBoxes(await done))[0];
  }

  it('catches a title running out of its tag into the next one', async () => {
    const title = markedTitle(0, 200);
    const { x, y } = tagOrigin(0);
    const words = await handDrawn((doc) => doc.fontSize(14).text(title.join(' '), x + 18, y + 120, { width: 420 }));
    const problems = placementProblems(words, [title]);
    expect(problems.some((p) => /title word "t0w\d+" of tag 0 is in tag 1/.test(p))).toBe(true);
  });

  it('catches a title running past the bottom of its tag', async () => {
    const title = markedTitle(0, 400);
    const { x, y } = tagOrigin(0);
    const words = await handDrawn((doc) => doc.fontSize(16).text(title.join(' '), x + 18, y + 200, { width: TAG_WIDTH - 36 }));
    expect(placementProblems(words, [title]).some((p) => /tag 2|edge of tag 0/.test(p))).toBe(true);
  });

  it('catches text drawn over other text, and a title run into the details', async () => {
    const title = markedTitle(0, 60);
    const { x, y } = tagOrigin(0);
    const words = await handDrawn((doc) => {
      doc.fontSize(12).text('Category: Bed quilts', x + 18, y + 100, { lineBreak: false });
      doc.fontSize(12).text(title.join(' '), x + 18, y + 96, { width: TAG_WIDTH - 36 });
    });
    const problems = placementProblems(words, [title]);
    expect(problems.some((p) => p.includes('overlaps'))).toBe(true);
    expect(problems.some((p) => p.includes('runs into the details'))).toBe(true);
  });
});
