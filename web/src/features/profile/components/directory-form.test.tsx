import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import { DirectoryForm } from './directory-form';

describe('DirectoryForm', () => {
  it('sends her details and choices, empty fields as null', async () => {
    const fetchMock = mockFetch({
      'GET /api/profile/directory': jsonResponse(200, { phone: null, town: null, showEmail: false, showPhone: false, showTown: false }),
      'PUT /api/profile/directory': jsonResponse(200, { phone: '+1 555 0142', town: null, showEmail: false, showPhone: true, showTown: false }),
    });
    renderWithProviders(<DirectoryForm />);
    fireEvent.change(await screen.findByRole('textbox', { name: /^Phone number/ }), { target: { value: '+1 555 0142' } });
    fireEvent.click(screen.getByRole('checkbox', { name: 'My phone number' }));
    fireEvent.click(screen.getByRole('button', { name: 'Save my choices' }));
    await waitFor(() => expect(requestBody(fetchMock, 'PUT /api/profile/directory')).toEqual({ phone: '+1 555 0142', town: null, showEmail: false, showPhone: true, showTown: false }));
  });

  it('refuses a phone number that is not one before sending', async () => {
    const fetchMock = mockFetch({ 'GET /api/profile/directory': jsonResponse(200, { phone: null, town: null, showEmail: false, showPhone: false, showTown: false }) });
    renderWithProviders(<DirectoryForm />);
    fireEvent.change(await screen.findByRole('textbox', { name: /^Phone number/ }), { target: { value: 'call me maybe' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save my choices' }));
    expect(await screen.findByText(/Write a phone number with digits/)).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([, init]) => (init as RequestInit | undefined)?.method === 'PUT')).toBe(false);
  });
});
