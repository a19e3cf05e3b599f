import { type ScoreResult, scoreResult } from './plurality';
import { checkEntries, checkMarks, type EntryId, SpoilCounter } from './types';

/** Every entry a visitor approves of in one category, in any order. */
export type ApprovalBallot = readonly EntryId[];

/**
 * Approval voting: a visitor may mark any number of entries in a category; each marked entry gets one
 * approval. Marking the same entry twice counts once. `total` is the number of approvals given.
 *
 * An empty ballot is blank. A ballot naming an entry that is not in the category is spoiled as a
 * whole (none of its marks count), so a mistyped entry number cannot quietly shift a result.
 *
 * @throws TypeError / RangeError only for caller bugs: a bad entry list or a ballot that is not a list of strings.
 */
export function approval(ballots: readonly ApprovalBallot[], entries: readonly EntryId[]): ScoreResult {
  const known = checkEntries(entries);
  const counts = new Map<EntryId, number>(entries.map((e) => [e, 0]));
  const spoiled = new SpoilCounter();
  let blank = 0;
  let counted = 0;

  ballots.forEach((ballot, i) => {
    const distinct = new Set(checkMarks(ballot, i));
    if (distinct.size === 0) blank += 1;
    else if ([...distinct].some((m) => !known.has(m))) spoiled.add('unknown-entry');
    else {
      for (const e of distinct) counts.set(e, (counts.get(e) ?? 0) + 1);
      counted += 1;
    }
  });

  return scoreResult(counts, { ballots: ballots.length, counted, blank, spoiled: spoiled.result() });
}
