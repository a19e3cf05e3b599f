import { describe, expect, it } from 'vitest';
import type { Ballot, VotingKind } from '../api/types';
import {
  ballotProblem,
  buildChoices,
  chooseOne,
  clearCategory,
  EMPTY_SELECTION,
  removeRanked,
  reviewLines,
  toggleApproval,
  toggleRanked,
} from './choices';

const entry = (id: number, entryNumber: number | null, title: string) => ({
  id,
  entryNumber,
  title,
  makers: null,
  photoUrl: null,
  widthText: '40',
  heightText: '50',
});

const ballot = (votingKind: VotingKind): Ballot => ({
  show: { id: 1, name: 'Harvest Show', venue: 'Grange Hall', guildName: 'Wrenfield Quilt Guild', votingKind, rankDepth: 3, votingState: 'open', votingClosesAt: null },
  categories: [
    { id: 10, name: 'Small', description: '', entries: [entry(101, 1, 'Mill Pond'), entry(102, 2, 'Hedgerow')] },
    { id: 20, name: 'Large', description: '', entries: [entry(201, 3, 'Orchard Rows'), entry(202, null, 'Winter Barn')] },
  ],
});

describe('per-category ballots', () => {
  it('keep one quilt a category and send every category, empty where she did not vote', () => {
    let s = chooseOne(EMPTY_SELECTION, 10, 101);
    s = chooseOne(s, 10, 102);
    expect(buildChoices(ballot('per_category'), s)).toEqual({ categories: { '10': [102], '20': [] } });
    s = chooseOne(s, 20, 202);
    s = clearCategory(s, 10);
    expect(buildChoices(ballot('per_category'), s)).toEqual({ categories: { '10': [], '20': [202] } });
  });

  it('are read back a line per category', () => {
    const s = chooseOne(EMPTY_SELECTION, 20, 202);
    expect(reviewLines(ballot('per_category'), s)).toEqual([
      { label: 'Small', value: 'No vote', empty: true },
      { label: 'Large', value: 'Winter Barn', empty: false },
    ]);
  });

  it('refuse an empty ballot and two quilts in one category', () => {
    expect(ballotProblem(ballot('per_category'), EMPTY_SELECTION)).toBe('Choose at least one quilt first.');
    expect(ballotProblem(ballot('per_category'), { categories: { '10': [101, 102] }, ranked: [] })).toBe('Choose only one quilt in Small.');
    expect(ballotProblem(ballot('per_category'), { categories: { '10': [999] }, ranked: [] })).toMatch(/not on this ballot/);
    expect(ballotProblem(ballot('per_category'), chooseOne(EMPTY_SELECTION, 10, 101))).toBeNull();
  });
});

describe('approval ballots', () => {
  it('take as many as she likes, in the ballot’s order', () => {
    let s = toggleApproval(EMPTY_SELECTION, 10, 102, true);
    s = toggleApproval(s, 10, 101, true);
    s = toggleApproval(s, 10, 101, true);
    s = toggleApproval(s, 20, 201, true);
    expect(ballotProblem(ballot('approval'), s)).toBeNull();
    expect(buildChoices(ballot('approval'), s)).toEqual({ categories: { '10': [101, 102], '20': [201] } });
    s = toggleApproval(s, 20, 201, false);
    expect(buildChoices(ballot('approval'), s)).toEqual({ categories: { '10': [101, 102], '20': [] } });
    expect(reviewLines(ballot('approval'), s)[0].value).toBe('No. 1, Mill Pond; No. 2, Hedgerow');
  });
});

describe('ranked ballots', () => {
  it('give places in the order she taps, at most three, and move later places up on undo', () => {
    let s = toggleRanked(EMPTY_SELECTION, 201, 3);
    s = toggleRanked(s, 101, 3);
    s = toggleRanked(s, 202, 3);
    s = toggleRanked(s, 102, 3);
    expect(s.ranked).toEqual([201, 101, 202]);
    s = toggleRanked(s, 101, 3);
    expect(s.ranked).toEqual([201, 202]);
    expect(buildChoices(ballot('ranked'), s)).toEqual({ ranked: [201, 202] });
    expect(reviewLines(ballot('ranked'), s).map((l) => `${l.label}: ${l.value}`)).toEqual([
      '1st choice: No. 3, Orchard Rows',
      '2nd choice: Winter Barn',
      '3rd choice: Not chosen',
    ]);
    expect(removeRanked(s, 201).ranked).toEqual([202]);
  });

  it('refuse duplicates and too many places', () => {
    expect(ballotProblem(ballot('ranked'), { categories: {}, ranked: [101, 101] })).toBe('Each quilt can have only one place.');
    expect(ballotProblem(ballot('ranked'), { categories: {}, ranked: [101, 102, 201, 202] })).toBe('Choose at most 3 quilts.');
    expect(ballotProblem(ballot('ranked'), { categories: {}, ranked: [101] })).toBeNull();
  });
});
