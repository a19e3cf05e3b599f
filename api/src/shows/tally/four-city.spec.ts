import { approval, bordaPoints, instantRunoff, plurality, rankedPoints, type RankedBallot } from './index';

/*
 * The four-city example used in the Wikipedia articles "Instant-runoff voting", "Borda count" and
 * "Plurality voting": 100 voters choosing a capital.
 *   42  Memphis > Nashville > Chattanooga > Knoxville
 *   26  Nashville > Chattanooga > Knoxville > Memphis
 *   15  Chattanooga > Knoxville > Nashville > Memphis
 *   17  Knoxville > Chattanooga > Nashville > Memphis
 * Published winners: plurality Memphis, instant runoff Knoxville, Borda Nashville.
 */
const CITIES = ['Memphis', 'Nashville', 'Chattanooga', 'Knoxville'];
const GROUPS: Array<[number, RankedBallot]> = [
  [42, ['Memphis', 'Nashville', 'Chattanooga', 'Knoxville']],
  [26, ['Nashville', 'Chattanooga', 'Knoxville', 'Memphis']],
  [15, ['Chattanooga', 'Knoxville', 'Nashville', 'Memphis']],
  [17, ['Knoxville', 'Chattanooga', 'Nashville', 'Memphis']],
];
const BALLOTS: RankedBallot[] = GROUPS.flatMap(([n, order]) => Array.from({ length: n }, () => order));

describe('four-city example', () => {
  it('has 100 ballots', () => expect(BALLOTS).toHaveLength(100));

  it('plurality: Memphis wins with 42 first choices', () => {
    const r = plurality(
      BALLOTS.map((b) => b[0]),
      CITIES,
    );
    expect(r.scores).toEqual({ Memphis: 42, Nashville: 26, Chattanooga: 15, Knoxville: 17 });
    expect(r.standings.map((s) => [s.entry, s.rank])).toEqual([
      ['Memphis', 1],
      ['Nashville', 2],
      ['Knoxville', 3],
      ['Chattanooga', 4],
    ]);
    expect(r.total).toBe(100);
  });

  it('instant runoff: Knoxville wins in round 3', () => {
    // Hand check: round 1 M42 N26 C15 K17 → Chattanooga out, its 15 go to Knoxville (K32).
    // Round 2 M42 N26 K32 → Nashville out; its 26 skip Chattanooga and go to Knoxville (K58).
    // Round 3 M42 K58: 58 > 50, Knoxville.
    const r = instantRunoff(BALLOTS, CITIES);
    expect(r.winner).toBe('Knoxville');
    expect(r.rounds).toEqual([
      { round: 1, counts: { Memphis: 42, Nashville: 26, Chattanooga: 15, Knoxville: 17 }, active: 100, exhausted: 0, eliminated: ['Chattanooga'], rule: 'fewest-votes' },
      { round: 2, counts: { Memphis: 42, Nashville: 26, Knoxville: 32 }, active: 100, exhausted: 0, eliminated: ['Nashville'], rule: 'fewest-votes' },
      { round: 3, counts: { Memphis: 42, Knoxville: 58 }, active: 100, exhausted: 0, eliminated: [], rule: null },
    ]);
    expect(r.standings.map((s) => s.entry)).toEqual(['Knoxville', 'Memphis', 'Nashville', 'Chattanooga']);
  });

  it('Borda (3/2/1/0 for four entries): Nashville 194, Chattanooga 173, Memphis 126, Knoxville 107', () => {
    // Hand check, points per group (42 / 26 / 15 / 17 voters):
    //   Memphis     3·42 + 0·26 + 0·15 + 0·17 =  126
    //   Nashville   2·42 + 3·26 + 1·15 + 1·17 =  84 + 78 + 15 + 17 = 194
    //   Chattanooga 1·42 + 2·26 + 3·15 + 2·17 =  42 + 52 + 45 + 34 = 173
    //   Knoxville   0·42 + 1·26 + 2·15 + 3·17 =   0 + 26 + 30 + 51 = 107
    //   total 600 = 100 ballots × (3+2+1+0)
    expect(bordaPoints(4)).toEqual([3, 2, 1, 0]);
    const r = rankedPoints(BALLOTS, CITIES, bordaPoints(4));
    expect(r.scores).toEqual({ Memphis: 126, Nashville: 194, Chattanooga: 173, Knoxville: 107 });
    expect(r.standings[0].entry).toBe('Nashville');
    expect(r.total).toBe(600);
  });

  it('3/2/1 points: the same totals as Borda here, Nashville wins', () => {
    // With four entries the 3/2/1 scale gives 4th place 0, which is exactly 3/2/1/0, so the hand
    // check above applies unchanged: Nashville 194, Chattanooga 173, Memphis 126, Knoxville 107.
    // Ballots cut to their top three give the same, since 4th place scores nothing.
    const full = rankedPoints(BALLOTS, CITIES);
    const topThree = rankedPoints(
      BALLOTS.map((b) => b.slice(0, 3)),
      CITIES,
      [3, 2, 1],
    );
    for (const r of [full, topThree]) {
      expect(r.scores).toEqual({ Memphis: 126, Nashville: 194, Chattanooga: 173, Knoxville: 107 });
      expect(r.standings.map((s) => s.entry)).toEqual(['Nashville', 'Chattanooga', 'Memphis', 'Knoxville']);
      expect(r.total).toBe(600);
    }
  });

  it('approval of each voter\'s top two: Nashville 68', () => {
    // Hand check: Memphis 42; Nashville 42 + 26 = 68; Chattanooga 26 + 15 + 17 = 58; Knoxville 15 + 17 = 32.
    const r = approval(
      BALLOTS.map((b) => b.slice(0, 2)),
      CITIES,
    );
    expect(r.scores).toEqual({ Memphis: 42, Nashville: 68, Chattanooga: 58, Knoxville: 32 });
    expect(r.total).toBe(200);
    expect(r.standings[0].entry).toBe('Nashville');
  });
});
