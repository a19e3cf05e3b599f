import { act, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Results } from '@/features/shows/api/types';
import { ballot, entry, guild, show, turnout } from '@/features/shows/testing/fixtures';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import ShowVotingRoute from './show-voting';

const chairGuild = { ...guild, myRoles: ['show_chair'] };
const PAPER = 'POST /api/guilds/1/shows/2/voting/paper';
const TURNOUT = 'GET /api/guilds/1/shows/2/voting/turnout';

const base = (state: 'not_open' | 'open' | 'closed') => ({
  'GET /api/guilds/1': jsonResponse(200, chairGuild),
  'GET /api/guilds/1/shows/2': jsonResponse(200, { ...show, canManage: true, votingState: state }),
  [TURNOUT]: jsonResponse(200, { ...turnout, state }),
  'GET /api/guilds/1/shows/2/voting/codes': jsonResponse(200, { batches: [{ batch: 1, count: 300, used: 57, createdAt: '2026-09-28T14:00:00Z' }] }),
  'GET /api/guilds/1/shows/2/ballot': jsonResponse(200, { ...ballot('per_category'), hasVoted: false }),
});

function renderDesk(routes: Parameters<typeof mockFetch>[0]) {
  const fetchMock = mockFetch(routes);
  const utils = renderWithProviders(<ShowVotingRoute />, { path: '/guilds/:guildId/shows/:showId/voting', route: '/guilds/1/shows/2/voting' });
  return { ...utils, fetchMock };
}

const asked = (fetchMock: ReturnType<typeof mockFetch>, part: string) => fetchMock.mock.calls.filter(([url]) => String(url).includes(part)).length;

afterEach(() => {
  vi.useRealTimers();
});

describe('Ballot desk', () => {
  it('shows turnout while voting is open and never asks for standings', async () => {
    const { fetchMock } = renderDesk(base('open'));
    const figures = await screen.findByTestId('turnout');
    expect(figures).toHaveTextContent('Ballots cast in all98');
    expect(figures).toHaveTextContent('Members (online)41of 112 members');
    expect(figures).toHaveTextContent('Visitors (online, with a code)38');
    expect(figures).toHaveTextContent('Paper ballots keyed in19');
    expect(figures).toHaveTextContent('Visitor codes printed300');
    expect(figures).toHaveTextContent('Visitor codes used57');
    expect(screen.getByTestId('voting-state')).toHaveTextContent('Voting open now');
    expect(screen.getByRole('link', { name: 'Print batch 1 (300 cards, PDF)' })).toHaveAttribute('href', '/api/guilds/1/shows/2/voting/codes.pdf?batch=1');
    expect(screen.getByRole('link', { name: 'The same codes as paper ballots (PDF)' })).toHaveAttribute(
      'href',
      '/api/guilds/1/shows/2/voting/codes.pdf?batch=1&layout=paper',
    );
    expect(await screen.findByRole('form', { name: 'Record a paper ballot' })).toBeInTheDocument();

    expect(asked(fetchMock, '/results')).toBe(0);
    expect(screen.queryByTestId('standing')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Publish the results' })).not.toBeInTheDocument();
  });

  it('asks for turnout again every 10 seconds while voting is open', async () => {
    vi.useFakeTimers({ shouldAdvanceTime: true });
    const { fetchMock } = renderDesk(base('open'));
    await screen.findByTestId('turnout');
    const before = asked(fetchMock, '/voting/turnout');
    await act(() => vi.advanceTimersByTimeAsync(10_000));
    await waitFor(() => expect(asked(fetchMock, '/voting/turnout')).toBe(before + 1));
  });

  it('keys in paper ballots one after another and says plainly when a code was used', async () => {
    let calls = 0;
    const { user, fetchMock } = renderDesk({
      ...base('open'),
      [PAPER]: () => {
        calls += 1;
        return calls === 1
          ? jsonResponse(201, { ok: true, ballotsCast: 99 })
          : jsonResponse(409, { statusCode: 409, message: 'That code has already been used.' });
      },
    });
    const form = await screen.findByRole('form', { name: 'Record a paper ballot' });
    const code = within(form).getByLabelText('Code on the ballot card');
    await user.type(code, 'k7qm 3xhd-9prw');
    await user.click(within(form).getByRole('radio', { name: /Winter Barn/ }));
    await user.click(within(form).getByRole('button', { name: 'Record this paper ballot' }));

    expect(await screen.findByText('Paper ballot recorded. 99 ballots cast so far. Type the next code.')).toBeInTheDocument();
    expect(requestBody(fetchMock, PAPER)).toEqual({ code: 'K7QM3XHD9PRW', choices: { categories: { '11': [], '12': [604] } } });
    expect(code).toHaveValue('');
    expect(code).toHaveFocus();
    expect(within(form).getByRole('radio', { name: /Winter Barn/ })).not.toBeChecked();

    await user.type(code, 'K7QM3XHD9PRW');
    await user.click(within(form).getByRole('radio', { name: /Hedgerow Stars/ }));
    await user.click(within(form).getByRole('button', { name: 'Record this paper ballot' }));
    expect(await within(form).findByTestId('paper-error')).toHaveTextContent('That code has already been used.');
    expect(code).toHaveFocus();
  });

  it('before opening, says which quilts will miss the ballot and that entries will stop', async () => {
    const { user, fetchMock } = renderDesk({
      ...base('not_open'),
      'GET /api/guilds/1/shows/2/entries?status=submitted': jsonResponse(200, [entry, { ...entry, id: 902 }]),
      'POST /api/guilds/1/shows/2/voting/open': jsonResponse(200, { ...show, canManage: true, votingState: 'open' }),
    });
    await waitFor(() => expect(asked(fetchMock, 'status=submitted')).toBe(1));
    await user.click(await screen.findByRole('button', { name: 'Open voting now' }));
    expect(await screen.findByText('2 quilts are still waiting for your review and will not be on the ballot.')).toBeInTheDocument();
    expect(screen.getByText('Entries are still open: once voting opens, the show takes no more entries.')).toBeInTheDocument();
    expect(asked(fetchMock, '/voting/open')).toBe(0);
    await user.click(screen.getByRole('button', { name: 'Yes, open voting' }));
    await waitFor(() => expect(asked(fetchMock, '/voting/open')).toBe(1));
  });

  it('closes voting only after the chair confirms that closing is final', async () => {
    const { user, fetchMock } = renderDesk({
      ...base('open'),
      'POST /api/guilds/1/shows/2/voting/close': jsonResponse(200, { ...show, canManage: true, votingState: 'closed' }),
    });
    await user.click(await screen.findByRole('button', { name: 'Close voting' }));
    expect(screen.getByText(/Closing is final/)).toBeInTheDocument();
    expect(asked(fetchMock, '/voting/close')).toBe(0);
    await user.click(screen.getByRole('button', { name: 'Yes, close voting' }));
    await waitFor(() => expect(asked(fetchMock, '/voting/close')).toBe(1));
  });

  it('after closing: publish with a confirm step, settle a tie with a note, and the exports', async () => {
    const results: Results = {
      show: { id: 2, name: 'Harvest Quilt Show', votingKind: 'per_category', rankedMethod: 'points', published: false, closedAt: '2026-10-04T21:00:00Z' },
      audit: {
        codesIssued: 300,
        codesUsed: 57,
        memberBallots: 41,
        codeBallots: 38,
        paperBallots: 19,
        ballotsCast: 98,
        votesPerCategory: [],
        text: '98 ballots: 41 from members, 38 from visitors online, 19 on paper.',
      },
      categories: [
        {
          categoryId: 11,
          name: 'Small',
          entryCount: 2,
          ballots: 98,
          blank: 4,
          spoiled: 0,
          standings: [
            { entryId: 601, entryNumber: 1, title: 'Hedgerow Stars', makers: ['Ottilie Brannock'], score: 47, rank: 1, ribbon: 1, byDecision: false },
            { entryId: 602, entryNumber: 2, title: 'Kitchen Garden', makers: ['Marigold Fenwick'], score: 47, rank: 1, ribbon: 1, byDecision: false },
          ],
          ties: [{ rank: 1, entryIds: [601, 602] }],
          decisions: [],
        },
      ],
    };
    const DECIDE = 'POST /api/guilds/1/shows/2/results/decisions';
    const { user, fetchMock } = renderDesk({
      ...base('closed'),
      'GET /api/guilds/1/shows/2/results': jsonResponse(200, results),
      [DECIDE]: jsonResponse(201, { ...results, categories: [{ ...results.categories[0], ties: [] }] }),
      'POST /api/guilds/1/shows/2/results/publish': jsonResponse(200, { ...results, show: { ...results.show, published: true } }),
    });
    const tie = await screen.findByRole('form', { name: 'Tie for 1st place in Small' });
    await user.click(within(tie).getByRole('button', { name: /^Move down\s?No. 1, Hedgerow Stars$/ }));
    // Now last, it cannot go further down: focus stays with it, on its other button.
    expect(within(tie).getByRole('button', { name: /^Move up\s?No. 1, Hedgerow Stars$/ })).toHaveFocus();
    await user.click(within(tie).getByRole('button', { name: 'Record this decision' }));
    expect(await within(tie).findByText('Say how the tie was decided, for the record.')).toBeInTheDocument();
    await user.type(within(tie).getByLabelText('How it was decided'), 'The judges chose.');
    await user.click(within(tie).getByRole('button', { name: 'Record this decision' }));
    await waitFor(() => expect(requestBody(fetchMock, DECIDE)).toEqual({ categoryId: 11, order: [602, 601], note: 'The judges chose.' }));
    await waitFor(() => expect(screen.queryByRole('form', { name: 'Tie for 1st place in Small' })).not.toBeInTheDocument());

    expect(screen.getByRole('link', { name: 'Every ballot (CSV)' })).toHaveAttribute('href', '/api/guilds/1/shows/2/ballots.csv');
    expect(screen.getByRole('link', { name: 'Results (PDF)' })).toHaveAttribute('href', '/api/guilds/1/shows/2/results.pdf');
    await user.click(screen.getByRole('button', { name: 'Publish the results' }));
    await user.click(screen.getByRole('button', { name: 'Yes, publish them' }));
    expect(await screen.findByTestId('published')).toHaveTextContent('The results are published.');
  });

  it('warns before publishing with a tie left to the ribbon rule, and once published shows ties without forms', async () => {
    const tied: Results = {
      show: { id: 2, name: 'Harvest Quilt Show', votingKind: 'per_category', rankedMethod: 'points', published: false, closedAt: '2026-10-04T21:00:00Z' },
      audit: { codesIssued: 0, codesUsed: 0, memberBallots: 4, codeBallots: 0, paperBallots: 0, ballotsCast: 4, votesPerCategory: [], text: '4 ballots.' },
      categories: [
        {
          categoryId: 11,
          name: 'Small',
          entryCount: 3,
          ballots: 4,
          blank: 0,
          spoiled: 0,
          standings: [
            { entryId: 601, entryNumber: 1, title: 'Hedgerow Stars', makers: [], score: 2, rank: 1, ribbon: 1, byDecision: false },
            { entryId: 602, entryNumber: 2, title: 'Kitchen Garden', makers: [], score: 2, rank: 1, ribbon: 1, byDecision: false },
            { entryId: 603, entryNumber: 3, title: 'Quiet Lane', makers: [], score: 0, rank: 3, ribbon: null, byDecision: false },
          ],
          ties: [{ rank: 1, entryIds: [601, 602] }],
          decisions: [],
        },
      ],
    };
    const { user, unmount } = renderDesk({ ...base('closed'), 'GET /api/guilds/1/shows/2/results': jsonResponse(200, tied) });
    await user.click(await screen.findByRole('button', { name: 'Publish the results' }));
    expect(screen.getByText(/1 tie is not settled by a decision: the tied quilts will share the place/)).toBeInTheDocument();
    unmount();

    renderDesk({ ...base('closed'), 'GET /api/guilds/1/shows/2/results': jsonResponse(200, { ...tied, show: { ...tied.show, published: true } }) });
    expect(await screen.findByTestId('shared-place')).toHaveTextContent('Shared 1st place: No. 1, Hedgerow Stars and No. 2, Kitchen Garden.');
    expect(screen.queryByRole('form', { name: 'Tie for 1st place in Small' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Publish the results' })).not.toBeInTheDocument();
  });
});
