import { rankWithTies } from './rank';

describe('rankWithTies', () => {
  it('uses competition ranking (1, 1, 3)', () => {
    expect(rankWithTies({ a: 5, b: 7, c: 7, d: 2, e: 2, f: 0 })).toEqual([
      { entry: 'b', score: 7, rank: 1 },
      { entry: 'c', score: 7, rank: 1 },
      { entry: 'a', score: 5, rank: 3 },
      { entry: 'd', score: 2, rank: 4 },
      { entry: 'e', score: 2, rank: 4 },
      { entry: 'f', score: 0, rank: 6 },
    ]);
  });

  it('accepts a Map and keeps its order among ties', () => {
    const m = new Map([
      ['12', 1],
      ['3', 1],
    ]);
    expect(rankWithTies(m).map((s) => [s.entry, s.rank])).toEqual([
      ['12', 1],
      ['3', 1],
    ]);
  });

  it('handles no entries', () => expect(rankWithTies({})).toEqual([]));

  it('rejects negative or non-finite scores', () => {
    expect(() => rankWithTies({ a: -1 })).toThrow(RangeError);
    expect(() => rankWithTies({ a: Number.NaN })).toThrow(RangeError);
    expect(() => rankWithTies({ a: Infinity })).toThrow(RangeError);
  });
});
