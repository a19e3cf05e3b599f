import { rankWithTies } from './rank';
import { type RankedBallot, validRankings } from './ranked';
import { type BallotAccount, checkEntries, type EntryId, SpoilCounter, type Standing } from './types';

/** Which rule picked the entries eliminated in a round. */
export type EliminationRule =
  /** Every remaining entry with no votes this round goes out together (no ballot moves, so the order among them cannot matter). */
  | 'no-votes'
  /** One entry had strictly the fewest votes. */
  | 'fewest-votes'
  /** Tied for fewest; the one with the fewest first choices in round 1 went out. */
  | 'first-round'
  /** Still tied; the one named on the fewest valid ballots (at any place) went out. */
  | 'mentions'
  /** Still tied; the one listed last in the category's entry list went out. */
  | 'entry-order';

export interface RunoffRound {
  /** 1-based. */
  readonly round: number;
  /** Votes for each entry still in the count, in category order. */
  readonly counts: Readonly<Record<EntryId, number>>;
  /** Ballots still counting for some entry: the sum of `counts`. */
  readonly active: number;
  /** Valid ballots whose every listed entry has been eliminated. `active + exhausted` = valid ballots. */
  readonly exhausted: number;
  /** Entries eliminated at the end of this round (empty in the last round). */
  readonly eliminated: readonly EntryId[];
  readonly rule: EliminationRule | null;
}

export interface RunoffResult extends BallotAccount {
  /** `null` only when there are no valid ballots. */
  readonly winner: EntryId | null;
  readonly rounds: readonly RunoffRound[];
  /**
   * Final order: the winner, then the other entries still in the last round by their votes there,
   * then the eliminated entries, last eliminated first. Entries eliminated together share a rank.
   * `score` is an entry's votes in the last round it took part in.
   */
  readonly standings: readonly Standing[];
}

/**
 * Instant runoff on ranked ballots for a single award.
 *
 * Each round, every valid ballot counts for its highest-listed entry still in the count; a ballot with
 * none left is exhausted. The count stops when one entry has more than half of the active (not
 * exhausted) ballots, or only one entry remains. Otherwise entries are eliminated and their ballots move on:
 * 1. all entries with no votes this round go out together, if any entry has votes;
 * 2. otherwise the entry with the fewest votes goes out; a tie for fewest is broken by, in turn,
 *    the fewest first choices in round 1, the fewest mentions at any place on valid ballots, and
 *    finally the entry listed last in the category's entry list (a fixed, published order such as
 *    entry number, so the result never depends on ballot order).
 *
 * Invalid ballots (empty, an unknown entry, the same entry twice) are spoiled and take no part.
 *
 * @throws TypeError / RangeError only for caller bugs: a bad entry list or non-string marks.
 */
export function instantRunoff(ballots: readonly RankedBallot[], entries: readonly EntryId[]): RunoffResult {
  checkEntries(entries);
  const spoiledCounter = new SpoilCounter();
  const valid = validRankings(ballots, entries, spoiledCounter);
  const account: BallotAccount = { ballots: ballots.length, counted: valid.length, blank: 0, spoiled: spoiledCounter.result() };

  const order = new Map(entries.map((e, i) => [e, i]));
  const mentions = new Map<EntryId, number>(entries.map((e) => [e, 0]));
  for (const b of valid) for (const e of b) mentions.set(e, (mentions.get(e) ?? 0) + 1);

  const remaining = new Set(entries);
  const rounds: RunoffRound[] = [];
  const eliminatedGroups: Array<{ entries: EntryId[]; counts: Map<EntryId, number> }> = [];
  let firstRound: Map<EntryId, number> | null = null;

  for (;;) {
    const counts = new Map<EntryId, number>(entries.filter((e) => remaining.has(e)).map((e) => [e, 0]));
    let exhausted = 0;
    for (const b of valid) {
      const top = b.find((e) => remaining.has(e));
      if (top === undefined) exhausted += 1;
      else counts.set(top, (counts.get(top) ?? 0) + 1);
    }
    firstRound ??= counts;
    const active = valid.length - exhausted;
    const base = { round: rounds.length + 1, counts: Object.fromEntries(counts), active, exhausted };

    const leader = [...counts.entries()].find(([, v]) => v * 2 > active);
    if (remaining.size <= 1 || leader !== undefined || active === 0) {
      rounds.push({ ...base, eliminated: [], rule: null });
      const winner = leader?.[0] ?? (remaining.size === 1 && active > 0 ? [...remaining][0] : null);
      return { ...account, winner, rounds, standings: runoffStandings(winner, counts, eliminatedGroups) };
    }

    const { out, rule } = pickElimination(counts, firstRound, mentions, order);
    rounds.push({ ...base, eliminated: out, rule });
    eliminatedGroups.push({ entries: out, counts });
    for (const e of out) remaining.delete(e);
  }
}

function pickElimination(
  counts: ReadonlyMap<EntryId, number>,
  firstRound: ReadonlyMap<EntryId, number>,
  mentions: ReadonlyMap<EntryId, number>,
  order: ReadonlyMap<EntryId, number>,
): { out: EntryId[]; rule: EliminationRule } {
  const live = [...counts.keys()];
  const zero = live.filter((e) => counts.get(e) === 0);
  if (zero.length > 0) return { out: zero, rule: 'no-votes' };

  let tied = fewest(live, counts);
  if (tied.length === 1) return { out: tied, rule: 'fewest-votes' };
  tied = fewest(tied, firstRound);
  if (tied.length === 1) return { out: tied, rule: 'first-round' };
  tied = fewest(tied, mentions);
  if (tied.length === 1) return { out: tied, rule: 'mentions' };
  const last = tied.reduce((a, b) => ((order.get(a) ?? 0) > (order.get(b) ?? 0) ? a : b));
  return { out: [last], rule: 'entry-order' };
}

function fewest(candidates: readonly EntryId[], score: ReadonlyMap<EntryId, number>): EntryId[] {
  const min = Math.min(...candidates.map((e) => score.get(e) ?? 0));
  return candidates.filter((e) => (score.get(e) ?? 0) === min);
}

function runoffStandings(
  winner: EntryId | null,
  finalCounts: ReadonlyMap<EntryId, number>,
  eliminated: ReadonlyArray<{ entries: EntryId[]; counts: Map<EntryId, number> }>,
): Standing[] {
  // Last round: the winner has a strict majority or is alone, so ranking by votes puts it first.
  const out: Standing[] = rankWithTies(finalCounts);
  if (winner !== null && out[0]?.entry !== winner) throw new Error('internal: winner is not first');
  for (let g = eliminated.length - 1; g >= 0; g--) {
    const rank = out.length + 1;
    for (const entry of eliminated[g].entries) out.push({ entry, score: eliminated[g].counts.get(entry) ?? 0, rank });
  }
  return out;
}
