import { checkEntries, checkMarks, type EntryId, type SpoilCounter } from './types';

/** A ranked ballot: entries in order of preference, favourite first. It need not list every entry. */
export type RankedBallot = readonly EntryId[];

/**
 * Sorts a ranked ballot into valid or spoiled. Valid: at least one entry, every entry in the
 * category, no entry listed twice. The checks are made in that order and the first failure names the reason.
 */
export function validRankings(
  ballots: readonly RankedBallot[],
  entries: readonly EntryId[],
  spoiled: SpoilCounter,
): RankedBallot[] {
  const known = checkEntries(entries);
  const valid: RankedBallot[] = [];
  ballots.forEach((ballot, i) => {
    const marks = checkMarks(ballot, i);
    if (marks.length === 0) spoiled.add('empty-ranking');
    else if (marks.some((m) => !known.has(m))) spoiled.add('unknown-entry');
    else if (new Set(marks).size !== marks.length) spoiled.add('duplicate-entry');
    else valid.push(marks);
  });
  return valid;
}
