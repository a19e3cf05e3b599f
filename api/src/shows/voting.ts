import type { BallotChoices } from './ballot.entity';
import type { RankedMethod, VotingKind } from './show.entity';
import {
  approval,
  instantRunoff,
  plurality,
  rankedPoints,
  ribbons,
  type RunoffRound,
  type ScoreResult,
  type Standing,
} from './tally';

/** Voting's state at an instant. Closing is final; the schedule opens and closes by itself. */
export type VotingState = 'not_open' | 'scheduled' | 'open' | 'closed';

export interface VotingTimes {
  votingOpensAt?: Date | null;
  votingClosesAt?: Date | null;
  votingOpenedAt?: Date | null;
  votingClosedAt?: Date | null;
}

export function votingState(show: VotingTimes, now: Date = new Date()): VotingState {
  if (show.votingClosedAt && show.votingClosedAt <= now) return 'closed';
  if (show.votingClosesAt && show.votingClosesAt <= now) return 'closed';
  if (show.votingOpenedAt && show.votingOpenedAt <= now) return 'open';
  if (show.votingOpensAt) return show.votingOpensAt <= now ? 'open' : 'scheduled';
  return 'not_open';
}

/** What the ballot rules need to know about a category: its entries on the ballot (accepted ones). */
export interface BallotCategory {
  id: number;
  name: string;
  entries: { id: number; entryNumber: number | null; title: string }[];
}

export type BallotCheck = { ok: true; choices: BallotChoices; votes: number } | { ok: false; message: string };

const entryName = (e: { entryNumber: number | null; title: string }) => (e.entryNumber != null ? `No. ${e.entryNumber}, "${e.title}"` : `"${e.title}"`);

/**
 * Checks a ballot against the show's voting kind before anything is written, and returns it in a
 * clean form (ids as numbers, categories by id). A ballot that breaks a rule is refused with a
 * message the voter can act on; it is never stored half-valid.
 * - per_category: at most one entry per category; approval: any number, each once;
 * - ranked: 1 to `rankDepth` different entries of the show, best first;
 * - every entry must be on the ballot (accepted) in the category it is marked under;
 * - a ballot must vote for at least one quilt.
 */
export function checkBallot(kind: VotingKind, rankDepth: number, categories: readonly BallotCategory[], raw: unknown): BallotCheck {
  const fail = (message: string): BallotCheck => ({ ok: false, message });
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) return fail('Choose the quilts you vote for.');
  const input = raw as Record<string, unknown>;
  const whereIs = new Map<number, { category: BallotCategory; entry: BallotCategory['entries'][number] }>();
  for (const c of categories) for (const e of c.entries) whereIs.set(e.id, { category: c, entry: e });
  const isId = (v: unknown): v is number => Number.isSafeInteger(v) && (v as number) > 0;

  if (kind === 'ranked') {
    const list = input.ranked;
    if (!Array.isArray(list)) return fail('List your favourite quilts in order, best first.');
    if (list.length === 0) return fail('Choose at least one quilt before you cast your ballot.');
    if (list.length > rankDepth) return fail(`Rank at most ${rankDepth} quilts.`);
    if (!list.every(isId)) return fail('Your ballot lists something that is not a quilt in this show.');
    if (new Set(list).size !== list.length) return fail('Each quilt can take only one place on your ballot.');
    for (const id of list) if (!whereIs.has(id)) return fail('Your ballot names a quilt that is not on this show\'s ballot.');
    return { ok: true, choices: { ranked: [...list] }, votes: list.length };
  }

  const marked = input.categories;
  if (typeof marked !== 'object' || marked === null || Array.isArray(marked)) return fail('Choose the quilts you vote for in each category.');
  const byId = new Map(categories.map((c) => [String(c.id), c]));
  const clean: Record<string, number[]> = {};
  let votes = 0;
  for (const [key, value] of Object.entries(marked as Record<string, unknown>)) {
    const category = byId.get(key);
    if (!category) return fail('Your ballot names a category that has no quilts on this ballot.');
    const ids = Array.isArray(value) ? value : value === null ? [] : [value];
    if (!ids.every(isId)) return fail(`Your ballot for ${category.name} lists something that is not a quilt.`);
    if (new Set(ids).size !== ids.length) return fail(`Your ballot for ${category.name} names the same quilt twice.`);
    if (kind === 'per_category' && ids.length > 1) return fail(`Vote for one quilt in ${category.name}; you chose ${ids.length}.`);
    for (const id of ids) {
      const found = whereIs.get(id);
      if (!found) return fail(`Your ballot for ${category.name} names a quilt that is not on this show's ballot.`);
      if (found.category.id !== category.id) return fail(`${entryName(found.entry)} is in ${found.category.name}, not ${category.name}.`);
    }
    if (ids.length) clean[key] = ids;
    votes += ids.length;
  }
  if (votes === 0) return fail('Choose at least one quilt before you cast your ballot.');
  return { ok: true, choices: { categories: clean }, votes };
}

export interface TieDecisionInput {
  id: number;
  categoryId: number | null;
  order: number[];
}

export interface CategoryResult {
  categoryId: number | null;
  name: string;
  entryCount: number;
  ballots: number;
  blank: number;
  spoiled: number;
  votes: number;
  /** `byDecision`: the entry's rank comes from a chair's recorded decision. */
  standings: { entryId: number; score: number; rank: number; ribbon: 1 | 2 | 3 | null; byDecision: boolean }[];
  /** Shared ranks that decide a ribbon and could be settled by the chair. */
  ties: { rank: number; entryIds: number[] }[];
  /** Decisions that no longer match the count (the standings changed) are reported, not applied. */
  staleDecisionIds: number[];
  rounds?: { counts: Record<string, number>; eliminated: number[]; exhausted: number }[];
}

/**
 * Counts every category of a show (or the overall award of a ranked show) with the tally functions
 * and applies the ribbon rule (TRADE.md §6.6) with the chair's recorded tie decisions. Pure: the same
 * ballots in any order give the same result. Entries are listed in entry-number order, which is the
 * published order instant runoff's last tie-break uses.
 */
export function countShow(
  kind: VotingKind,
  method: RankedMethod,
  categories: readonly BallotCategory[],
  ballots: readonly BallotChoices[],
  decisions: readonly TieDecisionInput[] = [],
): CategoryResult[] {
  const toStanding = (s: Standing) => ({ entryId: Number(s.entry), score: s.score, rank: s.rank });
  const finish = (
    categoryId: number | null,
    name: string,
    entryIds: number[],
    result: { ballots: number; blank: number; spoiled: { total: number }; standings: readonly Standing[] },
    votes: number,
    rounds?: readonly RunoffRound[],
  ): CategoryResult => {
    const mine = decisions.filter((d) => d.categoryId === categoryId);
    const stale: number[] = [];
    const usable = mine.filter((d) => {
      const ranks = new Set(d.order.map((id) => result.standings.find((s) => s.entry === String(id))?.rank));
      const rank = [...ranks][0];
      const group = result.standings.filter((s) => s.rank === rank).map((s) => Number(s.entry));
      const fits = ranks.size === 1 && rank !== undefined && group.length === d.order.length && group.length > 1;
      if (!fits) stale.push(d.id);
      return fits;
    });
    const r = ribbons(result.standings, {
      entryCount: entryIds.length,
      decisions: usable.map((d) => ({ order: d.order.map(String) })),
    });
    const ribbonOf = new Map(r.ribbons.map((x) => [x.entry, x]));
    const decided = new Set(usable.flatMap((d) => d.order.map(String)));
    const settled = r.standings.map((s) => ({
      ...toStanding(s),
      ribbon: ribbonOf.get(s.entry)?.place ?? null,
      byDecision: decided.has(s.entry),
    }));
    const ties: CategoryResult['ties'] = [];
    for (const rank of new Set(r.standings.map((s) => s.rank))) {
      const group = r.standings.filter((s) => s.rank === rank && s.score > 0);
      if (group.length > 1 && rank <= r.places) ties.push({ rank, entryIds: group.map((s) => Number(s.entry)) });
    }
    return {
      categoryId,
      name,
      entryCount: entryIds.length,
      ballots: result.ballots,
      blank: result.blank,
      spoiled: result.spoiled.total,
      votes,
      standings: settled,
      ties,
      staleDecisionIds: stale,
      ...(rounds ? { rounds: rounds.map((x) => ({ counts: { ...x.counts }, eliminated: x.eliminated.map(Number), exhausted: x.exhausted })) } : {}),
    };
  };

  if (kind === 'ranked') {
    const entryIds = categories.flatMap((c) => c.entries).sort(byNumber).map((e) => e.id);
    const ids = entryIds.map(String);
    const lists = ballots.map((b) => (b.ranked ?? []).map(String));
    if (method === 'instant_runoff') {
      const r = instantRunoff(lists, ids);
      return [finish(null, 'Overall', entryIds, r, r.counted, r.rounds)];
    }
    const r = rankedPoints(lists, ids);
    return [finish(null, 'Overall', entryIds, r, r.counted)];
  }

  return categories.map((c) => {
    const entryIds = [...c.entries].sort(byNumber).map((e) => e.id);
    const ids = entryIds.map(String);
    const marks = ballots.map((b) => (b.categories?.[String(c.id)] ?? []).map(String));
    const r: ScoreResult = kind === 'approval' ? approval(marks, ids) : plurality(marks, ids);
    return finish(c.id, c.name, entryIds, r, r.total);
  });
}

function byNumber(a: { id: number; entryNumber: number | null }, b: { id: number; entryNumber: number | null }): number {
  return (a.entryNumber ?? Number.MAX_SAFE_INTEGER) - (b.entryNumber ?? Number.MAX_SAFE_INTEGER) || a.id - b.id;
}
