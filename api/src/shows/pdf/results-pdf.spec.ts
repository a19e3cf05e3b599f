import { lineWith, pageCount, pageTexts, squash } from './pdf-test-helpers';
import { BY_DECISION, CONFIDENTIAL, ResultCategory, ResultStanding, ResultsInput, ballotLine, renderResults, ribbonText, scoreText } from './results-pdf';

// Invented guild, show, people and quilt names.
const standing = (rank: number, entryNumber: number | null, title: string, score: number, over: Partial<ResultStanding> = {}): ResultStanding => ({
  rank,
  entryNumber,
  title,
  makers: ['Hazel Ormsby'],
  score,
  ribbon: null,
  byDecision: false,
  ...over,
});

const bed: ResultCategory = {
  name: 'Bed quilts',
  ballots: 204,
  blank: 3,
  spoiled: 1,
  standings: [
    standing(1, 12, 'Harbour Lights', 41, { ribbon: 1, makers: ['Hazel Ormsby', 'June Pettigrew'] }),
    standing(2, 7, 'Bramble Path', 37, { ribbon: 2, byDecision: true, makers: ['Doreen Achterberg'] }),
    standing(2, 31, 'Saltbox Morning', 37, { ribbon: 3, byDecision: true, makers: ['Priya Castellano'] }),
    standing(4, 3, 'Cobble Lane', 20, { makers: ['Lottie Faraday'] }),
    standing(5, null, 'Thistle Down', 0, { makers: ['Rosa Lindqvist'] }),
  ],
};

const wall: ResultCategory = {
  name: 'Wall quilts',
  ballots: 150,
  blank: 0,
  spoiled: 2,
  standings: [
    standing(1, 40, 'Quarry Blues', 65, { ribbon: 1 }),
    standing(2, 41, 'Wicket Gate', 50, { ribbon: 2 }),
    standing(3, 42, 'Lantern Row', 32),
    standing(4, 43, 'Meadow Pinks', 20),
  ],
  rounds: [
    { counts: { '40': 40, '41': 35, '42': 30, '43': 20 }, eliminated: ['43'], exhausted: 0 },
    { counts: { '40': 50, '41': 40, '42': 32 }, eliminated: ['42'], exhausted: 3 },
    { counts: { '40': 65, '41': 50 }, eliminated: [], exhausted: 7 },
  ],
};

const input: ResultsInput = {
  guildName: 'Wrenfield Quilt Guild',
  showName: 'Wrenfield Spring Quilt Show 2026',
  closedOn: '10 May 2026',
  published: true,
  scoreLabel: 'Votes',
  auditText:
    '312 ballot codes were printed and 204 were used; each code was accepted once.\n\nThe count was run twice from the stored ballots and gave the same result both times.',
  categories: [bed, wall],
};
const created = { createdAt: new Date('2026-05-10T18:00:00Z') };

/** Many categories, so the results run over several pages. */
const many: ResultCategory[] = Array.from({ length: 6 }, (_, c) => ({
  name: `Category ${c + 1}`,
  ballots: 30,
  blank: 2,
  spoiled: 1,
  standings: Array.from({ length: 9 }, (_, i) => standing(i + 1, c * 10 + i + 1, `Orchard Study ${c + 1}-${i + 1}`, 27 - i * 3, { ribbon: i < 3 ? ((i + 1) as 1 | 2 | 3) : null })),
}));

describe('renderResults', () => {
  it('prints the show, the closing date, the audit and each category with its ballots', async () => {
    const pdf = await renderResults(input, created);
    const text = (await pageTexts(pdf)).join('\n');
    for (const needle of [
      'Wrenfield Quilt Guild',
      "Viewer's choice results",
      'Wrenfield Spring Quilt Show 2026',
      'Closed 10 May 2026',
      '312 ballot codes were printed and 204 were used; each code was accepted once.',
      'The count was run twice from the stored ballots and gave the same result both times.',
      'Bed quilts',
      '204 ballots: 200 counted, 3 blank, 1 spoiled',
      'Wall quilts',
      '150 ballots: 148 counted, 0 blank, 2 spoiled',
    ])
      expect(squash(text)).toContain(needle);
    expect(text).not.toContain(CONFIDENTIAL);
  });

  it('prints each standing on one row with its rank, number, makers, score and ribbon', async () => {
    const text = (await pageTexts(await renderResults(input, created))).join('\n');
    expect(lineWith(text, 'Made by')).toBe('Rank No. Title Made by Votes Ribbon');
    expect(lineWith(text, 'Harbour Lights')).toBe('1 12 Harbour Lights Hazel Ormsby and 41 1st');
    const lines = text.split('\n');
    const below = (needle: string, count: number) => {
      const at = lines.findIndex((l) => l.includes(needle));
      return squash(lines.slice(at + 1, at + 1 + count).join(' '));
    };
    // Two makers wrap inside their column, under the first.
    expect(below('Harbour Lights', 1)).toBe('June Pettigrew');
    expect(lineWith(text, 'Bramble Path')).toBe('2 7 Bramble Path Doreen Achterberg 37 2nd');
    expect(lineWith(text, 'Saltbox Morning')).toBe('2 31 Saltbox Morning Priya Castellano 37 3rd');
    expect(lineWith(text, 'Cobble Lane')).toBe('4 3 Cobble Lane Lottie Faraday 20');
    expect(lineWith(text, 'Thistle Down')).toBe('5 — Thistle Down Rosa Lindqvist 0');
    // The chair's decision is noted under both ribbons it gave, and nowhere else.
    expect(text.split(BY_DECISION)).toHaveLength(3);
    expect(below('Bramble Path', 1)).toBe(BY_DECISION);
    expect(below('Saltbox Morning', 1)).toBe(BY_DECISION);
  });

  it('uses the score label for the score column', async () => {
    const text = (await pageTexts(await renderResults({ ...input, scoreLabel: 'Approvals' }, created))).join('\n');
    expect(lineWith(text, 'Made by')).toBe('Rank No. Title Made by Approvals Ribbon');
  });

  it('prints the instant-runoff rounds: counts, exhausted ballots and who went out', async () => {
    const text = (await pageTexts(await renderResults(input, created))).join('\n');
    expect(squash(text)).toContain('Wall quilts: instant-runoff rounds');
    expect(lineWith(text, 'Round 1')).toBe('Entry Round 1 Round 2 Round 3');
    expect(lineWith(text, 'No. 40 Quarry Blues')).toBe('No. 40 Quarry Blues 40 50 65');
    expect(lineWith(text, 'No. 41 Wicket Gate')).toBe('No. 41 Wicket Gate 35 40 50');
    expect(lineWith(text, 'No. 42 Lantern Row')).toBe('No. 42 Lantern Row 30 32 —');
    expect(lineWith(text, 'No. 43 Meadow Pinks')).toBe('No. 43 Meadow Pinks 20 — —');
    expect(lineWith(text, 'Exhausted')).toBe('Exhausted 0 3 7');
    expect(lineWith(text, 'Out after this round')).toBe('Out after this round No. 43 No. 42');
    // No rounds table for a category counted another way.
    expect(text).not.toContain('Bed quilts: instant-runoff rounds');
  });

  it('splits a long count into tables of six rounds', async () => {
    const entries = Array.from({ length: 9 }, (_, i) => String(50 + i));
    const rounds = entries.slice(0, 8).map((_, r) => ({
      counts: Object.fromEntries(entries.slice(0, 9 - r).map((e, i) => [e, 20 - i + r])),
      eliminated: [entries[8 - r]],
      exhausted: r,
    }));
    const category: ResultCategory = { name: 'Group quilts', ballots: 180, blank: 0, spoiled: 0, standings: [], rounds };
    const text = (await pageTexts(await renderResults({ ...input, categories: [category] }, created))).join('\n');
    expect(squash(text)).toContain('Group quilts: instant-runoff rounds (rounds 1–6)');
    expect(squash(text)).toContain('Group quilts: instant-runoff rounds (rounds 7–8)');
    expect(lineWith(text, 'Round 1')).toBe('Entry Round 1 Round 2 Round 3 Round 4 Round 5 Round 6');
    expect(lineWith(text, 'Round 7')).toBe('Entry Round 7 Round 8');
    expect(text.split('\n').filter((l) => l.includes('Exhausted')).map(squash)).toEqual(['Exhausted 0 1 2 3 4 5', 'Exhausted 6 7']);
  });

  it('marks every page confidential until the results are announced', async () => {
    const pdf = await renderResults({ ...input, published: false, categories: [bed, wall, ...many] }, created);
    const count = await pageCount(pdf);
    expect(count).toBeGreaterThanOrEqual(3);
    const pages = await pageTexts(pdf);
    pages.forEach((text, i) => {
      // The first line of the page, above everything else.
      expect(squash(text.split('\n').find((l) => l.trim() !== '')!)).toBe(CONFIDENTIAL);
      expect(text.split(CONFIDENTIAL)).toHaveLength(2);
      expect(squash(text)).toContain(`Page ${i + 1} of ${count}`);
    });
    // Every standing is still there across the pages.
    for (const c of many) for (const s of c.standings) expect(pages.join('\n')).toContain(s.title);
  });

  it('leaves the banner off once announced, on every page', async () => {
    const pdf = await renderResults({ ...input, categories: [bed, wall, ...many] }, created);
    const pages = await pageTexts(pdf);
    expect(pages.length).toBeGreaterThanOrEqual(3);
    for (const text of pages) expect(text).not.toContain(CONFIDENTIAL);
  });

  it('carries a long audit over the page break without cutting it short', async () => {
    const sentences = Array.from({ length: 120 }, (_, i) => `Check ${i + 1}: the ballots of table ${i + 1} were counted again and agreed.`);
    const auditText = `${sentences.slice(0, 60).join(' ')}\n\n${sentences.slice(60).join(' ')}`;
    const pdf = await renderResults({ ...input, auditText }, created);
    expect(await pageCount(pdf)).toBeGreaterThanOrEqual(2);
    // The page footers (drawn last) taken out, the pages read as one text.
    const footer = /Viewer's choice results — Wrenfield Spring Quilt Show 2026\s+Page \d+ of \d+/;
    const raw = squash((await pageTexts(pdf, 'raw')).map((page) => page.replace(footer, ' ')).join(' '));
    for (const s of sentences) expect(raw).toContain(s);
    expect(raw).not.toContain('…');
  });

  it('says when voting has not closed, and when a category has no entries', async () => {
    const text = squash(
      (await pageTexts(await renderResults({ ...input, closedOn: null, categories: [{ ...bed, standings: [], ballots: 0, blank: 0, spoiled: 0 }] }, created))).join(' '),
    );
    expect(text).toContain('Voting has not closed yet');
    expect(text).toContain('Bed quilts 0 ballots: 0 counted, 0 blank, 0 spoiled No entries in this category.');
  });

  it('refuses ballot counts that do not add up', async () => {
    await expect(renderResults({ ...input, categories: [{ ...bed, blank: 200, spoiled: 5 }] })).rejects.toThrow(
      'Bed quilts: blank and spoiled ballots add up to more than the ballots.',
    );
    await expect(renderResults({ ...input, categories: [{ ...bed, ballots: 1.5 }] })).rejects.toThrow(/whole number/);
  });

  it('renders the same bytes for the same results', async () => {
    const [a, b] = await Promise.all([renderResults(input, created), renderResults(input, created)]);
    expect(a.equals(b)).toBe(true);
  });
});

describe('result wording', () => {
  it('writes ribbons, scores and ballot lines', () => {
    expect([ribbonText(1, false), ribbonText(2, true), ribbonText(3, false), ribbonText(null, false)]).toEqual([
      '1st',
      `2nd ${BY_DECISION}`,
      '3rd',
      '',
    ]);
    expect([scoreText(1234), scoreText(2.5), scoreText(0)]).toEqual(['1,234', '2.5', '0']);
    expect(ballotLine({ ballots: 1, blank: 0, spoiled: 0 })).toBe('1 ballot: 1 counted, 0 blank, 0 spoiled');
  });
});
