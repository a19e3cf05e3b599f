import { HAND_IN, PAPER_HEADING, TOO_MANY, paperInstruction, paperRows, renderPaperBallots } from './paper-ballots';
import { CUT_CAUTION } from './pdf-tools';
import { pageCount, pageTexts, squash } from './pdf-test-helpers';

const base = {
  guildName: 'Wrenfield Quilt Guild',
  showName: 'Wrenfield Spring Quilt Show',
  kind: 'per_category' as const,
  rankDepth: 3,
  categories: ['Small', 'Medium', 'Large', 'Group quilts'],
  codes: ['K7QM-3XHD-9PRW', 'PNCF-3G6Z-19H7', '22W9-6F7Q-0XQD'],
};

describe('paper ballots', () => {
  it('asks for what the kind of ballot counts', () => {
    expect(paperRows(base)).toEqual(['Small', 'Medium', 'Large', 'Group quilts']);
    expect(paperRows({ ...base, kind: 'ranked', rankDepth: 3 })).toEqual(['1st choice', '2nd choice', '3rd choice']);
    expect(paperInstruction('approval', 3)).toContain('every quilt you like');
    expect(paperInstruction('ranked', 4)).toContain('your 4 favourite quilts in order');
  });

  it('prints two ballots to a page, each with its code, its boxes and where to hand it in', async () => {
    const pdf = await renderPaperBallots(base, { createdAt: new Date('2026-05-01T12:00:00Z') });
    expect(await pageCount(pdf)).toBe(2);
    const [first, second] = (await pageTexts(pdf)).map(squash);
    for (const text of [PAPER_HEADING, 'K7QM-3XHD-9PRW', 'PNCF-3G6Z-19H7', 'Small', 'Group quilts', HAND_IN, CUT_CAUTION]) expect(first).toContain(squash(text));
    expect(second).toContain('22W9-6F7Q-0XQD');
    expect(second).not.toContain(squash(CUT_CAUTION)); // a lone half-sheet has nothing to cut
  });

  it('says to use the back when the categories cannot all fit', async () => {
    const many = Array.from({ length: 40 }, (_, i) => `Category ${i + 1}`);
    const [text] = (await pageTexts(await renderPaperBallots({ ...base, categories: many, codes: ['K7QM-3XHD-9PRW'] }))).map(squash);
    expect(text).toContain(squash(TOO_MANY));
    expect(text).toContain('Category 1');
  });

  it('refuses to print without a code', async () => {
    await expect(renderPaperBallots({ ...base, codes: [] })).rejects.toThrow('at least one code');
  });
});
