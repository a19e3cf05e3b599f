import { approval, bordaPoints, instantRunoff, plurality, rankedPoints } from './index';

const E = ['101', '102', '103'];
const NO_SPOILS = { 'unknown-entry': 0, overvote: 0, 'duplicate-entry': 0, 'empty-ranking': 0 };

describe('plurality', () => {
  it('counts one vote per ballot and lists entries with none', () => {
    const r = plurality(['101', '102', '101', null, '101'], E);
    expect(r.scores).toEqual({ 101: 3, 102: 1, 103: 0 });
    expect(r).toMatchObject({ ballots: 5, counted: 4, blank: 1, total: 4, spoiled: { total: 0, byReason: NO_SPOILS } });
    expect(r.standings.map((s) => [s.entry, s.rank])).toEqual([
      ['101', 1],
      ['102', 2],
      ['103', 3],
    ]);
  });

  it('spoils an unknown entry or two different marks, and takes a repeated mark as one vote', () => {
    const r = plurality(['999', ['101', '102'], ['103', '103'], [], '101'], E);
    expect(r.scores).toEqual({ 101: 1, 102: 0, 103: 1 });
    expect(r).toMatchObject({ ballots: 5, counted: 2, blank: 1, total: 2 });
    expect(r.spoiled).toEqual({ total: 2, byReason: { ...NO_SPOILS, 'unknown-entry': 1, overvote: 1 } });
  });

  it('throws on caller bugs, not on ballot mistakes', () => {
    expect(() => plurality([], ['a', 'a'])).toThrow(/listed twice/);
    expect(() => plurality([], ['a', ''])).toThrow(TypeError);
    expect(() => plurality([42 as unknown as string], E)).toThrow(TypeError);
  });
});

describe('approval', () => {
  it('counts each approved entry once per ballot', () => {
    const r = approval([['101', '102'], ['101', '101', '101'], [], ['103', '102']], E);
    expect(r.scores).toEqual({ 101: 2, 102: 2, 103: 1 });
    expect(r).toMatchObject({ ballots: 4, counted: 3, blank: 1, total: 5 });
    expect(r.standings.map((s) => s.rank)).toEqual([1, 1, 3]);
  });

  it('spoils a whole ballot that names an unknown entry', () => {
    const r = approval([['101', 'x']], E);
    expect(r.total).toBe(0);
    expect(r.spoiled.byReason['unknown-entry']).toBe(1);
  });
});

describe('rankedPoints', () => {
  it('gives 3/2/1 by default, nothing below 3rd, and accepts partial ballots', () => {
    const r = rankedPoints([['101', '102', '103'], ['102'], ['103', '101']], E);
    // 101: 3 + 2 = 5; 102: 2 + 3 = 5; 103: 1 + 3 = 4.
    expect(r.scores).toEqual({ 101: 5, 102: 5, 103: 4 });
    expect(r.total).toBe(14);
    expect(r.standings.map((s) => s.rank)).toEqual([1, 1, 3]);
  });

  it('spoils empty ballots, unknown entries and repeats', () => {
    const r = rankedPoints([[], ['101', 'x'], ['101', '102', '101'], ['103']], E);
    expect(r.scores).toEqual({ 101: 0, 102: 0, 103: 3 });
    expect(r).toMatchObject({ ballots: 4, counted: 1, blank: 0 });
    expect(r.spoiled).toEqual({ total: 3, byReason: { ...NO_SPOILS, 'empty-ranking': 1, 'unknown-entry': 1, 'duplicate-entry': 1 } });
  });

  it('rejects a bad points scale', () => {
    expect(() => rankedPoints([], E, [])).toThrow(RangeError);
    expect(() => rankedPoints([], E, [1, 2])).toThrow(/never increase/);
    expect(() => rankedPoints([], E, [3, -1])).toThrow(RangeError);
    expect(() => rankedPoints([], E, [2.5, 1])).toThrow(RangeError);
    expect(() => rankedPoints([], E, [0])).toThrow(RangeError);
    expect(() => bordaPoints(0)).toThrow(RangeError);
  });
});

describe('instantRunoff', () => {
  it('declares a first-round majority at once', () => {
    const r = instantRunoff([['101'], ['101', '102'], ['102']], E);
    expect(r.winner).toBe('101');
    expect(r.rounds).toHaveLength(1);
  });

  it('drops all entries without votes together and reports exhausted ballots', () => {
    // a 2, b 2, c 1 (c's ballot lists only c), d and e none.
    const entries = ['a', 'b', 'c', 'd', 'e'];
    const r = instantRunoff([['a'], ['a'], ['b', 'd'], ['b'], ['c']], entries);
    expect(r.rounds[0]).toMatchObject({ eliminated: ['d', 'e'], rule: 'no-votes', active: 5, exhausted: 0 });
    expect(r.rounds[1]).toMatchObject({ counts: { a: 2, b: 2, c: 1 }, eliminated: ['c'], rule: 'fewest-votes' });
    expect(r.rounds[2]).toMatchObject({ counts: { a: 2, b: 2 }, active: 4, exhausted: 1 });
    // a and b tie on votes, on first-round votes (2 each) and on mentions (2 ballots each), so the
    // last step removes b, listed after a in the category.
    expect(r.rounds[2]).toMatchObject({ eliminated: ['b'], rule: 'entry-order' });
    expect(r.winner).toBe('a');
    expect(r.rounds.at(-1)).toMatchObject({ counts: { a: 2 }, active: 2, exhausted: 3, eliminated: [], rule: null });
    expect(r.standings.map((s) => [s.entry, s.rank])).toEqual([
      ['a', 1],
      ['b', 2],
      ['c', 3],
      ['d', 4],
      ['e', 4],
    ]);
  });

  it('breaks a tie for fewest by mentions, then (later) by first-round votes', () => {
    // Round 1: a 2, b 1, c 1; b and c tie on votes and on first-round votes; b is named on 1 ballot,
    // c on 2 → b out ('mentions'); b's ballot moves to c.
    // Round 2: a 2, c 2; in round 1 a had 2, c had 1 → c out ('first-round'); a wins alone.
    const r = instantRunoff([['a'], ['a'], ['b', 'c'], ['c']], ['a', 'b', 'c']);
    expect(r.rounds).toEqual([
      { round: 1, counts: { a: 2, b: 1, c: 1 }, active: 4, exhausted: 0, eliminated: ['b'], rule: 'mentions' },
      { round: 2, counts: { a: 2, c: 2 }, active: 4, exhausted: 0, eliminated: ['c'], rule: 'first-round' },
      { round: 3, counts: { a: 2 }, active: 2, exhausted: 2, eliminated: [], rule: null },
    ]);
    expect(r.winner).toBe('a');
  });

  it('uses mentions when votes and first-round votes are level', () => {
    // Round 1: a 2, b 2, c 1 → c out (fewest), its ballot exhausts.
    // Round 2: a 2, b 2, both 2 in round 1; a is named on 3 ballots, b on 2 → b out.
    const r = instantRunoff([['a'], ['a'], ['b', 'a'], ['b'], ['c']], ['a', 'b', 'c']);
    expect(r.rounds[0]).toMatchObject({ eliminated: ['c'], rule: 'fewest-votes' });
    expect(r.rounds[1]).toMatchObject({ counts: { a: 2, b: 2 }, exhausted: 1, eliminated: ['b'], rule: 'mentions' });
    expect(r.winner).toBe('a');
  });

  it('has no winner without valid ballots', () => {
    const r = instantRunoff([[], ['x']], E);
    expect(r.winner).toBeNull();
    expect(r.spoiled.total).toBe(2);
    expect(r.standings.every((s) => s.rank === 1 && s.score === 0)).toBe(true);
  });
});
