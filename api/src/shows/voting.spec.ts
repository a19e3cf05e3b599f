import fc from 'fast-check';
import type { BallotChoices } from './ballot.entity';
import { type BallotCategory, checkBallot, countShow, votingState } from './voting';

const at = (iso: string) => new Date(iso);

describe('votingState', () => {
  const now = at('2030-05-14T12:00:00Z');
  it('follows the chair: not open, open, closed for good', () => {
    expect(votingState({}, now)).toBe('not_open');
    expect(votingState({ votingOpenedAt: at('2030-05-14T09:00:00Z') }, now)).toBe('open');
    expect(votingState({ votingOpenedAt: at('2030-05-14T09:00:00Z'), votingClosedAt: at('2030-05-14T11:00:00Z') }, now)).toBe('closed');
  });
  it('follows a schedule by itself', () => {
    const schedule = { votingOpensAt: at('2030-05-14T13:00:00Z'), votingClosesAt: at('2030-05-15T16:00:00Z') };
    expect(votingState(schedule, now)).toBe('scheduled');
    expect(votingState(schedule, at('2030-05-14T13:00:00Z'))).toBe('open');
    expect(votingState(schedule, at('2030-05-15T16:00:00Z'))).toBe('closed');
  });
});

const categories: BallotCategory[] = [
  { id: 1, name: 'Bed quilts', entries: [{ id: 11, entryNumber: 1, title: 'A' }, { id: 12, entryNumber: 2, title: 'B' }, { id: 13, entryNumber: 3, title: 'C' }] },
  { id: 2, name: 'Wall quilts', entries: [{ id: 21, entryNumber: 4, title: 'D' }, { id: 22, entryNumber: 5, title: 'E' }] },
];

describe('checkBallot', () => {
  it('takes one vote per category and cleans the ballot', () => {
    expect(checkBallot('per_category', 3, categories, { categories: { 1: [12], 2: [] } })).toEqual({ ok: true, choices: { categories: { 1: [12] } }, votes: 1 });
    expect(checkBallot('per_category', 3, categories, { categories: { 1: 12, 2: null } })).toEqual({ ok: true, choices: { categories: { 1: [12] } }, votes: 1 });
  });
  it.each([
    [{ categories: { 1: [11, 12] } }, 'Vote for one quilt in Bed quilts; you chose 2.'],
    [{ categories: { 1: [21] } }, 'No. 4, "D" is in Wall quilts, not Bed quilts.'],
    [{ categories: { 3: [11] } }, 'Your ballot names a category that has no quilts on this ballot.'],
    [{ categories: { 1: [99] } }, "Your ballot for Bed quilts names a quilt that is not on this show's ballot."],
    [{ categories: { 1: [-1] } }, 'Your ballot for Bed quilts lists something that is not a quilt.'],
    [{ categories: {} }, 'Choose at least one quilt before you cast your ballot.'],
    [{ categories: [] }, 'Choose the quilts you vote for in each category.'],
    [null, 'Choose the quilts you vote for.'],
  ])('refuses %j: %s', (raw, message) => {
    expect(checkBallot('per_category', 3, categories, raw)).toEqual({ ok: false, message });
  });
  it('takes any number per category for approval, but each quilt once', () => {
    expect(checkBallot('approval', 3, categories, { categories: { 1: [11, 12, 13], 2: [22] } })).toMatchObject({ ok: true, votes: 4 });
    expect(checkBallot('approval', 3, categories, { categories: { 1: [11, 11] } })).toEqual({ ok: false, message: 'Your ballot for Bed quilts names the same quilt twice.' });
  });
  it('takes a ranked list of up to rankDepth different quilts from any category', () => {
    expect(checkBallot('ranked', 3, categories, { ranked: [21, 11, 12] })).toEqual({ ok: true, choices: { ranked: [21, 11, 12] }, votes: 3 });
    expect(checkBallot('ranked', 3, categories, { ranked: [21, 11, 12, 13] })).toEqual({ ok: false, message: 'Rank at most 3 quilts.' });
    expect(checkBallot('ranked', 3, categories, { ranked: [21, 21] })).toEqual({ ok: false, message: 'Each quilt can take only one place on your ballot.' });
    expect(checkBallot('ranked', 3, categories, { ranked: [] })).toMatchObject({ ok: false });
    expect(checkBallot('ranked', 3, categories, { categories: { 1: [11] } })).toMatchObject({ ok: false });
  });
});

describe('countShow', () => {
  it('counts each category and gives ribbons by the default rule (TRADE.md §6.6: ≤ 3 entries 1st only)', () => {
    const ballots: BallotChoices[] = [{ categories: { 1: [12], 2: [21] } }, { categories: { 1: [12] } }, { categories: { 1: [11], 2: [22] } }, { categories: { 2: [22] } }];
    const [bed, wall] = countShow('per_category', 'points', categories, ballots);
    expect(bed).toMatchObject({ ballots: 4, blank: 1, votes: 3, ties: [] });
    expect(bed.standings).toEqual([
      { entryId: 12, score: 2, rank: 1, ribbon: 1, byDecision: false },
      { entryId: 11, score: 1, rank: 2, ribbon: null, byDecision: false },
      { entryId: 13, score: 0, rank: 3, ribbon: null, byDecision: false },
    ]);
    expect(wall.ties).toEqual([]);
    expect(wall.standings.map((s) => [s.entryId, s.rank, s.ribbon])).toEqual([[22, 1, 1], [21, 2, null]]);
  });

  it('applies a chair\'s decision only while it still matches the tie', () => {
    const ballots = [{ categories: { 1: [11] } }, { categories: { 1: [12] } }];
    const [tied] = countShow('per_category', 'points', categories, ballots);
    expect(tied.ties).toEqual([{ rank: 1, entryIds: [11, 12] }]);
    const [settled] = countShow('per_category', 'points', categories, ballots, [{ id: 7, categoryId: 1, order: [12, 11] }]);
    expect(settled.standings.slice(0, 2).map((s) => [s.entryId, s.rank, s.ribbon, s.byDecision])).toEqual([[12, 1, 1, true], [11, 2, null, true]]);
    const [stale] = countShow('per_category', 'points', categories, [...ballots, { categories: { 1: [11] } }], [{ id: 7, categoryId: 1, order: [12, 11] }]);
    expect(stale.staleDecisionIds).toEqual([7]);
    expect(stale.standings[0]).toMatchObject({ entryId: 11, rank: 1, byDecision: false });
  });

  it('scores ranked ballots 3/2/1 (TRADE.md §6.5) across the whole show', () => {
    const [overall] = countShow('ranked', 'points', categories, [{ ranked: [21, 11, 12] }, { ranked: [11, 21] }, { ranked: [12] }]);
    // 21: 3 + 2 = 5; 11: 2 + 3 = 5; 12: 1 + 3 = 4.
    expect(overall.standings.slice(0, 3).map((s) => [s.entryId, s.score, s.rank])).toEqual([[11, 5, 1], [21, 5, 1], [12, 4, 3]]);
    expect(overall.categoryId).toBeNull();
  });

  it('gives the same result whatever order the ballots come in (fast-check)', () => {
    const ballot = fc.record({ 1: fc.subarray([11, 12, 13], { maxLength: 1 }), 2: fc.subarray([21, 22], { maxLength: 1 }) });
    fc.assert(
      fc.property(fc.array(ballot, { maxLength: 60 }), fc.integer(), (raw, seed) => {
        const ballots = raw.map((b) => ({ categories: { 1: b[1], 2: b[2] } }));
        const shuffled = [...ballots].sort((a, b) => ((JSON.stringify(a).length * 31 + seed) % 7) - ((JSON.stringify(b).length * 31 + seed) % 7));
        const a = countShow('per_category', 'points', categories, ballots);
        const b = countShow('per_category', 'points', categories, shuffled.reverse());
        expect(b).toEqual(a);
        // Totals conserved: every vote cast shows up in exactly one entry's score.
        const cast = raw.reduce((n, x) => n + x[1].length, 0);
        expect(a[0].standings.reduce((n, s) => n + s.score, 0)).toBe(cast);
      }),
    );
  });
});
