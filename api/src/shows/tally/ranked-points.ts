import { type ScoreResult, scoreResult } from './plurality';
import { type RankedBallot, validRankings } from './ranked';
import { checkEntries, type EntryId, SpoilCounter } from './types';

/** The default scale for a ranked member ballot: 1st = 3 points, 2nd = 2, 3rd = 1, lower places nothing. */
/** 1st, 2nd and 3rd choices worth 3, 2 and 1 points: TRADE.md §6.5 and its check values (source S90). */
export const DEFAULT_RANK_POINTS: readonly number[] = Object.freeze([3, 2, 1]);

/**
 * The Borda scale for a category of `entryCount` entries: 1st = n−1, 2nd = n−2, …, last = 0.
 * With four entries this is 3/2/1/0, the same as the default 3/2/1 scale.
 */
export function bordaPoints(entryCount: number): number[] {
  if (!Number.isInteger(entryCount) || entryCount < 1) throw new RangeError('entryCount must be a whole number >= 1');
  return Array.from({ length: entryCount }, (_, i) => entryCount - 1 - i);
}

/**
 * Points for a ranked ballot: the entry in place k (0-based) gets `points[k]`; places beyond the end of
 * `points` get nothing. `total` is the sum of points handed out.
 *
 * Ballots may be partial (list fewer entries than the category has). Invalid ballots (empty, an
 * unknown entry, or the same entry twice) are spoiled and give no points.
 *
 * @param points non-empty, every value a whole number >= 0, never increasing, first value > 0. (Whole
 *   numbers keep the sums exact, so the result cannot depend on the order ballots are added in.)
 * @throws RangeError for a bad points scale; TypeError / RangeError for a bad entry list or non-string marks.
 */
export function rankedPoints(
  ballots: readonly RankedBallot[],
  entries: readonly EntryId[],
  points: readonly number[] = DEFAULT_RANK_POINTS,
): ScoreResult {
  checkEntries(entries);
  checkPoints(points);
  const spoiled = new SpoilCounter();
  const valid = validRankings(ballots, entries, spoiled);
  const scores = new Map<EntryId, number>(entries.map((e) => [e, 0]));
  for (const ballot of valid) {
    ballot.forEach((entry, place) => {
      scores.set(entry, (scores.get(entry) ?? 0) + (points[place] ?? 0));
    });
  }
  return scoreResult(scores, { ballots: ballots.length, counted: valid.length, blank: 0, spoiled: spoiled.result() });
}

function checkPoints(points: readonly number[]): void {
  if (!Array.isArray(points) || points.length === 0) throw new RangeError('points must be a non-empty list');
  points.forEach((p, i) => {
    if (!Number.isSafeInteger(p) || p < 0) throw new RangeError(`points[${i}] must be a whole number >= 0`);
    if (i > 0 && p > points[i - 1]) throw new RangeError('points must never increase from one place to the next');
  });
  if (points[0] <= 0) throw new RangeError('1st place must be worth more than 0 points');
}
