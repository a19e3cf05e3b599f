import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { VotingKind } from '@/features/shows/api/types';
import { ballot, guild, show } from '@/features/shows/testing/fixtures';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import ShowVoteRoute from './show-vote';

const CAST = 'POST /api/guilds/1/shows/2/ballot';

function renderBallot(votingKind: VotingKind, { hasVoted = false, cast = jsonResponse(201, { ok: true }) } = {}) {
  const fetchMock = mockFetch({
    'GET /api/guilds/1': jsonResponse(200, guild),
    'GET /api/guilds/1/shows/2': jsonResponse(200, { ...show, votingState: 'open', votingKind }),
    'GET /api/guilds/1/shows/2/ballot': jsonResponse(200, { ...ballot(votingKind), hasVoted }),
    [CAST]: cast,
  });
  const utils = renderWithProviders(<ShowVoteRoute />, { path: '/guilds/:guildId/shows/:showId/vote', route: '/guilds/1/shows/2/vote' });
  return { ...utils, fetchMock };
}

const category = (name: string) => screen.getAllByTestId('ballot-category').find((c) => within(c).queryByText(name, { selector: 'legend, h2, h3' }))!;

describe('Member ballot', () => {
  it('one vote per category: radio cards, a check step, then the ballot is cast', async () => {
    const { user, fetchMock } = renderBallot('per_category');
    expect(await screen.findByText(/Choose your favourite quilt in each category/)).toBeInTheDocument();
    const small = category('Small');
    expect(small).toBe(screen.getByRole('group', { name: 'Small' }));
    expect(within(small).getByRole('radio', { name: /Hedgerow Stars/ })).toHaveAccessibleName(/by Ottilie Brannock/);

    await user.click(screen.getByRole('button', { name: 'Check my ballot' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('Choose at least one quilt first.');

    await user.click(within(small).getByRole('radio', { name: /Hedgerow Stars/ }));
    await user.click(within(small).getByRole('radio', { name: /Kitchen Garden/ }));
    await user.click(within(category('Medium')).getByRole('radio', { name: /Winter Barn/ }));
    await user.click(within(category('Medium')).getByRole('button', { name: 'No vote in Medium' }));
    await user.click(screen.getByRole('button', { name: 'Check my ballot' }));

    const review = await screen.findByTestId('ballot-review');
    expect(within(review).getByRole('heading', { name: 'Check your ballot' })).toHaveFocus();
    expect(review).toHaveTextContent('SmallNo. 2, Kitchen Garden');
    expect(review).toHaveTextContent('MediumNo vote');
    expect(review).toHaveTextContent('You have not voted in 1 category.');
    expect(review).toHaveTextContent('Once you cast your ballot it is final: it cannot be changed.');
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);

    await user.click(screen.getByRole('button', { name: 'Cast my ballot' }));
    expect(await screen.findByTestId('thank-you')).toHaveTextContent('Your vote is in. Thank you.');
    expect(requestBody(fetchMock, CAST)).toEqual({ choices: { categories: { '11': [602], '12': [] } } });
  });

  it('approval: ticks as many as she likes in each category', async () => {
    const { user, fetchMock } = renderBallot('approval');
    expect(await screen.findByText(/tick every quilt you like/)).toBeInTheDocument();
    await user.click(within(category('Small')).getByRole('checkbox', { name: /Kitchen Garden/ }));
    await user.click(within(category('Small')).getByRole('checkbox', { name: /Hedgerow Stars/ }));
    await user.click(within(category('Medium')).getByRole('checkbox', { name: /Orchard Rows/ }));
    await user.click(within(category('Medium')).getByRole('checkbox', { name: /Winter Barn/ }));
    await user.click(within(category('Medium')).getByRole('checkbox', { name: /Orchard Rows/ }));
    await user.click(screen.getByRole('button', { name: 'Check my ballot' }));
    expect(await screen.findByTestId('ballot-review')).toHaveTextContent('SmallNo. 1, Hedgerow Stars; No. 2, Kitchen Garden');
    await user.click(screen.getByRole('button', { name: 'Cast my ballot' }));
    await screen.findByTestId('thank-you');
    expect(requestBody(fetchMock, CAST)).toEqual({ choices: { categories: { '11': [601, 602], '12': [604] } } });
  });

  it('ranked: taps in order give 1st, 2nd and 3rd, a place can be undone, and the order is sent best first', async () => {
    const { user, fetchMock } = renderBallot('ranked');
    expect(await screen.findByText(/Pick your three favourite quilts/)).toBeInTheDocument();
    const card = (name: RegExp) => within(screen.getAllByTestId('ballot-category').find((c) => within(c).queryByText(name))!).getByRole('button', { name });

    expect(screen.getByRole('status')).toHaveTextContent('Tap your favourite quilt first.');
    await user.click(card(/Winter Barn/));
    await user.click(card(/Hedgerow Stars/));
    expect(card(/Winter Barn/)).toHaveAttribute('aria-pressed', 'true');
    expect(card(/Winter Barn/)).toHaveAccessibleName(/^1st choice/);
    expect(card(/Hedgerow Stars/)).toHaveAccessibleName(/^2nd choice/);
    expect(screen.getByRole('status')).toHaveTextContent('Now tap your 3rd choice');

    // Undo the 1st: the 2nd moves up.
    await user.click(card(/Winter Barn/));
    expect(card(/Hedgerow Stars/)).toHaveAccessibleName(/^1st choice/);
    await user.click(card(/Orchard Rows/));
    await user.click(card(/Kitchen Garden/));
    await user.click(card(/Winter Barn/));
    expect(screen.getByRole('status')).toHaveTextContent('You have chosen all 3.');
    expect(screen.getAllByTestId('ranked-place').map((p) => p.textContent)).toEqual([
      expect.stringContaining('1stNo. 1, Hedgerow Stars'),
      expect.stringContaining('2ndNo. 3, Orchard Rows'),
      expect.stringContaining('3rdNo. 2, Kitchen Garden'),
    ]);
    // With every place taken, the other quilts wait until one is removed.
    expect(card(/Winter Barn/)).toBeDisabled();
    await user.click(screen.getByRole('button', { name: /^Remove\s?No. 3, Orchard Rows from 2nd place$/ }));
    await user.click(card(/Winter Barn/));

    await user.click(screen.getByRole('button', { name: 'Check my ballot' }));
    const review = await screen.findByTestId('ballot-review');
    expect(review).toHaveTextContent('1st choiceNo. 1, Hedgerow Stars');
    expect(review).toHaveTextContent('3rd choiceNo. 4, Winter Barn');
    await user.click(screen.getByRole('button', { name: 'Change my choices' }));
    expect(card(/Kitchen Garden/)).toHaveAccessibleName(/^2nd choice/);
    await user.click(screen.getByRole('button', { name: 'Check my ballot' }));
    await user.click(await screen.findByRole('button', { name: 'Cast my ballot' }));
    await screen.findByTestId('thank-you');
    expect(requestBody(fetchMock, CAST)).toEqual({ choices: { ranked: [601, 602, 604] } });
  });

  it('shows a refusal from the server plainly and keeps the ballot', async () => {
    const { user } = renderBallot('per_category', {
      cast: jsonResponse(409, { statusCode: 409, message: 'You have already voted in this show.' }),
    });
    await user.click(within(await waitFor(() => category('Small'))).getByRole('radio', { name: /Kitchen Garden/ }));
    await user.click(screen.getByRole('button', { name: 'Check my ballot' }));
    await user.click(await screen.findByRole('button', { name: 'Cast my ballot' }));
    expect(await screen.findByTestId('cast-error')).toHaveTextContent('You have already voted in this show.');
    expect(screen.queryByTestId('thank-you')).not.toBeInTheDocument();
  });

  it('thanks a member who has already voted instead of showing the ballot', async () => {
    renderBallot('per_category', { hasVoted: true });
    expect(await screen.findByTestId('has-voted')).toHaveTextContent('You have voted — thank you.');
    expect(screen.queryByRole('radio')).not.toBeInTheDocument();
  });
});
