import jsQR from 'jsqr';
import {
  BALLOT_HEADING,
  BallotCard,
  BallotCardsInput,
  CARD_HEIGHT,
  CARD_WIDTH,
  ONCE_ONLY,
  cardOrigin,
  instruction,
  renderBallotCards,
  shortUrl,
} from './ballot-cards';
import { CUT_CAUTION } from './pdf-tools';
import { cropRgba, pageCount, pageTexts, rasterise, squash } from './pdf-test-helpers';

/** Made-up codes from an unambiguous alphabet, grouped for print as the caller does. */
function makeCards(count: number): BallotCard[] {
  const alphabet = 'ABCDEFGHJKMNPQRSTVWXYZ23456789';
  return Array.from({ length: count }, (_, i) => {
    let raw = '';
    for (let k = 0; k < 12; k++) raw += alphabet[(i * 7 + k * 13 + k * k * (i + 1)) % alphabet.length];
    return { code: `${raw.slice(0, 4)}-${raw.slice(4, 8)}-${raw.slice(8)}`, url: `https://selvage.example/vote/${raw}` };
  });
}

const cards = makeCards(12);
const input: BallotCardsInput = {
  guildName: 'Wrenfield Quilt Guild',
  showName: 'Wrenfield Spring Quilt Show 2026',
  voteUrlBase: 'https://selvage.example/vote',
  cards,
};
const created = { createdAt: new Date('2026-05-01T12:00:00Z') };
const DPI = 150;

/** What jsQR reads from each card cell of a page, in slot order; null where it reads nothing. */
async function decodePage(pdf: Buffer, page: number, slots: number): Promise<(string | null)[]> {
  const image = await rasterise(pdf, page, DPI);
  const px = DPI / 72;
  return Array.from({ length: slots }, (_, slot) => {
    const { x, y } = cardOrigin(slot);
    // The cell only, a little inside the cut lines, so a neighbour's code cannot be read instead.
    const cell = cropRgba(image, (x + 2) * px, (y + 2) * px, (CARD_WIDTH - 4) * px, (CARD_HEIGHT - 4) * px);
    return jsQR(cell.data, cell.width, cell.height)?.data ?? null;
  });
}

describe('renderBallotCards', () => {
  it('puts ten cards on a page and each QR code opens its own card’s link', async () => {
    const pdf = await renderBallotCards(input, created);
    expect(await pageCount(pdf)).toBe(2);
    expect(new Set(cards.map((c) => c.url)).size).toBe(cards.length);
    expect(await decodePage(pdf, 1, 10)).toEqual(cards.slice(0, 10).map((c) => c.url));
    expect(await decodePage(pdf, 2, 2)).toEqual(cards.slice(10).map((c) => c.url));
  });

  it('prints every code, in order, with the instructions on every card', async () => {
    const pdf = await renderBallotCards(input, created);
    const [one, two] = (await pageTexts(pdf, 'raw')).map(squash);
    const positions = cards.slice(0, 10).map((c) => one.indexOf(c.code));
    expect(positions.every((p) => p >= 0)).toBe(true);
    expect([...positions].sort((a, b) => a - b)).toEqual(positions);
    for (const c of cards.slice(10)) {
      expect(two).toContain(c.code);
      expect(one).not.toContain(c.code);
    }
    expect(instruction(input.voteUrlBase)).toBe('Scan with your phone camera, or go to selvage.example/vote and type the code.');
    for (const [text, count] of [
      [one, 10],
      [two, 2],
    ] as const) {
      expect(text.split(instruction(input.voteUrlBase))).toHaveLength(count + 1);
      expect(text.split(ONCE_ONLY)).toHaveLength(count + 1);
      expect(text.split(BALLOT_HEADING)).toHaveLength(count + 1);
      expect(text.split(input.showName)).toHaveLength(count + 1);
      expect(text).toContain(CUT_CAUTION);
    }
    // Side by side, the codes read left card then right card, row by row.
    const layout = (await pageTexts(pdf))[0];
    const row = layout.split('\n').find((l) => l.includes(cards[0].code))!;
    expect(squash(row)).toBe(`${cards[0].code} ${cards[1].code}`);
  });

  it('reads its codes at print size from a long link on the same card', async () => {
    const long = makeCards(2).map((c, i) => ({ ...c, url: `https://ballots.wrenfield-quilt-guild.example/shows/2026-spring/vote/${c.code.replace(/-/g, '')}?card=${i + 1}` }));
    const pdf = await renderBallotCards({ ...input, cards: long }, created);
    expect(await decodePage(pdf, 1, 2)).toEqual(long.map((c) => c.url));
  });

  it('refuses a link too long to scan from a card', async () => {
    const url = `https://selvage.example/vote/${'X'.repeat(400)}`;
    await expect(renderBallotCards({ ...input, cards: [{ code: 'AAAA-BBBB-CCCC', url }] })).rejects.toThrow(/too fine to scan/);
  });

  it('refuses a card without a code or a link', async () => {
    await expect(renderBallotCards({ ...input, cards: [{ code: 'AAAA', url: '' }] })).rejects.toThrow('Ballot card 1 has no link for its QR code.');
    await expect(renderBallotCards({ ...input, cards: [{ code: ' ', url: 'https://selvage.example/vote/A' }] })).rejects.toThrow('Ballot card 1 has no code.');
  });

  it('prints one page saying so when there are no cards', async () => {
    const pdf = await renderBallotCards({ ...input, cards: [] }, created);
    expect(await pageCount(pdf)).toBe(1);
    expect(squash((await pageTexts(pdf))[0])).toContain('There are no ballot cards to print.');
  });

  it('renders the same bytes for the same cards', async () => {
    const [a, b] = await Promise.all([renderBallotCards(input, created), renderBallotCards(input, created)]);
    expect(a.equals(b)).toBe(true);
  });
});

describe('shortUrl', () => {
  it('drops the scheme and any trailing slash', () => {
    expect(shortUrl('https://selvage.example/vote')).toBe('selvage.example/vote');
    expect(shortUrl(' http://wrenfield.example/vote/ ')).toBe('wrenfield.example/vote');
    expect(shortUrl('selvage.example/vote')).toBe('selvage.example/vote');
  });
});
