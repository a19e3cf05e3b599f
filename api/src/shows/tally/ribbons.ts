import type { EntryId, Standing } from './types';

export type Place = 1 | 2 | 3;

/** The chair's recorded decision settling one tie: the tied entries, in the order the chair chose. */
export interface TieDecision {
  /** Exactly the entries that share one rank in the standings, best first. */
  readonly order: readonly EntryId[];
  /** Optional note for the record (who decided, how). Not used in the count. */
  readonly note?: string;
}

export interface RibbonRules {
  /**
   * How many places (1–3) a category of `entryCount` entries gets.
   * Default: up to 3 entries → 1st only; up to 6 → 1st and 2nd; more → 1st, 2nd and 3rd.
   */
  readonly placesFor?: (entryCount: number) => number;
  /** Entries in the category; defaults to the number of standings (which list every entry). */
  readonly entryCount?: number;
  /** The chair's recorded decisions, each replacing one shared rank by the chosen order. */
  readonly decisions?: readonly TieDecision[];
}

export interface Ribbon {
  readonly entry: EntryId;
  readonly place: Place;
  /** True when the place comes from a chair's decision rather than the count alone. */
  readonly byDecision: boolean;
}

export interface RibbonResult {
  readonly places: number;
  /** Best place first; shared places are listed together. */
  readonly ribbons: readonly Ribbon[];
  /** The standings after the chair's decisions were applied. */
  readonly standings: readonly Standing[];
}

/** The default number of places for a category with `entryCount` entries. */
export function defaultPlaces(entryCount: number): number {
  if (entryCount <= 0) return 0;
  if (entryCount <= 3) return 1;
  if (entryCount <= 6) return 2;
  return 3;
}

/**
 * Ribbons (1st–3rd) for one category from its standings (competition-ranked, as from `rankWithTies`).
 *
 * Rules:
 * - The number of places depends on the number of entries (`placesFor`, default `defaultPlaces`).
 * - An entry with a score of 0 never gets a ribbon.
 * - Tied entries share the place of their rank, and the places they fill are skipped: two entries
 *   tied for 1st both get 1st and there is no 2nd.
 * - After any tie for 1st or 2nd, no 3rd is given.
 * - A tie for 3rd gives every entry in it a 3rd ribbon, however many (two tied makes four ribbons in
 *   all; three tied makes five). The chair can instead settle the tie by a decision.
 * - A chair's decision lists every entry of one shared rank in the chosen order; they then take
 *   consecutive ranks (a tie at rank 1 of two entries becomes ranks 1 and 2), and the rules above
 *   are applied to the settled standings.
 *
 * @throws RangeError if a decision does not list exactly the entries sharing one rank, or if the
 *   places rule returns something other than a whole number from 0 to 3.
 */
export function ribbons(standings: readonly Standing[], rules: RibbonRules = {}): RibbonResult {
  const entryCount = rules.entryCount ?? standings.length;
  const places = (rules.placesFor ?? defaultPlaces)(entryCount);
  if (!Number.isInteger(places) || places < 0 || places > 3) throw new RangeError('places must be a whole number from 0 to 3');

  const { settled, decided } = applyDecisions(standings, rules.decisions ?? []);
  const eligible = settled.filter((s) => s.score > 0);
  const sizeOf = (rank: number) => eligible.filter((s) => s.rank === rank).length;
  const tieAbove = sizeOf(1) > 1 || sizeOf(2) > 1;

  const out: Ribbon[] = [];
  for (const s of eligible) {
    if (s.rank > places) continue;
    if (s.rank === 3 && tieAbove) continue;
    out.push({ entry: s.entry, place: s.rank as Place, byDecision: decided.has(s.entry) });
  }
  return { places, ribbons: out, standings: settled };
}

function applyDecisions(
  standings: readonly Standing[],
  decisions: readonly TieDecision[],
): { settled: Standing[]; decided: Set<EntryId> } {
  const byEntry = new Map(standings.map((s) => [s.entry, s]));
  const newRank = new Map<EntryId, number>();
  const decided = new Set<EntryId>();
  for (const d of decisions) {
    const first = byEntry.get(d.order[0] ?? '');
    if (first === undefined) throw new RangeError(`decision names an entry not in the standings: ${JSON.stringify(d.order[0])}`);
    const group = standings.filter((s) => s.rank === first.rank).map((s) => s.entry);
    const named = new Set(d.order);
    if (named.size !== d.order.length || named.size !== group.length || group.some((e) => !named.has(e)) || group.length < 2) {
      throw new RangeError(`a decision must list, once each, exactly the entries sharing rank ${first.rank}: ${group.join(', ')}`);
    }
    if (group.some((e) => decided.has(e))) throw new RangeError(`rank ${first.rank} is settled by two decisions`);
    d.order.forEach((e, i) => {
      newRank.set(e, first.rank + i);
      decided.add(e);
    });
  }
  const settled = standings
    .map((s, i) => ({ s: { ...s, rank: newRank.get(s.entry) ?? s.rank }, i }))
    .sort((a, b) => a.s.rank - b.s.rank || a.i - b.i)
    .map(({ s }) => s);
  return { settled, decided };
}
