import { describe, expect, it, vi } from 'vitest';
import { jsonResponse } from '@/testing/test-utils';
import { api, ApiError, isApiError, parseApiError } from './api-client';

describe('api client', () => {
  it('sends JSON with same-origin credentials and returns the parsed body', async () => {
    const fetchMock = vi.fn(async () => jsonResponse(200, { user: { id: 1, email: 'a@b.example', name: 'A' } }));
    vi.stubGlobal('fetch', fetchMock);

    const result = await api.post<{ user: { name: string } }>('/auth/sign-in', { email: 'a@b.example', password: 'x' });

    expect(result.user.name).toBe('A');
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/auth/sign-in');
    expect(init.method).toBe('POST');
    expect(init.credentials).toBe('same-origin');
    expect((init.headers as Record<string, string>)['Content-Type']).toBe('application/json');
    expect(JSON.parse(String(init.body))).toEqual({ email: 'a@b.example', password: 'x' });
  });

  it('returns undefined for 204 No Content', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => new Response(null, { status: 204 })));
    await expect(api.post('/auth/sign-out')).resolves.toBeUndefined();
  });

  it('throws an ApiError with the status and message from the error body', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => jsonResponse(401, { statusCode: 401, message: 'Wrong e-mail or password.' })),
    );
    const error = await api.post('/auth/sign-in', {}).catch((e: unknown) => e);
    expect(isApiError(error)).toBe(true);
    expect(error).toBeInstanceOf(ApiError);
    expect((error as ApiError).status).toBe(401);
    expect((error as ApiError).message).toBe('Wrong e-mail or password.');
    expect((error as ApiError).errors).toEqual({});
  });

  it('keeps the field error map from a validation failure', async () => {
    const error = await parseApiError(
      jsonResponse(400, {
        statusCode: 400,
        message: 'Please check the highlighted fields.',
        errors: { email: ['email must be an email'], password: ['too short', 'too common'] },
      }),
    );
    expect(error.status).toBe(400);
    expect(error.hasFieldErrors).toBe(true);
    expect(error.errors).toEqual({ email: ['email must be an email'], password: ['too short', 'too common'] });
  });

  it('accepts single-string field errors and list messages', async () => {
    const error = await parseApiError(
      jsonResponse(400, { statusCode: 400, message: ['first', 'second'], errors: { name: 'required' } }),
    );
    expect(error.message).toBe('first second');
    expect(error.errors).toEqual({ name: ['required'] });
  });

  it('falls back to a readable message when the body is not JSON', async () => {
    const error = await parseApiError(new Response('<html>Bad gateway</html>', { status: 502 }));
    expect(error.status).toBe(502);
    expect(error.message).toMatch(/something went wrong/i);
    expect(error.errors).toEqual({});
  });

  it('uses a status-specific message for 429 without a body', async () => {
    const error = await parseApiError(new Response(null, { status: 429 }));
    expect(error.message).toMatch(/too many attempts/i);
  });

  it('turns a network failure into an ApiError with status 0', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    const error = await api.get('/meta').catch((e: unknown) => e);
    expect((error as ApiError).status).toBe(0);
    expect((error as ApiError).message).toMatch(/could not reach/i);
  });
});
