import { EMPTY_CATEGORY, EntryListCategory, EntryListInput, NO_ENTRIES_YET, renderEntryList, statusLabel } from './entry-list';
import { lineWith, pageCount, pageTexts, squash } from './pdf-test-helpers';

// Invented guild, show, people and quilt names.
const WORDS = ['Harbour', 'Bramble', 'Lantern', 'Meadow', 'Saltbox', 'Orchard', 'Cobble', 'Thistle', 'Quarry', 'Wicket'];
const PEOPLE = ['Hazel Ormsby', 'Doreen Achterberg', 'Priya Castellano', 'Lottie Faraday', 'June Pettigrew', 'Rosa Lindqvist'];
const STATUSES = ['accepted', 'submitted', 'declined', 'withdrawn'];
const LONG_TITLE =
  'Evening Tide over the Salt Marsh, with Herons, Reeds and a Thousand Tiny Flying Geese Gathered in Rows from the Scrap Bag of Three Generations of Wrenfield Stitchers Who Kept Every Last Piece';

/** 120 entries in four categories, each title unique ("Harbour Bramble 001"); entry 7 has no number yet. */
function categories(): EntryListCategory[] {
  const names = ['Bed quilts', 'Wall quilts', 'Small quilts', 'Group quilts'];
  return names.map((name, c) => ({
    name,
    entries: Array.from({ length: 30 }, (_, i) => {
      const n = c * 30 + i + 1;
      return {
        entryNumber: n === 7 ? null : n,
        title: n === 45 ? LONG_TITLE : `${WORDS[n % 10]} ${WORDS[(n * 3 + 1) % 10]} ${String(n).padStart(3, '0')}`,
        makers: n % 5 === 0 ? [PEOPLE[n % 6], PEOPLE[(n + 1) % 6]] : [PEOPLE[n % 6]],
        quilter: n % 3 === 0 ? '' : PEOPLE[(n + 2) % 6],
        sizeText: `${40 + (n % 30)} x ${50 + (n % 20)} in`,
        status: STATUSES[n % 4],
        forSale: n % 2 === 0,
      };
    }),
  }));
}

const input: EntryListInput = {
  guildName: 'Wrenfield Quilt Guild',
  showName: 'Wrenfield Spring Quilt Show 2026',
  venue: 'Wrenfield Grange Hall',
  datesText: 'Friday 8 May – Sunday 10 May 2026',
  printedOn: '2 May 2026',
  categories: [...categories(), { name: 'Miniatures', entries: [] }],
};
const created = { createdAt: new Date('2026-05-02T12:00:00Z') };
const HEADER = 'No. Title Made by Quilted by Size Status For sale';

describe('renderEntryList', () => {
  let pdf: Buffer;
  let pages: string[];
  beforeAll(async () => {
    pdf = await renderEntryList(input, created);
    pages = await pageTexts(pdf);
  });

  it('numbers every page "Page n of N" and dates it, over several pages', async () => {
    const count = await pageCount(pdf);
    expect(count).toBeGreaterThanOrEqual(4);
    expect(pages).toHaveLength(count);
    pages.forEach((text, i) => {
      expect(squash(text)).toContain(`Page ${i + 1} of ${count}`);
      expect(squash(text)).toContain('Printed on 2 May 2026');
      // The page number is on the last line of the page.
      expect(text.trimEnd().split('\n').pop()).toContain(`Page ${i + 1} of ${count}`);
    });
    expect(squash(pages.join(' ')).match(/Page \d+ of \d+/g)).toHaveLength(count);
  });

  it('repeats the table header on every page and says which category carries on', () => {
    pages.forEach((text) => expect(lineWith(text, 'Quilted by')).toBe(HEADER));
    for (const text of pages.slice(1)) expect(text).toMatch(/(Bed|Wall|Small|Group) quilts \(continued\)|Wrenfield Spring Quilt Show 2026 — entry list/);
    expect(pages.slice(1).some((t) => /quilts \(continued\)/.test(t))).toBe(true);
    expect(squash(pages[0])).toContain('Entry list — Wrenfield Spring Quilt Show 2026');
    expect(squash(pages[0])).toContain('Wrenfield Grange Hall · Friday 8 May – Sunday 10 May 2026');
  });

  it('prints every entry exactly once, on one row with its number, people, size, status and sale', () => {
    const all = pages.join('\n');
    for (const category of input.categories)
      for (const e of category.entries) {
        if (e.title === LONG_TITLE) continue;
        expect(all.split(e.title)).toHaveLength(2);
        const expected = [
          e.entryNumber === null ? '—' : String(e.entryNumber),
          e.title,
          e.makers.length === 2 ? null : e.makers[0],
          e.quilter || null,
          e.sizeText,
          statusLabel(e.status),
          e.forSale ? 'Yes' : null,
        ].filter((p) => p !== null);
        // Two makers wrap onto a second line, so only the row's first line is compared for them.
        if (e.makers.length === 2) expect(lineWith(all, e.title).startsWith(`${e.entryNumber ?? '—'} ${e.title} ${e.makers[0]} and`)).toBe(true);
        else expect(lineWith(all, e.title)).toBe(expected.join(' '));
      }
  });

  it('prints a long title whole, wrapped inside its column', async () => {
    const raw = squash((await pageTexts(pdf, 'raw')).join(' '));
    expect(raw).toContain(LONG_TITLE);
    expect(raw).not.toContain('…');
  });

  it('says when a category has no entries', () => {
    const last = squash(pages[pages.length - 1]);
    expect(last).toContain(`Miniatures ${EMPTY_CATEGORY}`);
  });

  it('renders the same bytes for the same list', async () => {
    expect((await renderEntryList(input, created)).equals(pdf)).toBe(true);
  });

  it('prints one page saying so when there are no entries', async () => {
    const empty = await renderEntryList({ ...input, categories: [] }, created);
    const [text] = await pageTexts(empty);
    expect(await pageCount(empty)).toBe(1);
    expect(squash(text)).toContain(NO_ENTRIES_YET);
    expect(squash(text)).toContain('Page 1 of 1');
  });
});

describe('statusLabel', () => {
  it('names the four statuses and passes anything else through', () => {
    expect(['accepted', 'SUBMITTED', 'Declined', 'withdrawn'].map(statusLabel)).toEqual(['Accepted', 'Submitted', 'Declined', 'Withdrawn']);
    expect(statusLabel('On hold')).toBe('On hold');
  });
});
