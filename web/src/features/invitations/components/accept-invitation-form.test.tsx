import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { userQueryOptions } from '@/lib/auth';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import { AcceptInvitationForm } from './accept-invitation-form';

const ACCEPT = 'POST /api/invitations/tok-9/accept';

function renderForm() {
  const onAccepted = vi.fn();
  const utils = renderWithProviders(
    <AcceptInvitationForm token="tok-9" email="newbie@wrenfield.example" onAccepted={onAccepted} />,
  );
  return { ...utils, onAccepted };
}

describe('AcceptInvitationForm', () => {
  it('requires a name and matching passwords', async () => {
    const fetchMock = mockFetch({});
    const { user } = renderForm();

    await user.type(screen.getByLabelText('Choose a password'), 'log cabin blocks');
    await user.type(screen.getByLabelText('Password again'), 'log cabin block');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));

    expect(await screen.findByText('Enter your name.')).toBeInTheDocument();
    expect(screen.getByText('The two passwords do not match.')).toBeInTheDocument();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('creates the account, stores the signed-in user and reports success', async () => {
    const newUser = { id: 42, email: 'newbie@wrenfield.example', name: 'Mabel Quince' };
    const fetchMock = mockFetch({ [ACCEPT]: jsonResponse(201, { user: newUser }) });
    const { user, onAccepted, queryClient } = renderForm();

    expect(screen.getByText('newbie@wrenfield.example')).toBeInTheDocument();
    await user.type(screen.getByLabelText('Your name'), '  Mabel Quince ');
    await user.type(screen.getByLabelText('Choose a password'), 'log cabin blocks');
    await user.type(screen.getByLabelText('Password again'), 'log cabin blocks');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));

    await waitFor(() => expect(onAccepted).toHaveBeenCalled());
    expect(requestBody(fetchMock, ACCEPT)).toEqual({ name: 'Mabel Quince', password: 'log cabin blocks' });
    expect(queryClient.getQueryData(userQueryOptions().queryKey)).toEqual(newUser);
  });

  it('shows server field errors inline and the message in an alert', async () => {
    mockFetch({
      [ACCEPT]: jsonResponse(400, {
        statusCode: 400,
        message: 'Please check the highlighted fields.',
        errors: { password: ['This password is on a list of common passwords.'] },
      }),
    });
    const { user, onAccepted } = renderForm();

    await user.type(screen.getByLabelText('Your name'), 'Mabel Quince');
    await user.type(screen.getByLabelText('Choose a password'), 'password1234');
    await user.type(screen.getByLabelText('Password again'), 'password1234');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));

    expect(await screen.findByText('This password is on a list of common passwords.')).toBeInTheDocument();
    expect(screen.getByLabelText('Choose a password')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('alert')).toHaveTextContent('Please check the highlighted fields.');
    expect(onAccepted).not.toHaveBeenCalled();
  });
});
