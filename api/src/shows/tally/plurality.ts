import { rankWithTies } from './rank';
import { type BallotAccount, checkEntries, type EntryId, SpoilCounter, type Standing } from './types';

/**
 * One visitor's mark in one category: the entry voted for, or `null` when the category was left blank.
 * A list is accepted for ballots transcribed as "every entry marked": an empty list is blank, one
 * entry (written once or more) is a vote, two or more different entries is an overvote.
 */
export type PluralityBallot = EntryId | null | readonly EntryId[];

/** Counts for methods that give each entry a number of votes, approvals or points. */
export interface ScoreResult extends BallotAccount {
  /** Every entry in the category, including those with nothing. */
  readonly scores: Readonly<Record<EntryId, number>>;
  /** Sum of all scores. */
  readonly total: number;
  readonly standings: readonly Standing[];
}

/**
 * Viewer's choice with one vote per category (the default).
 *
 * Pass the marks of one category and that category's entries. Each counted ballot gives its entry
 * exactly one vote, so `total === counted` (valid votes). A ballot naming an entry that is not in the
 * category, or marking two different entries, is spoiled (counted in `spoiled`, gives no vote); it
 * is not an error. A blank mark is counted in `blank`.
 *
 * @throws TypeError / RangeError only for caller bugs: a bad entry list or a mark that is not a string.
 */
export function plurality(ballots: readonly PluralityBallot[], entries: readonly EntryId[]): ScoreResult {
  const known = checkEntries(entries);
  const counts = new Map<EntryId, number>(entries.map((e) => [e, 0]));
  const spoiled = new SpoilCounter();
  let blank = 0;
  let counted = 0;

  ballots.forEach((ballot, i) => {
    let marks: readonly unknown[];
    if (ballot === null || ballot === undefined) marks = [];
    else if (typeof ballot === 'string') marks = [ballot];
    else if (Array.isArray(ballot)) marks = ballot;
    else throw new TypeError(`ballot ${i} must be an entry id, a list of entry ids, or null`);
    if (marks.some((m) => typeof m !== 'string')) throw new TypeError(`ballot ${i} must hold entry ids`);

    const distinct = new Set(marks as string[]);
    if (distinct.size === 0) blank += 1;
    else if ([...distinct].some((m) => !known.has(m))) spoiled.add('unknown-entry');
    else if (distinct.size > 1) spoiled.add('overvote');
    else {
      const [entry] = distinct;
      counts.set(entry, (counts.get(entry) ?? 0) + 1);
      counted += 1;
    }
  });

  return scoreResult(counts, { ballots: ballots.length, counted, blank, spoiled: spoiled.result() });
}

/** Builds the common result from per-entry scores (in category order) and the ballot account. */
export function scoreResult(counts: ReadonlyMap<EntryId, number>, account: BallotAccount): ScoreResult {
  let total = 0;
  for (const v of counts.values()) total += v;
  return { ...account, scores: Object.fromEntries(counts), total, standings: rankWithTies(counts) };
}
