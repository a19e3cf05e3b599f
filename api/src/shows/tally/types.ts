/**
 * Shared types and input checks for the viewer's-choice counting functions.
 *
 * Everything in this folder is pure: no I/O, no clock, no randomness. The same ballots, in any
 * order, always give the same result.
 */

/** The identifier of one quilt entered in a category (an entry number, usually). */
export type EntryId = string;

/** One line of the standings: competition ranking, so two entries tied for 1st are both rank 1 and the next is rank 3. */
export interface Standing {
  readonly entry: EntryId;
  /** Votes, approvals or points, depending on the method. */
  readonly score: number;
  readonly rank: number;
}

/**
 * Why a ballot was set aside for one category. A spoiled ballot is counted, but gives no votes.
 * - `unknown-entry`: it names an entry that is not in the category.
 * - `overvote`: a one-vote (plurality) ballot marks two or more different entries.
 * - `duplicate-entry`: a ranked ballot lists the same entry twice.
 * - `empty-ranking`: a ranked ballot lists nothing.
 */
export type SpoilReason = 'unknown-entry' | 'overvote' | 'duplicate-entry' | 'empty-ranking';

export interface SpoiledTally {
  readonly total: number;
  readonly byReason: Readonly<Record<SpoilReason, number>>;
}

/** What every counting result says about the ballots it was given. */
export interface BallotAccount {
  /** Ballots handed in for this category: `counted + blank + spoiled.total`. */
  readonly ballots: number;
  /** Ballots that gave at least one vote. */
  readonly counted: number;
  /** Ballots left empty for this category (not used by ranked methods, where empty is spoiled). */
  readonly blank: number;
  readonly spoiled: SpoiledTally;
}

/** Mutable spoil counter used while counting. */
export class SpoilCounter {
  private readonly counts: Record<SpoilReason, number> = {
    'unknown-entry': 0,
    overvote: 0,
    'duplicate-entry': 0,
    'empty-ranking': 0,
  };

  add(reason: SpoilReason): void {
    this.counts[reason] += 1;
  }

  result(): SpoiledTally {
    const byReason = { ...this.counts };
    const total = Object.values(byReason).reduce((a, b) => a + b, 0);
    return { total, byReason };
  }
}

/**
 * Checks a category's entry list. Programming errors (not ballot mistakes) throw:
 * the list must be an array of distinct, non-empty strings.
 */
export function checkEntries(entries: readonly EntryId[]): ReadonlySet<EntryId> {
  if (!Array.isArray(entries)) throw new TypeError('entries must be an array of entry ids');
  const set = new Set<EntryId>();
  for (const e of entries) {
    if (typeof e !== 'string' || e.length === 0) throw new TypeError(`entry ids must be non-empty strings, got ${JSON.stringify(e)}`);
    if (set.has(e)) throw new RangeError(`entry ${JSON.stringify(e)} is listed twice in the category`);
    set.add(e);
  }
  return set;
}

/** Checks that a ballot is a list of strings (a caller bug otherwise, so it throws). */
export function checkMarks(ballot: unknown, index: number): readonly string[] {
  if (!Array.isArray(ballot) || ballot.some((m) => typeof m !== 'string')) {
    throw new TypeError(`ballot ${index} must be a list of entry ids`);
  }
  return ballot as readonly string[];
}
