import type { Ballot, BallotChoicesPayload, BallotEntry } from '../api/types';
import { entryNumberText, ordinal } from './labels';

/**
 * What she has picked so far. Per-category and approval ballots use `categories` (entry ids by
 * category id); ranked ballots use `ranked` (entry ids, best first).
 */
export type Selection = { categories: Record<string, number[]>; ranked: number[] };

export const EMPTY_SELECTION: Selection = { categories: {}, ranked: [] };

type BallotShape = Pick<Ballot, 'categories'> & { show: Pick<Ballot['show'], 'votingKind' | 'rankDepth'> };

const key = (categoryId: number | string) => String(categoryId);

/** Per category: this quilt, instead of any other in the category. */
export function chooseOne(selection: Selection, categoryId: number, entryId: number): Selection {
  return { ...selection, categories: { ...selection.categories, [key(categoryId)]: [entryId] } };
}

/** No vote in this category. */
export function clearCategory(selection: Selection, categoryId: number): Selection {
  const categories = { ...selection.categories };
  delete categories[key(categoryId)];
  return { ...selection, categories };
}

/** Approval: tick or untick one quilt in a category. */
export function toggleApproval(selection: Selection, categoryId: number, entryId: number, checked: boolean): Selection {
  const current = selection.categories[key(categoryId)] ?? [];
  const next = checked ? (current.includes(entryId) ? current : [...current, entryId]) : current.filter((id) => id !== entryId);
  return { ...selection, categories: { ...selection.categories, [key(categoryId)]: next } };
}

/**
 * Ranked: tapping a quilt gives it the next free place; tapping it again takes it off and moves the
 * later places up. When every place is taken, tapping another quilt changes nothing.
 */
export function toggleRanked(selection: Selection, entryId: number, depth: number): Selection {
  if (selection.ranked.includes(entryId)) return removeRanked(selection, entryId);
  if (selection.ranked.length >= depth) return selection;
  return { ...selection, ranked: [...selection.ranked, entryId] };
}

export function removeRanked(selection: Selection, entryId: number): Selection {
  return { ...selection, ranked: selection.ranked.filter((id) => id !== entryId) };
}

/** Every entry on the ballot by id. */
export function ballotEntries(ballot: Pick<Ballot, 'categories'>): Map<number, BallotEntry> {
  const map = new Map<number, BallotEntry>();
  for (const category of ballot.categories) for (const entry of category.entries) map.set(entry.id, entry);
  return map;
}

/** "No. 12, Mill Pond at Dusk", or just the title before entries are numbered. */
export function entryLabel(entry: Pick<BallotEntry, 'entryNumber' | 'title'>): string {
  const number = entryNumberText(entry.entryNumber);
  return number ? `${number}, ${entry.title}` : entry.title;
}

/** How many quilts she has picked. */
export function chosenCount(ballot: BallotShape, selection: Selection): number {
  if (ballot.show.votingKind === 'ranked') return selection.ranked.length;
  return ballot.categories.reduce((sum, c) => sum + (selection.categories[key(c.id)]?.length ?? 0), 0);
}

/** Why the ballot cannot be cast as it is, in a sentence; null when it can. */
export function ballotProblem(ballot: BallotShape, selection: Selection): string | null {
  if (chosenCount(ballot, selection) === 0) return 'Choose at least one quilt first.';
  if (ballot.show.votingKind === 'ranked') {
    const known = ballotEntries(ballot);
    if (new Set(selection.ranked).size !== selection.ranked.length) return 'Each quilt can have only one place.';
    if (selection.ranked.length > ballot.show.rankDepth) return `Choose at most ${ballot.show.rankDepth} quilts.`;
    if (selection.ranked.some((id) => !known.has(id))) return 'One of your choices is not on this ballot. Please choose again.';
    return null;
  }
  for (const category of ballot.categories) {
    const picked = selection.categories[key(category.id)] ?? [];
    if (ballot.show.votingKind === 'per_category' && picked.length > 1) return `Choose only one quilt in ${category.name}.`;
    if (new Set(picked).size !== picked.length) return `Each quilt in ${category.name} counts once.`;
    if (picked.some((id) => !category.entries.some((e) => e.id === id))) return 'One of your choices is not on this ballot. Please choose again.';
  }
  return null;
}

/**
 * The body's `choices`: every category of the ballot with the entry ids picked in it (an empty list
 * for no vote), in the ballot's order; or for a ranked ballot the ids best first.
 */
export function buildChoices(ballot: BallotShape, selection: Selection): BallotChoicesPayload {
  if (ballot.show.votingKind === 'ranked') return { ranked: selection.ranked.slice(0, ballot.show.rankDepth) };
  const categories: Record<string, number[]> = {};
  for (const category of ballot.categories) {
    const picked = selection.categories[key(category.id)] ?? [];
    categories[key(category.id)] = category.entries.filter((e) => picked.includes(e.id)).map((e) => e.id);
  }
  return { categories };
}

export type ReviewLine = { label: string; value: string; empty: boolean };

/** The ballot read back before it is cast: one line per category, or per place of a ranked ballot. */
export function reviewLines(ballot: BallotShape, selection: Selection): ReviewLine[] {
  const entries = ballotEntries(ballot);
  if (ballot.show.votingKind === 'ranked') {
    return Array.from({ length: ballot.show.rankDepth }, (_, i) => {
      const entry = entries.get(selection.ranked[i]);
      return { label: `${ordinal(i + 1)} choice`, value: entry ? entryLabel(entry) : 'Not chosen', empty: !entry };
    });
  }
  return ballot.categories.map((category) => {
    const picked = category.entries.filter((e) => (selection.categories[key(category.id)] ?? []).includes(e.id));
    return {
      label: category.name,
      value: picked.length ? picked.map(entryLabel).join('; ') : 'No vote',
      empty: picked.length === 0,
    };
  });
}
