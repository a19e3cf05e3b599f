import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import { ResetPasswordForm } from './reset-password-form';

describe('ResetPasswordForm', () => {
  it('refuses passwords that do not match, without calling the api', async () => {
    const fetchMock = mockFetch({});
    const onDone = vi.fn();
    const { user } = renderWithProviders(<ResetPasswordForm token="tok-1" onDone={onDone} />);

    await user.type(screen.getByLabelText('New password'), 'a long enough password');
    await user.type(screen.getByLabelText('New password again'), 'a different password');
    await user.click(screen.getByRole('button', { name: 'Save new password' }));

    expect(await screen.findByText('The two passwords do not match.')).toBeInTheDocument();
    expect(screen.getByLabelText('New password again')).toHaveAttribute('aria-invalid', 'true');
    expect(fetchMock).not.toHaveBeenCalled();
    expect(onDone).not.toHaveBeenCalled();
  });

  it('asks for at least 10 characters', async () => {
    mockFetch({});
    const { user } = renderWithProviders(<ResetPasswordForm token="tok-1" onDone={vi.fn()} />);

    await user.type(screen.getByLabelText('New password'), 'short');
    await user.type(screen.getByLabelText('New password again'), 'short');
    await user.click(screen.getByRole('button', { name: 'Save new password' }));

    expect(await screen.findByText('Use at least 10 characters.')).toBeInTheDocument();
  });

  it('sends the token and new password, then reports done', async () => {
    const fetchMock = mockFetch({ 'POST /api/auth/reset-password': jsonResponse(200, {}) });
    const onDone = vi.fn();
    const { user } = renderWithProviders(<ResetPasswordForm token="tok-1" onDone={onDone} />);

    await user.type(screen.getByLabelText('New password'), 'patchwork-and-tea');
    await user.type(screen.getByLabelText('New password again'), 'patchwork-and-tea');
    await user.click(screen.getByRole('button', { name: 'Save new password' }));

    await waitFor(() => expect(onDone).toHaveBeenCalled());
    expect(requestBody(fetchMock, 'POST /api/auth/reset-password')).toEqual({
      token: 'tok-1',
      password: 'patchwork-and-tea',
    });
  });

  it('shows the server message for a used or expired token', async () => {
    mockFetch({
      'POST /api/auth/reset-password': jsonResponse(400, {
        statusCode: 400,
        message: 'This reset link has expired or was already used.',
      }),
    });
    const { user } = renderWithProviders(<ResetPasswordForm token="old" onDone={vi.fn()} />);

    await user.type(screen.getByLabelText('New password'), 'patchwork-and-tea');
    await user.type(screen.getByLabelText('New password again'), 'patchwork-and-tea');
    await user.click(screen.getByRole('button', { name: 'Save new password' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('This reset link has expired or was already used.');
  });
});
