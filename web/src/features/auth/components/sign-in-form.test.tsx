import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import { SignInForm } from './sign-in-form';

function renderForm() {
  const onSuccess = vi.fn();
  const utils = renderWithProviders(<SignInForm onSuccess={onSuccess} />);
  return { ...utils, onSuccess };
}

describe('SignInForm', () => {
  it('shows validation messages and does not call the api when fields are empty or invalid', async () => {
    const fetchMock = mockFetch({});
    const { user } = renderForm();

    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter your e-mail address.')).toBeInTheDocument();
    expect(screen.getByText('Enter your password.')).toBeInTheDocument();
    const email = screen.getByLabelText('E-mail address');
    expect(email).toHaveAttribute('aria-invalid', 'true');
    expect(email).toHaveAccessibleDescription('Enter your e-mail address.');

    await user.type(email, 'not-an-address');
    await user.tab();
    expect(await screen.findByText('Enter an e-mail address like name@example.com.')).toBeInTheDocument();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('signs in with the remember flag and reports the user', async () => {
    const user1 = { id: 1, email: 'hazel@wrenfield.example', name: 'Hazel Ormsby' };
    const fetchMock = mockFetch({ 'POST /api/auth/sign-in': jsonResponse(200, { user: user1 }) });
    const { user, onSuccess } = renderForm();

    await user.type(screen.getByLabelText('E-mail address'), ' hazel@wrenfield.example ');
    await user.type(screen.getByLabelText('Password'), 'quilting-bee-42');
    await user.click(screen.getByLabelText('Keep me signed in on this device'));
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(onSuccess).toHaveBeenCalledWith(user1));
    expect(requestBody(fetchMock, 'POST /api/auth/sign-in')).toEqual({
      email: 'hazel@wrenfield.example',
      password: 'quilting-bee-42',
      remember: true,
    });
  });

  it('shows the server message on 401', async () => {
    mockFetch({
      'POST /api/auth/sign-in': jsonResponse(401, { statusCode: 401, message: 'That e-mail and password do not match.' }),
    });
    const { user, onSuccess } = renderForm();

    await user.type(screen.getByLabelText('E-mail address'), 'hazel@wrenfield.example');
    await user.type(screen.getByLabelText('Password'), 'wrong password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('That e-mail and password do not match.');
    expect(screen.getByLabelText('Password')).toHaveValue('');
    expect(onSuccess).not.toHaveBeenCalled();
  });

  it('shows the server message on 429', async () => {
    mockFetch({
      'POST /api/auth/sign-in': jsonResponse(429, { statusCode: 429, message: 'Too many attempts. Try again in 10 minutes.' }),
    });
    const { user } = renderForm();

    await user.type(screen.getByLabelText('E-mail address'), 'hazel@wrenfield.example');
    await user.type(screen.getByLabelText('Password'), 'quilting-bee-42');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('Too many attempts. Try again in 10 minutes.');
  });

  it('puts server field errors under the matching fields', async () => {
    mockFetch({
      'POST /api/auth/sign-in': jsonResponse(400, {
        statusCode: 400,
        message: 'Please check the highlighted fields.',
        errors: { email: ['This address cannot be used to sign in.'] },
      }),
    });
    const { user } = renderForm();

    await user.type(screen.getByLabelText('E-mail address'), 'hazel@wrenfield.example');
    await user.type(screen.getByLabelText('Password'), 'quilting-bee-42');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    const email = screen.getByLabelText('E-mail address');
    await waitFor(() => expect(email).toHaveAccessibleDescription('This address cannot be used to sign in.'));
    expect(email).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('alert')).toHaveTextContent('Please check the highlighted fields.');
    await waitFor(() => expect(email).toHaveFocus());
  });
});
