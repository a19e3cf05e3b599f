import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders } from '@/testing/test-utils';
import GuildNewRoute from './guild-new';

const next = () => fireEvent.click(screen.getByRole('button', { name: 'Next' }));

describe('Start a new guild', () => {
  it('walks through three steps, keeps what she typed on Back, and sends the guild', async () => {
    const fetchMock = mockFetch({
      'POST /api/guilds': jsonResponse(201, { id: 7, name: 'Fernhollow Quilters', town: 'Fernhollow', timeZone: 'Europe/London', currency: 'GBP', unit: 'cm', yearStartMonth: 9, myRoles: ['admin'], myMembershipId: 70 }),
    });
    renderWithProviders(<GuildNewRoute />, { path: '/guilds/new', route: '/guilds/new', routes: [{ path: '/guilds/:guildId/members', element: <p>Members of guild 7</p> }] });
    expect(screen.getByTestId('wizard-step')).toHaveTextContent('Step 1 of 3');
    next();
    expect(await screen.findByText("Write the guild's name.")).toBeInTheDocument();
    fireEvent.change(screen.getByLabelText('Name of the guild'), { target: { value: 'Fernhollow Quilters' } });
    fireEvent.change(screen.getByLabelText('Town where you meet'), { target: { value: 'Fernhollow' } });
    next();
    await waitFor(() => expect(screen.getByTestId('wizard-step')).toHaveTextContent('Step 2 of 3'));
    fireEvent.change(screen.getByLabelText('Time zone'), { target: { value: 'Europe/London' } });
    fireEvent.change(screen.getByLabelText('Currency for dues and fees'), { target: { value: 'GBP' } });
    fireEvent.click(screen.getByLabelText('Centimetres'));
    fireEvent.click(screen.getByRole('button', { name: 'Back' }));
    await waitFor(() => expect(screen.getByLabelText('Name of the guild')).toHaveValue('Fernhollow Quilters'));
    next();
    await waitFor(() => expect(screen.getByLabelText('Time zone')).toHaveValue('Europe/London'));
    next();
    await waitFor(() => expect(screen.getByTestId('wizard-step')).toHaveTextContent('Step 3 of 3'));
    fireEvent.change(screen.getByLabelText('The membership year starts in'), { target: { value: '9' } });
    expect(screen.getByTestId('wizard-summary')).toHaveTextContent('Fernhollow Quilters, Fernhollow');
    fireEvent.click(screen.getByRole('button', { name: 'Start the guild' }));
    await waitFor(() => expect(fetchMock.mock.calls.some(([url]) => String(url).endsWith('/api/guilds'))).toBe(true));
    const [, init] = fetchMock.mock.calls.find(([url]) => String(url).endsWith('/api/guilds'))!;
    expect(JSON.parse(String((init as RequestInit).body))).toEqual({ name: 'Fernhollow Quilters', town: 'Fernhollow', timeZone: 'Europe/London', currency: 'GBP', unit: 'cm', yearStartMonth: 9 });
    // Then on to the new guild's member directory, to invite people.
    expect(await screen.findByText('Members of guild 7')).toBeInTheDocument();
  });

  it('takes her back to the step with the field the server refused', async () => {
    mockFetch({
      'POST /api/guilds': jsonResponse(400, { statusCode: 400, message: 'Please check the highlighted fields.', errors: { name: ['Use at most 120 characters.'] } }),
    });
    renderWithProviders(<GuildNewRoute />, { path: '/guilds/new', route: '/guilds/new' });
    fireEvent.change(screen.getByLabelText('Name of the guild'), { target: { value: 'Fernhollow Quilters' } });
    fireEvent.change(screen.getByLabelText('Town where you meet'), { target: { value: 'Fernhollow' } });
    next();
    await screen.findByLabelText('Time zone');
    next();
    await screen.findByLabelText('The membership year starts in');
    fireEvent.click(screen.getByRole('button', { name: 'Start the guild' }));
    await waitFor(() => expect(screen.getByTestId('wizard-step')).toHaveTextContent('Step 1 of 3'));
    expect(await screen.findByText('Use at most 120 characters.')).toBeInTheDocument();
  });
});
