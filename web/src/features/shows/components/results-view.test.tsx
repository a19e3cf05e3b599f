import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Results } from '../api/types';
import { ResultsView } from './results-view';

const results = (votingKind: Results['show']['votingKind'], rankedMethod: Results['show']['rankedMethod']): Results => ({
  show: { id: 2, name: 'Harvest Quilt Show', votingKind, rankedMethod, published: true, closedAt: '2026-10-04T21:00:00Z' },
  audit: { codesIssued: 0, codesUsed: 0, memberBallots: 3, codeBallots: 0, paperBallots: 0, ballotsCast: 3, votesPerCategory: [], text: '3 ballots.' },
  categories: [
    {
      categoryId: 11,
      name: 'Small',
      entryCount: 3,
      ballots: 3,
      blank: 0,
      spoiled: 0,
      standings: [
        { entryId: 601, entryNumber: 1, title: 'Hedgerow Stars', makers: ['Ottilie Brannock'], score: 2, rank: 1, ribbon: 1, byDecision: false },
        { entryId: 602, entryNumber: 2, title: 'Kitchen Garden', makers: ['Marigold Fenwick'], score: 1, rank: 2, ribbon: null, byDecision: false },
        { entryId: 603, entryNumber: 3, title: 'Quiet Lane', makers: ['Winifred Ashdown'], score: 0, rank: 3, ribbon: null, byDecision: false },
      ],
      ties: [],
      decisions: [],
    },
  ],
});

describe('results', () => {
  it('says "No votes" for a quilt nobody chose instead of giving it a place', () => {
    render(<ResultsView results={results('per_category', 'points')} />);
    const rows = screen.getAllByTestId('standing');
    expect(within(rows[1]).getByText('2nd, no ribbon')).toBeInTheDocument();
    expect(within(rows[2]).getByText('No votes')).toBeInTheDocument();
  });

  it('keeps the place of a quilt whose 0 is only the last round of an instant runoff', () => {
    render(<ResultsView results={results('ranked', 'instant_runoff')} />);
    expect(within(screen.getAllByTestId('standing')[2]).getByText('3rd, no ribbon')).toBeInTheDocument();
  });
});
