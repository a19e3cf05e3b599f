import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { entry, guild, show } from '@/features/shows/testing/fixtures';
import { jsonResponse, mockFetch, renderWithProviders } from '@/testing/test-utils';
import ShowRoute from './show-home';

function renderShow(overrides: Partial<typeof show> = {}, extra: Parameters<typeof mockFetch>[0] = {}) {
  const fetchMock = mockFetch({
    'GET /api/guilds/1': jsonResponse(200, guild),
    'GET /api/guilds/1/shows/2': jsonResponse(200, { ...show, ...overrides }),
    'GET /api/guilds/1/shows/2/entries/mine': jsonResponse(200, [
      entry,
      { ...entry, id: 502, title: 'Orchard Rows', status: 'declined', declineReason: 'Shown here last year.' },
      { ...entry, id: 503, title: 'Winter Barn', status: 'accepted', entryNumber: 14 },
    ]),
    ...extra,
  });
  const utils = renderWithProviders(<ShowRoute />, { path: '/guilds/:guildId/shows/:showId', route: '/guilds/1/shows/2' });
  return { ...utils, fetchMock };
}

describe('Show page', () => {
  it('shows the show, the sleeve rule, the categories and her entries with their status and sleeve strips', async () => {
    renderShow();
    expect(await screen.findByRole('heading', { level: 1, name: 'Harvest Quilt Show' })).toBeInTheDocument();
    expect(screen.getByTestId('show-facts')).toHaveTextContent('Entry fee$10.00 a quilt, at most $25.00 for all your quilts');
    expect(screen.getByTestId('sleeve-note')).toHaveTextContent('Sew a hanging sleeve on your quilt');
    expect(screen.getByRole('link', { name: 'Enter a quilt' })).toHaveAttribute('href', '/guilds/1/shows/2/enter');
    expect(screen.getAllByTestId('category-item')[2]).toHaveTextContent('Group quiltsExhibit only');
    expect(screen.queryByRole('navigation', { name: 'Show chair pages' })).not.toBeInTheDocument();

    const cards = await screen.findAllByTestId('my-entry');
    expect(within(cards[0]).getByTestId('entry-status')).toHaveTextContent('Sent, waiting for the show chair');
    expect(within(cards[0]).getByTestId('sleeve-strip')).toHaveTextContent('Your sleeve: A 4 in sleeve: cut a strip 8 1/2 in x 59 in.');
    expect(within(cards[0]).getByRole('link', { name: /^Change the details/ })).toHaveAttribute('href', '/guilds/1/shows/2/entries/501/edit');
    expect(within(cards[0]).getByRole('button', { name: /^Withdraw/ })).toBeInTheDocument();
    expect(within(cards[1]).getByTestId('entry-status')).toHaveTextContent('Declined');
    expect(cards[1]).toHaveTextContent('Why: Shown here last year.');
    expect(within(cards[1]).queryByRole('button', { name: /^Withdraw/ })).not.toBeInTheDocument();
    expect(cards[2]).toHaveTextContent('Entry number14');
    expect(within(cards[2]).getByLabelText('Add a photo of your quilt')).toBeInTheDocument();
  });

  it('invites her to vote while voting is open, and thanks her once she has', async () => {
    renderShow({ votingState: 'open' }, { 'GET /api/guilds/1/shows/2/ballot': jsonResponse(200, { hasVoted: false, show: {}, categories: [] }) });
    expect(await screen.findByRole('link', { name: 'Vote for viewer’s choice' })).toHaveAttribute('href', '/guilds/1/shows/2/vote');
  });

  it('says she has voted', async () => {
    renderShow(
      { votingState: 'open', resultsPublished: false },
      { 'GET /api/guilds/1/shows/2/ballot': jsonResponse(200, { hasVoted: true, show: {}, categories: [] }) },
    );
    expect(await screen.findByTestId('has-voted')).toHaveTextContent('You have voted — thank you.');
    expect(screen.queryByRole('link', { name: 'Vote for viewer’s choice' })).not.toBeInTheDocument();
  });

  it('links to published results', async () => {
    renderShow({ votingState: 'closed', resultsPublished: true, entryWindow: 'closed' });
    expect(await screen.findByRole('link', { name: 'See the results' })).toHaveAttribute('href', '/guilds/1/shows/2/results');
    expect(screen.getByText('Entries are closed.')).toBeInTheDocument();
    expect(screen.queryByText(/voting has opened/)).not.toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Enter a quilt' })).not.toBeInTheDocument();
  });

  it('says entries are closed because voting has opened only while voting is open', async () => {
    renderShow(
      { votingState: 'open', entryWindow: 'closed' },
      { 'GET /api/guilds/1/shows/2/ballot': jsonResponse(200, { hasVoted: false, show: {}, categories: [] }) },
    );
    expect(await screen.findByText('Entries are closed: voting has opened.')).toBeInTheDocument();
  });

  it('says entries are closed, and nothing of voting opening, once voting has closed', async () => {
    renderShow({ votingState: 'closed', resultsPublished: false, entryWindow: 'closed' });
    expect(await screen.findByText('Entries are closed.')).toBeInTheDocument();
    expect(screen.queryByText(/voting has opened/)).not.toBeInTheDocument();
  });

  it('leaves out "Quilted by" when it was left blank', async () => {
    renderShow(
      {},
      {
        'GET /api/guilds/1/shows/2/entries/mine': jsonResponse(200, [
          { ...entry, quilter: '' },
          { ...entry, id: 502, title: 'Orchard Rows', quilter: 'Ada Pennock' },
        ]),
      },
    );
    const cards = await screen.findAllByTestId('my-entry');
    expect(within(cards[0]).queryByText('Quilted by')).not.toBeInTheDocument();
    expect(within(cards[1]).getByText('Quilted by')).toBeInTheDocument();
    expect(cards[1]).toHaveTextContent('Quilted byAda Pennock');
  });

  it('uploads a photo she chose, after showing it', async () => {
    const UPLOAD = 'POST /api/guilds/1/shows/2/entries/503/photo';
    const { user, fetchMock } = renderShow(
      {},
      {
        [UPLOAD]: jsonResponse(400, { statusCode: 400, message: 'Please check the form.', errors: { photo: ['That photo is too dark to show.'] } }),
      },
    );
    const card = (await screen.findAllByTestId('my-entry'))[2];
    const input = within(card).getByLabelText('Add a photo of your quilt');
    // The picker offers only JPEG and PNG; a file dropped in some other way is still checked.
    fireEvent.change(input, { target: { files: [new File(['%PDF'], 'notes.pdf', { type: 'application/pdf' })] } });
    expect(within(card).getByText('That file is not a JPEG or PNG photo. Choose a JPEG or PNG picture.')).toBeInTheDocument();

    fireEvent.change(input, { target: { files: [new File(['jpeg bytes'], 'winter-barn.jpg', { type: 'image/jpeg' })] } });
    expect(within(card).queryByText(/not a JPEG or PNG/)).not.toBeInTheDocument();
    await user.click(within(card).getByRole('button', { name: 'Upload the photo' }));
    expect(await within(card).findByText('That photo is too dark to show.')).toBeInTheDocument();
    await waitFor(() => expect(fetchMock.mock.calls.some(([url]) => String(url).endsWith('/entries/503/photo'))).toBe(true));
    const call = fetchMock.mock.calls.find(([url]) => String(url).endsWith('/entries/503/photo'));
    const form = call?.[1]?.body as FormData;
    expect((form.get('photo') as File).name).toBe('winter-barn.jpg');
  });

  it('shows what she owes in entry fees and starts a card payment for it', async () => {
    const { fetchMock } = renderShow(
      { entryFeeCents: 1000 },
      {
        'GET /api/guilds/1/shows/2/fees/mine': jsonResponse(200, {
          feeText: '$10.00 per quilt, at most $25.00 per member',
          currency: 'USD',
          quilts: 2,
          owedCents: 2000,
          paidCents: 1000,
          dueCents: 1000,
          canPayOnline: true,
          openInvoiceId: null,
          payments: [{ invoiceId: 9, receiptNumber: '2026-0004', amountCents: 1000, refundedCents: 0, paidOn: '2026-11-20' }],
        }),
        'POST /api/guilds/1/shows/2/fees/checkout': jsonResponse(201, { invoiceId: 10, url: 'about:blank#pay' }),
      },
    );
    const panel = await screen.findByTestId('entry-fees');
    expect(panel).toHaveTextContent('For your 2 quilts: $20.00; paid $10.00.');
    expect(panel).toHaveTextContent('Still to pay: $10.00');
    expect(panel).toHaveTextContent('$10.00 paid, receipt 2026-0004');
    fireEvent.click(within(panel).getByRole('button', { name: 'Pay $10.00 by card' }));
    await waitFor(() => expect(fetchMock.mock.calls.some(([url, init]) => String(url).endsWith('/fees/checkout') && (init as RequestInit)?.method === 'POST')).toBe(true));
  });
});

