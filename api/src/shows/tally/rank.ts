import type { EntryId, Standing } from './types';

/**
 * Standings from scores, highest first, with shared ranks ("competition ranking": 1, 1, 3).
 *
 * Entries with equal scores share the better rank; the next entry's rank skips the shared places.
 * Tied entries are listed in the order the input gives them (a Map's insertion order, or a plain
 * object's key order); this ordering is for display only and never changes a rank.
 *
 * An entry with score 0 can never be ranked above an entry with a positive score.
 *
 * @throws RangeError if a score is negative or not a finite number.
 */
export function rankWithTies(counts: Readonly<Record<EntryId, number>> | ReadonlyMap<EntryId, number>): Standing[] {
  const pairs: Array<[EntryId, number]> = counts instanceof Map ? [...counts.entries()] : Object.entries(counts);
  for (const [entry, score] of pairs) {
    if (typeof score !== 'number' || !Number.isFinite(score) || score < 0) {
      throw new RangeError(`score for ${JSON.stringify(entry)} must be a finite number >= 0, got ${String(score)}`);
    }
  }
  // Array.prototype.sort is stable, so ties keep input order.
  const sorted = pairs.map(([entry, score], i) => ({ entry, score, i })).sort((a, b) => b.score - a.score || a.i - b.i);
  const out: Standing[] = [];
  sorted.forEach(({ entry, score }, pos) => {
    const prev = out[pos - 1];
    const rank = prev !== undefined && prev.score === score ? prev.rank : pos + 1;
    out.push({ entry, score, rank });
  });
  return out;
}
