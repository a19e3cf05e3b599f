import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Results } from '@/features/shows/api/types';
import { guild, show } from '@/features/shows/testing/fixtures';
import { jsonResponse, mockFetch, renderWithProviders } from '@/testing/test-utils';
import ShowResultsRoute from './show-results';

const results: Results = {
  show: { id: 2, name: 'Harvest Quilt Show', votingKind: 'ranked', rankedMethod: 'points', published: true, closedAt: '2026-10-04T21:00:00Z' },
  audit: {
    codesIssued: 300,
    codesUsed: 57,
    memberBallots: 41,
    codeBallots: 38,
    paperBallots: 19,
    ballotsCast: 98,
    votesPerCategory: [{ categoryId: null, name: 'Best in show', votes: 98 }],
    text: '98 ballots cast: 41 by members, 38 by visitors online and 19 on paper. 300 visitor codes printed, 57 used.',
  },
  categories: [
    {
      categoryId: null,
      name: 'Best in show',
      entryCount: 4,
      ballots: 98,
      blank: 0,
      spoiled: 1,
      standings: [
        { entryId: 603, entryNumber: 3, title: 'Orchard Rows', makers: ['Tamsin Oakes'], score: 180, rank: 1, ribbon: 1, byDecision: false },
        { entryId: 601, entryNumber: 1, title: 'Hedgerow Stars', makers: ['Ottilie Brannock', 'Marigold Fenwick'], score: 151, rank: 2, ribbon: 2, byDecision: true },
        { entryId: 604, entryNumber: 4, title: 'Winter Barn', makers: [], score: 151, rank: 3, ribbon: 3, byDecision: true },
        { entryId: 602, entryNumber: 2, title: 'Kitchen Garden', makers: ['Winifred Ashdown'], score: 40, rank: 4, ribbon: null, byDecision: false },
      ],
      ties: [],
      decisions: [{ id: 9, order: [601, 604], note: 'The judges chose.', decidedBy: 'Marigold Fenwick', decidedAt: '2026-10-04T22:00:00Z' }],
    },
  ],
};

function renderResults(overrides: Partial<typeof show>, body: Results = results) {
  const fetchMock = mockFetch({
    'GET /api/guilds/1': jsonResponse(200, guild),
    'GET /api/guilds/1/shows/2': jsonResponse(200, { ...show, ...overrides }),
    'GET /api/guilds/1/shows/2/results': jsonResponse(200, body),
  });
  renderWithProviders(<ShowResultsRoute />, { path: '/guilds/:guildId/shows/:showId/results', route: '/guilds/1/shows/2/results' });
  return fetchMock;
}

describe('Results', () => {
  it('shows ribbons in words, tie decisions and the audit line', async () => {
    renderResults({ votingState: 'closed', resultsPublished: true });
    const rows = await screen.findAllByTestId('standing');
    expect(within(rows[0]).getByTestId('ribbon')).toHaveTextContent('1st place');
    expect(within(rows[1]).getByTestId('ribbon')).toHaveTextContent('2nd place');
    expect(rows[1]).toHaveTextContent('Placed by the show chair’s tie decision');
    expect(rows[1]).toHaveTextContent('Ottilie Brannock and Marigold Fenwick');
    expect(within(rows[3]).queryByTestId('ribbon')).not.toBeInTheDocument();
    expect(rows[3]).toHaveTextContent('4th');
    expect(screen.getByRole('columnheader', { name: 'Points' })).toBeInTheDocument();
    expect(screen.getByText(/The judges chose\./)).toBeInTheDocument();
    expect(screen.getByTestId('audit-text')).toHaveTextContent('98 ballots cast: 41 by members');
    expect(screen.queryByTestId('not-published')).not.toBeInTheDocument();
  });

  it('tells members the results are not out yet, without asking for them', async () => {
    const fetchMock = renderResults({ votingState: 'closed', resultsPublished: false });
    expect(await screen.findByText('The results are not published yet. Please look again later.')).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([url]) => String(url).includes('/results'))).toBe(false);
  });

  it('lets the chair see them after closing, marked as not published', async () => {
    renderResults({ votingState: 'closed', resultsPublished: false, canManage: true }, { ...results, show: { ...results.show, published: false } });
    expect(await screen.findByTestId('not-published')).toHaveTextContent('Not published yet');
    expect(screen.getByRole('link', { name: 'Download the results (CSV)' })).toHaveAttribute('href', '/api/guilds/1/shows/2/results.csv');
  });
});
