import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { entry, guild, show } from '@/features/shows/testing/fixtures';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import ShowEntriesReviewRoute from './show-entries-review';

const big = {
  ...entry,
  id: 502,
  title: 'Orchard Rows',
  widthMm: 1536.7,
  heightMm: 1536.7,
  widthText: '60 1/2',
  heightText: '60 1/2',
  perimeterText: '242 in',
  entrant: { membershipId: 31, name: 'Winifred Ashdown' },
  enteredOnBehalf: true,
  enteredBy: 'Marigold Fenwick',
  sizeProblem: 'This category takes quilts at most 240 in around (perimeter); yours is 242 in around, 2 in over.',
};

function renderReview(extra: Parameters<typeof mockFetch>[0] = {}, route = '/guilds/1/shows/2/entries-review') {
  const fetchMock = mockFetch({
    'GET /api/guilds/1': jsonResponse(200, { ...guild, myRoles: ['show_chair'] }),
    'GET /api/guilds/1/shows/2': jsonResponse(200, { ...show, canManage: true, makersHidden: true }),
    'GET /api/guilds/1/shows/2/entries': jsonResponse(200, [entry, big]),
    'GET /api/guilds/1/shows/2/entries?status=submitted': jsonResponse(200, [entry]),
    ...extra,
  });
  const utils = renderWithProviders(<ShowEntriesReviewRoute />, { path: '/guilds/:guildId/shows/:showId/entries-review', route });
  return { ...utils, fetchMock };
}

describe('Entries review', () => {
  it('once voting has opened, offers no review, moves or numbering, only corrections', async () => {
    renderReview({ 'GET /api/guilds/1/shows/2': jsonResponse(200, { ...show, canManage: true, votingState: 'open' }) });
    const rows = await screen.findAllByTestId('review-row');
    expect(screen.getByText(/Voting has opened, so the quilts on the ballot/)).toBeInTheDocument();
    for (const name of [/^Accept/, /^Decline/, /^Category or number/, 'Number all accepted entries', 'Enter a quilt for a member']) {
      expect(screen.queryByRole('button', { name })).not.toBeInTheDocument();
      expect(screen.queryByRole('link', { name })).not.toBeInTheDocument();
    }
    expect(within(rows[0]).getByRole('link', { name: /^Edit details/ })).toBeInTheDocument();
  });

  it('lists entries with size problems, filters by status and builds the download links', async () => {
    const { user, router } = renderReview();
    const rows = await screen.findAllByTestId('review-row');
    expect(rows).toHaveLength(2);
    expect(within(rows[1]).getByTestId('size-problem')).toHaveTextContent('Does not fit: This category takes quilts at most 240 in around');
    expect(rows[1]).toHaveTextContent('Entered by Marigold Fenwick');

    const tags = screen.getByRole('link', { name: 'Hang tags (PDF)' });
    expect(tags).toHaveAttribute('href', '/api/guilds/1/shows/2/hang-tags.pdf?hideMakers=1');
    await user.click(screen.getByLabelText('Hide makers’ names on the hang tags'));
    expect(tags).toHaveAttribute('href', '/api/guilds/1/shows/2/hang-tags.pdf');
    expect(screen.getByRole('link', { name: 'Entry list (CSV)' })).toHaveAttribute('href', '/api/guilds/1/shows/2/entries.csv');
    expect(screen.getByRole('link', { name: 'Entry list (PDF)' })).toHaveAttribute('download');

    await user.selectOptions(screen.getByLabelText('Show'), 'Waiting for review');
    await waitFor(() => expect(screen.getAllByTestId('review-row')).toHaveLength(1));
    expect(router.state.location.search).toBe('?status=submitted');
  });

  it('declines only with a reason', async () => {
    const REVIEW = 'POST /api/guilds/1/shows/2/entries/501/review';
    const { user, fetchMock } = renderReview({ [REVIEW]: jsonResponse(200, { ...entry, status: 'declined' }) });
    const row = (await screen.findAllByTestId('review-row'))[0];
    await user.click(within(row).getByRole('button', { name: /^Decline…/ }));
    const dialog = await screen.findByRole('dialog', { name: 'Decline “Mill Pond at Dusk”' });
    await user.click(within(dialog).getByRole('button', { name: 'Decline the entry' }));
    expect(await within(dialog).findByText('Say why, so the entrant knows. She will see it.')).toBeInTheDocument();
    await user.type(within(dialog).getByLabelText('Reason'), 'Shown here last year.');
    await user.click(within(dialog).getByRole('button', { name: 'Decline the entry' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(requestBody(fetchMock, REVIEW)).toEqual({ decision: 'decline', reason: 'Shown here last year.' });
    expect(screen.getByText('“Mill Pond at Dusk” is declined.')).toBeInTheDocument();
  });

  it('moves an entry, warning when it does not fit, and sets its number', async () => {
    const PATCH = 'PATCH /api/guilds/1/shows/2/entries/502';
    const { user, fetchMock } = renderReview({ [PATCH]: jsonResponse(200, big) });
    const row = (await screen.findAllByTestId('review-row'))[1];
    await user.click(within(row).getByRole('button', { name: /^Category or number…/ }));
    const dialog = await screen.findByRole('dialog', { name: '“Orchard Rows”' });
    await user.selectOptions(within(dialog).getByLabelText('Category'), '11');
    expect(within(dialog).getByTestId('move-warning')).toHaveTextContent(
      "It does not fit Small: This category takes quilts less than 160 in around (perimeter); yours is 242 in around, 82 in over. Choose another category, or change the quilt's size first.",
    );
    expect(dialog).not.toHaveTextContent('You can still move it');
    await user.type(within(dialog).getByLabelText(/Entry number/), '17');
    await user.click(within(dialog).getByRole('button', { name: 'Save' }));
    // It does not fit Small, so the move is refused before sending and the dialog stays open.
    expect(await within(dialog).findByText('Choose a category this quilt fits, or keep it in Medium.')).toBeInTheDocument();
    expect(screen.getByRole('dialog', { name: '“Orchard Rows”' })).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'PATCH')).toBe(false);

    // Kept in Medium, the number alone is saved.
    await user.selectOptions(within(dialog).getByLabelText('Category'), '12');
    expect(within(dialog).queryByTestId('move-warning')).not.toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Save' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(requestBody(fetchMock, PATCH)).toEqual({ entryNumber: 17 });
    expect(fetchMock.mock.calls.filter(([, init]) => init?.method === 'PATCH')).toHaveLength(1);
  });

  it('numbers every accepted entry in one go', async () => {
    const { user } = renderReview({ 'POST /api/guilds/1/shows/2/entries/number': jsonResponse(200, [entry, big]) });
    await user.click(await screen.findByRole('button', { name: 'Number all accepted entries' }));
    expect(await screen.findByText('Numbered 2 accepted entries.')).toBeInTheDocument();
  });
});
