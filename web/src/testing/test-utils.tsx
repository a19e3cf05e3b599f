import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { ReactElement } from 'react';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { vi } from 'vitest';

export function createTestQueryClient() {
  return new QueryClient({
    defaultOptions: { queries: { retry: false, gcTime: Infinity }, mutations: { retry: false } },
  });
}

type RenderOptions = {
  /** The URL to start at. */
  route?: string;
  /** The route pattern the element is mounted on. */
  path?: string;
  /** Other routes, e.g. where a successful form navigates to. */
  routes?: RouteObject[];
};

export function renderWithProviders(ui: ReactElement, { route = '/', path = '/', routes = [] }: RenderOptions = {}) {
  const queryClient = createTestQueryClient();
  const router = createMemoryRouter([{ path, element: ui }, ...routes], { initialEntries: [route] });
  const user = userEvent.setup();
  const result = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...result, queryClient, router, user };
}

export function jsonResponse(status: number, body?: unknown): Response {
  return new Response(body === undefined ? null : JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  });
}

type Handler = (url: string, init: RequestInit | undefined) => Response | Promise<Response>;

/** Stubs global fetch; `routes` maps "METHOD /api/path" to a handler or a ready response. */
export function mockFetch(routes: Record<string, Handler | Response>) {
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
    const method = (init?.method ?? 'GET').toUpperCase();
    const key = `${method} ${url}`;
    const handler = routes[key];
    if (!handler) return jsonResponse(404, { statusCode: 404, message: `No mock for ${key}` });
    return typeof handler === 'function' ? handler(url, init) : handler.clone();
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

export function requestBody(fetchMock: ReturnType<typeof mockFetch>, key: string): unknown {
  const call = fetchMock.mock.calls.find(([url, init]) => `${(init?.method ?? 'GET').toUpperCase()} ${String(url)}` === key);
  return call?.[1]?.body ? JSON.parse(String(call[1].body)) : undefined;
}
