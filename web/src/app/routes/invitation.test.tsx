import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders } from '@/testing/test-utils';
import InvitationRoute from './invitation';

const invitation = {
  guildName: 'Wrenfield Quilt Guild',
  email: 'newbie@wrenfield.example',
  invitedByName: 'Hazel Ormsby',
  expiresAt: '2099-01-15T12:00:00.000Z',
};

function renderAt(token: string) {
  return renderWithProviders(<InvitationRoute />, {
    path: '/invitations/:token',
    route: `/invitations/${token}`,
    routes: [
      { path: '/', element: <h1>Dashboard page</h1> },
      { path: '/sign-in', element: <h1>Sign-in page</h1> },
    ],
  });
}

describe('invitation page', () => {
  it('lets a new person create an account and lands on the dashboard', async () => {
    mockFetch({
      'GET /api/invitations/abc': jsonResponse(200, { ...invitation, hasAccount: false }),
      'POST /api/invitations/abc/accept': jsonResponse(201, {
        user: { id: 7, email: invitation.email, name: 'Mabel Quince' },
      }),
    });
    const { user } = renderAt('abc');

    expect(
      await screen.findByRole('heading', { name: 'Hazel Ormsby invited you to join Wrenfield Quilt Guild' }),
    ).toBeInTheDocument();
    await user.type(screen.getByLabelText('Your name'), 'Mabel Quince');
    await user.type(screen.getByLabelText('Choose a password'), 'log cabin blocks');
    await user.type(screen.getByLabelText('Password again'), 'log cabin blocks');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));

    expect(await screen.findByRole('heading', { name: 'Dashboard page' })).toBeInTheDocument();
  });

  it('asks someone with an account to sign in first, with a way back', async () => {
    mockFetch({
      'GET /api/invitations/def': jsonResponse(200, { ...invitation, hasAccount: true }),
      'GET /api/auth/me': jsonResponse(200, { user: null }),
    });
    renderAt('def');

    const link = await screen.findByRole('link', { name: 'Sign in to accept' });
    expect(link).toHaveAttribute('href', '/sign-in?redirectTo=%2Finvitations%2Fdef');
    expect(screen.queryByRole('button', { name: 'Accept and join' })).not.toBeInTheDocument();
  });

  it('offers "Accept and join" when signed in as the invited e-mail', async () => {
    mockFetch({
      'GET /api/invitations/ghi': jsonResponse(200, { ...invitation, hasAccount: true }),
      'GET /api/auth/me': jsonResponse(200, { user: { id: 3, email: invitation.email, name: 'Mabel' } }),
      'POST /api/invitations/ghi/accept': jsonResponse(200, {}),
    });
    const { user } = renderAt('ghi');

    await user.click(await screen.findByRole('button', { name: 'Accept and join' }));
    expect(await screen.findByRole('heading', { name: 'Dashboard page' })).toBeInTheDocument();
  });

  it('explains an unknown or expired link', async () => {
    mockFetch({
      'GET /api/invitations/old': jsonResponse(404, { statusCode: 404, message: 'Invitation not found' }),
    });
    renderAt('old');

    expect(await screen.findByRole('heading', { name: 'This invitation cannot be used' })).toBeInTheDocument();
    expect(screen.getByText(/may have expired/)).toBeInTheDocument();
  });
});
