import { rankWithTies } from './rank';
import { defaultPlaces, ribbons } from './ribbons';

const won = (r: ReturnType<typeof ribbons>) => r.ribbons.map((x) => `${x.entry}:${x.place}`);

describe('defaultPlaces', () => {
  it('gives 1st only up to 3 entries, 1st and 2nd up to 6, three places above', () => {
    expect([0, 1, 3, 4, 6, 7, 40].map(defaultPlaces)).toEqual([0, 1, 1, 2, 2, 3, 3]);
  });
});

// The default rule and its check values (3 entries → 1 ribbon, 5 → 2, a tie for 1st shares it with no 3rd,
// a tie for 3rd → 4 ribbons) are TRADE.md §6.6 and its check-values table (source S69).
describe('ribbons (default rule)', () => {
  it('3 entries → 1 ribbon', () => {
    expect(won(ribbons(rankWithTies({ a: 5, b: 3, c: 1 })))).toEqual(['a:1']);
  });

  it('5 entries → 2 ribbons', () => {
    expect(won(ribbons(rankWithTies({ a: 9, b: 7, c: 5, d: 3, e: 1 })))).toEqual(['a:1', 'b:2']);
  });

  it('7 entries → 3 ribbons', () => {
    expect(won(ribbons(rankWithTies({ a: 9, b: 7, c: 5, d: 3, e: 1, f: 1, g: 0 })))).toEqual(['a:1', 'b:2', 'c:3']);
  });

  it('a tie for 1st is shared and no 3rd is given', () => {
    const r = ribbons(rankWithTies({ a: 8, b: 8, c: 5, d: 3, e: 2, f: 1, g: 1 }));
    expect(won(r)).toEqual(['a:1', 'b:1']);
  });

  it('a tie for 2nd is shared and no 3rd is given', () => {
    expect(won(ribbons(rankWithTies({ a: 9, b: 6, c: 6, d: 3, e: 2, f: 1, g: 1 })))).toEqual(['a:1', 'b:2', 'c:2']);
  });

  it('a tie for 3rd gives four ribbons', () => {
    const r = ribbons(rankWithTies({ a: 9, b: 7, c: 4, d: 4, e: 2, f: 1, g: 0 }));
    expect(won(r)).toEqual(['a:1', 'b:2', 'c:3', 'd:3']);
    expect(r.ribbons).toHaveLength(4);
  });

  it('a three-way tie for 3rd gives each of them 3rd (five ribbons)', () => {
    expect(won(ribbons(rankWithTies({ a: 9, b: 7, c: 4, d: 4, e: 4, f: 1, g: 0 })))).toHaveLength(5);
  });

  it('a tie for the only place (small category) is shared', () => {
    expect(won(ribbons(rankWithTies({ a: 4, b: 4, c: 1 })))).toEqual(['a:1', 'b:1']);
  });

  it('an entry with no votes never gets a ribbon, even when places are left', () => {
    expect(won(ribbons(rankWithTies({ a: 2, b: 0, c: 0, d: 0, e: 0, f: 0, g: 0 })))).toEqual(['a:1']);
    expect(won(ribbons(rankWithTies({ a: 0, b: 0, c: 0 })))).toEqual([]);
  });

  it('counts entries, not voted entries, when choosing the number of places', () => {
    // 7 entries, 3 with votes: three places.
    expect(won(ribbons(rankWithTies({ a: 3, b: 2, c: 1, d: 0, e: 0, f: 0, g: 0 })))).toEqual(['a:1', 'b:2', 'c:3']);
  });

  it('accepts a guild\'s own places rule', () => {
    const r = ribbons(rankWithTies({ a: 3, b: 2 }), { placesFor: () => 3 });
    expect(won(r)).toEqual(['a:1', 'b:2']);
    expect(() => ribbons([], { placesFor: () => 4 })).toThrow(RangeError);
  });
});

describe('ribbons with the chair\'s recorded decision', () => {
  it('settles a tie for 1st: the chosen order replaces the shared place, and 3rd is given again', () => {
    const standings = rankWithTies({ a: 8, b: 8, c: 5, d: 3, e: 2, f: 1, g: 1 });
    const r = ribbons(standings, { decisions: [{ order: ['b', 'a'], note: 'chair, after a second look' }] });
    expect(won(r)).toEqual(['b:1', 'a:2', 'c:3']);
    expect(r.ribbons.map((x) => x.byDecision)).toEqual([true, true, false]);
  });

  it('settles a tie for 3rd to three ribbons', () => {
    const standings = rankWithTies({ a: 9, b: 7, c: 4, d: 4, e: 2, f: 1, g: 0 });
    expect(won(ribbons(standings, { decisions: [{ order: ['d', 'c'] }] }))).toEqual(['a:1', 'b:2', 'd:3']);
  });

  it('refuses a decision that does not list exactly one tied group', () => {
    const standings = rankWithTies({ a: 8, b: 8, c: 8, d: 1 });
    expect(() => ribbons(standings, { decisions: [{ order: ['a', 'b'] }] })).toThrow(/exactly the entries sharing rank 1/);
    expect(() => ribbons(standings, { decisions: [{ order: ['a', 'b', 'c', 'd'] }] })).toThrow(RangeError);
    expect(() => ribbons(standings, { decisions: [{ order: ['a', 'a', 'b'] }] })).toThrow(RangeError);
    expect(() => ribbons(standings, { decisions: [{ order: ['d'] }] })).toThrow(RangeError);
    expect(() => ribbons(standings, { decisions: [{ order: ['zz', 'a'] }] })).toThrow(/not in the standings/);
    expect(() =>
      ribbons(standings, { decisions: [{ order: ['a', 'b', 'c'] }, { order: ['c', 'b', 'a'] }] }),
    ).toThrow(/two decisions/);
  });
});
