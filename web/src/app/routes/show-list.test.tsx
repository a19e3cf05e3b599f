import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { guild, show } from '@/features/shows/testing/fixtures';
import { jsonResponse, mockFetch, renderWithProviders } from '@/testing/test-utils';
import ShowListRoute from './show-list';

function renderList(roles: string[]) {
  mockFetch({
    'GET /api/guilds/1': jsonResponse(200, { ...guild, myRoles: roles }),
    'GET /api/guilds/1/shows': jsonResponse(200, [show, { ...show, id: 3, name: 'Spring Mini Show', entryWindow: 'closed', votingState: 'closed', resultsPublished: true }]),
  });
  renderWithProviders(<ShowListRoute />, { path: '/guilds/:guildId/shows', route: '/guilds/1/shows' });
}

describe('Show list', () => {
  it('shows each show with its dates and where entries and voting stand', async () => {
    renderList([]);
    const cards = await screen.findAllByTestId('show-card');
    expect(cards[0]).toHaveTextContent('Harvest Quilt Show');
    expect(cards[0]).toHaveTextContent(/Friday,? 2 October 2026 to Sunday,? 4 October 2026/);
    expect(cards[0]).toHaveTextContent('Entries open');
    expect(cards[0]).toHaveTextContent('Voting not open');
    expect(cards[1]).toHaveTextContent('Results published');
    expect(screen.getByRole('link', { name: 'Harvest Quilt Show' })).toHaveAttribute('href', '/guilds/1/shows/2');
    expect(screen.queryByRole('link', { name: 'New show' })).not.toBeInTheDocument();
  });

  it('offers the show chair a new show', async () => {
    renderList(['show_chair']);
    expect(await screen.findByRole('link', { name: 'New show' })).toHaveAttribute('href', '/guilds/1/shows/new');
  });
});
