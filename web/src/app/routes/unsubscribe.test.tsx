import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders } from '@/testing/test-utils';
import UnsubscribeRoute from './unsubscribe';

describe('Stop reminder e-mails (from an e-mail link, signed out)', () => {
  it('asks once, then confirms what still comes', async () => {
    const fetchMock = mockFetch({
      'GET /api/unsubscribe?u=5&t=abc': jsonResponse(200, { remindersOff: false }),
      'POST /api/unsubscribe?u=5&t=abc': jsonResponse(200, { remindersOff: true }),
    });
    renderWithProviders(<UnsubscribeRoute />, { path: '/unsubscribe', route: '/unsubscribe?u=5&t=abc' });
    fireEvent.click(await screen.findByRole('button', { name: 'Stop reminder e-mails' }));
    expect(await screen.findByRole('status')).toHaveTextContent('Done: Selvage will send you no more reminders.');
    await waitFor(() => expect(fetchMock.mock.calls.some(([url, init]) => String(url).includes('/api/unsubscribe?u=5&t=abc') && (init as RequestInit)?.method === 'POST')).toBe(true));
  });

  it('says plainly when the link was changed or cut short', async () => {
    mockFetch({ 'GET /api/unsubscribe?u=5&t=bad': jsonResponse(400, { statusCode: 400, message: 'This unsubscribe link is not valid: it may have been cut short or changed.' }) });
    renderWithProviders(<UnsubscribeRoute />, { path: '/unsubscribe', route: '/unsubscribe?u=5&t=bad' });
    expect(await screen.findByText(/This unsubscribe link is not valid/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Sign in to choose your e-mails' })).toBeInTheDocument();
  });
});
