import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ballot } from '@/features/shows/testing/fixtures';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import VoteRoute from './vote';
import VoteBallotRoute from './vote-ballot';

const GET = 'GET /api/public/ballots/K7QM3XHD9PRW';
const CAST = 'POST /api/public/ballots/K7QM3XHD9PRW';

function renderVisitorBallot(routes: Parameters<typeof mockFetch>[0], route = '/vote/k7qm-3xhd-9prw') {
  const fetchMock = mockFetch(routes);
  const utils = renderWithProviders(<VoteBallotRoute />, {
    path: '/vote/:code',
    route,
    routes: [{ path: '/vote', element: <p>Type your code</p> }],
  });
  return { ...utils, fetchMock };
}

describe('Visitor voting', () => {
  it('turns what she types into the code in the address', async () => {
    mockFetch({});
    const { user, router } = renderWithProviders(<VoteRoute />, {
      path: '/vote',
      route: '/vote',
      routes: [{ path: '/vote/:code', element: <p>Ballot</p> }],
    });
    await user.click(screen.getByRole('button', { name: 'Open my ballot' }));
    expect(screen.getByLabelText('Type the code from your ballot card')).toHaveAccessibleDescription(/Type the code printed on your ballot card/);
    await user.type(screen.getByLabelText('Type the code from your ballot card'), ' k7qm 3xhd-9prw ');
    await user.click(screen.getByRole('button', { name: 'Open my ballot' }));
    expect(router.state.location.pathname).toBe('/vote/K7QM3XHD9PRW');
  });

  it('says plainly when a code was already used, with a way to try another', async () => {
    const { fetchMock } = renderVisitorBallot({
      [GET]: jsonResponse(409, { statusCode: 409, message: 'This ballot card has already been used. Each card votes once.' }),
    });
    expect(await screen.findByRole('heading', { name: 'We could not open this ballot' })).toBeInTheDocument();
    expect(screen.getByTestId('ballot-problem')).toHaveTextContent('This ballot card has already been used. Each card votes once.');
    expect(screen.getByRole('link', { name: 'Try another code' })).toHaveAttribute('href', '/vote?code=K7QM-3XHD-9PRW');
    // A refusal is not asked again.
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });

  it('says so for an unknown code', async () => {
    renderVisitorBallot({ [GET]: jsonResponse(404, { statusCode: 404, message: 'We do not know that code. Check it against your card.' }) });
    expect(await screen.findByTestId('ballot-problem')).toHaveTextContent('We do not know that code. Check it against your card.');
  });

  it('shows the show and guild, takes her vote and thanks her', async () => {
    const { user, fetchMock } = renderVisitorBallot({
      [GET]: jsonResponse(200, ballot('per_category', { code: 'K7QM-3XHD-9PRW' })),
      [CAST]: jsonResponse(201, { ok: true }),
    });
    expect(await screen.findByRole('heading', { level: 1, name: 'Harvest Quilt Show' })).toBeInTheDocument();
    expect(screen.getByText(/Wrenfield Quilt Guild/)).toBeInTheDocument();
    expect(screen.getByText('Ballot card K7QM-3XHD-9PRW')).toBeInTheDocument();
    await user.click(screen.getByRole('radio', { name: /Orchard Rows/ }));
    await user.click(screen.getByRole('button', { name: 'Check my ballot' }));
    await user.click(await screen.findByRole('button', { name: 'Cast my ballot' }));
    expect(await screen.findByTestId('thank-you')).toHaveTextContent('Your vote is in. Thank you for visiting Harvest Quilt Show.');
    expect(requestBody(fetchMock, CAST)).toEqual({ choices: { categories: { '11': [], '12': [603] } } });
  });

  it('shows a 409 on casting plainly, with a way to try another code', async () => {
    const { user } = renderVisitorBallot({
      [GET]: jsonResponse(200, ballot('approval')),
      [CAST]: jsonResponse(409, { statusCode: 409, message: 'Voting has closed. Thank you for coming.' }),
    });
    await user.click(await screen.findByRole('checkbox', { name: /Hedgerow Stars/ }));
    await user.click(screen.getByRole('button', { name: 'Check my ballot' }));
    await user.click(await screen.findByRole('button', { name: 'Cast my ballot' }));
    const problem = await screen.findByTestId('cast-error');
    expect(problem).toHaveTextContent('Voting has closed. Thank you for coming.');
    expect(within(problem).getByRole('link', { name: 'Try another code' })).toHaveAttribute('href', '/vote?code=K7QM-3XHD-9PRW');
    await waitFor(() => expect(screen.getByRole('button', { name: 'Cast my ballot' })).toBeEnabled());
  });

  it('says how long a ballot code is before sending a short one', async () => {
    mockFetch({});
    const { user, router } = renderWithProviders(<VoteRoute />, {
      path: '/vote',
      route: '/vote',
      routes: [{ path: '/vote/:code', element: <p>Ballot</p> }],
    });
    const box = screen.getByLabelText('Type the code from your ballot card');
    await user.type(box, 'xtxn-ggwb');
    await user.click(screen.getByRole('button', { name: 'Open my ballot' }));
    expect(box).toHaveAccessibleDescription(/That is 8 letters and digits; a ballot code has 12, like K7QM-3XHD-9PRW\./);
    expect(box).toHaveFocus();
    expect(router.state.location.pathname).toBe('/vote');
  });

  it('shows the code she typed when it is refused, and brings it back in the box to mend', async () => {
    mockFetch({
      'GET /api/public/ballots/XTXNGGWB9PRW': jsonResponse(404, { statusCode: 404, message: 'We do not know that code. Check it against your card.' }),
    });
    const { user } = renderWithProviders(<VoteBallotRoute />, {
      path: '/vote/:code',
      route: '/vote/XTXNGGWB9PRW',
      routes: [{ path: '/vote', element: <VoteRoute /> }],
    });
    expect(await screen.findByTestId('typed-code')).toHaveTextContent('You typed XTXN-GGWB-9PRW.');
    await user.click(screen.getByRole('link', { name: 'Try another code' }));
    const box = await screen.findByLabelText('Type the code from your ballot card');
    expect(box).toHaveValue('XTXN-GGWB-9PRW');
    await waitFor(() => expect(box).toHaveFocus());
  });
});
