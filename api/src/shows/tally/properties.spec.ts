import fc from 'fast-check';
import { approval, bordaPoints, instantRunoff, plurality, rankedPoints, ribbons, type Standing } from './index';

/** A category of 1–7 entries plus an id that is never in it (to make spoiled ballots). */
const category = fc.integer({ min: 1, max: 7 }).map((n) => Array.from({ length: n }, (_, i) => `e${i + 1}`));
const STRAY = 'x9';

/** Ranked ballots: mostly valid, some empty, with strays or with repeats. */
const rankedBallots = (ids: string[]) =>
  fc.array(
    fc.oneof(
      { weight: 4, arbitrary: fc.shuffledSubarray(ids, { minLength: 1 }) },
      { weight: 1, arbitrary: fc.array(fc.constantFrom(...ids, STRAY), { maxLength: 5 }) },
    ),
    { maxLength: 40 },
  );
const pluralityBallots = (ids: string[]) =>
  fc.array(
    fc.oneof(
      { weight: 6, arbitrary: fc.constantFrom(...ids) },
      { weight: 1, arbitrary: fc.constant(null) },
      { weight: 1, arbitrary: fc.constant(STRAY) },
      { weight: 1, arbitrary: fc.array(fc.constantFrom(...ids), { maxLength: 3 }) },
    ),
    { maxLength: 60 },
  );
const approvalBallots = (ids: string[]) => fc.array(fc.array(fc.constantFrom(...ids, STRAY), { maxLength: 6 }), { maxLength: 40 });

/** Ballots and the same ballots in another order. */
const withShuffle = <T>(ballots: fc.Arbitrary<T[]>) =>
  ballots.chain((b) => fc.tuple(fc.constant(b), fc.shuffledSubarray(b, { minLength: b.length, maxLength: b.length })));

const caseOf = <T>(make: (ids: string[]) => fc.Arbitrary<T[]>) =>
  category.chain((ids) => fc.tuple(fc.constant(ids), withShuffle(make(ids))));

/** No entry with score 0 is ranked above (or level with) an entry with a positive score. */
function zeroNeverAbove(standings: readonly Standing[]): boolean {
  const worstPositive = Math.max(0, ...standings.filter((s) => s.score > 0).map((s) => s.rank));
  return standings.filter((s) => s.score === 0).every((s) => s.rank > worstPositive);
}

const sum = (xs: Iterable<number>) => [...xs].reduce((a, b) => a + b, 0);

describe('properties', () => {
  it('plurality: totals conserved, order-independent, no-vote entries last', () => {
    fc.assert(
      fc.property(caseOf(pluralityBallots), ([ids, [ballots, shuffled]]) => {
        const r = plurality(ballots, ids);
        expect(sum(Object.values(r.scores))).toBe(r.total);
        expect(r.total).toBe(r.counted);
        expect(r.counted + r.blank + r.spoiled.total).toBe(ballots.length);
        expect(sum(Object.values(r.spoiled.byReason))).toBe(r.spoiled.total);
        expect(plurality(shuffled, ids)).toEqual(r);
        expect(zeroNeverAbove(r.standings)).toBe(true);
      }),
    );
  });

  it('approval: totals conserved, order-independent, no-vote entries last', () => {
    fc.assert(
      fc.property(caseOf(approvalBallots), ([ids, [ballots, shuffled]]) => {
        const r = approval(ballots, ids);
        const expected = sum(ballots.filter((b) => b.length > 0 && !b.includes(STRAY)).map((b) => new Set(b).size));
        expect(r.total).toBe(expected);
        expect(sum(Object.values(r.scores))).toBe(r.total);
        expect(r.counted + r.blank + r.spoiled.total).toBe(ballots.length);
        expect(approval(shuffled, ids)).toEqual(r);
        expect(zeroNeverAbove(r.standings)).toBe(true);
      }),
    );
  });

  it('ranked points (3/2/1 and Borda): totals conserved, order-independent, no-vote entries last', () => {
    fc.assert(
      fc.property(caseOf(rankedBallots), fc.boolean(), ([ids, [ballots, shuffled]], borda) => {
        const points = borda && ids.length > 1 ? bordaPoints(ids.length) : [3, 2, 1];
        const r = rankedPoints(ballots, ids, points);
        const valid = ballots.filter((b) => b.length > 0 && !b.includes(STRAY) && new Set(b).size === b.length);
        expect(r.counted).toBe(valid.length);
        expect(r.total).toBe(sum(valid.map((b) => sum(b.map((_, k) => points[k] ?? 0)))));
        expect(sum(Object.values(r.scores))).toBe(r.total);
        expect(r.counted + r.spoiled.total).toBe(ballots.length);
        expect(rankedPoints(shuffled, ids, points)).toEqual(r);
        expect(zeroNeverAbove(r.standings)).toBe(true);
      }),
    );
  });

  it('instant runoff: each round conserves ballots, order-independent, winner has a majority or is alone', () => {
    fc.assert(
      fc.property(caseOf(rankedBallots), ([ids, [ballots, shuffled]]) => {
        const r = instantRunoff(ballots, ids);
        expect(r.counted + r.spoiled.total).toBe(ballots.length);
        for (const round of r.rounds) {
          expect(sum(Object.values(round.counts))).toBe(round.active);
          expect(round.active + round.exhausted).toBe(r.counted);
        }
        const exhausted = r.rounds.map((x) => x.exhausted);
        expect([...exhausted].sort((a, b) => a - b)).toEqual(exhausted);
        expect(instantRunoff(shuffled, ids)).toEqual(r);

        const last = r.rounds[r.rounds.length - 1];
        if (r.counted === 0) {
          expect(r.winner).toBeNull();
        } else {
          expect(r.winner).not.toBeNull();
          const votes = last.counts[r.winner as string];
          const alone = Object.keys(last.counts).length === 1;
          expect(alone || votes * 2 > last.active).toBe(true);
          expect(r.standings[0]).toMatchObject({ entry: r.winner, rank: 1 });
        }
        // Every entry appears once in the standings; an entry no valid ballot names is never above one that is named
        // (at most level, when a named entry never held a vote and went out with it).
        expect(r.standings.map((s) => s.entry).sort()).toEqual([...ids].sort());
        const valid = ballots.filter((b) => b.length > 0 && !b.includes(STRAY) && new Set(b).size === b.length);
        const named = new Set(valid.flat());
        const worstNamed = Math.max(0, ...r.standings.filter((s) => named.has(s.entry)).map((s) => s.rank));
        const bestUnnamed = Math.min(Infinity, ...r.standings.filter((s) => !named.has(s.entry)).map((s) => s.rank));
        expect(bestUnnamed).toBeGreaterThanOrEqual(worstNamed);
      }),
    );
  });

  it('ribbons: never to an entry without votes, at most the allowed places, order-independent', () => {
    fc.assert(
      fc.property(caseOf(pluralityBallots), ([ids, [ballots, shuffled]]) => {
        const r = ribbons(plurality(ballots, ids).standings);
        const scores = plurality(ballots, ids).scores;
        for (const rib of r.ribbons) {
          expect(scores[rib.entry]).toBeGreaterThan(0);
          expect(rib.place).toBeLessThanOrEqual(r.places);
        }
        const distinctPlaces = new Set(r.ribbons.map((x) => x.place));
        expect(distinctPlaces.size).toBeLessThanOrEqual(r.places);
        expect(ribbons(plurality(shuffled, ids).standings)).toEqual(r);
      }),
    );
  });
});
