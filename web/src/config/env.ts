// The web app talks to the api on its own origin (Vite proxies /api in development).
export const env = {
  apiBaseUrl: '/api',
  inboxRefreshMs: 4000,
} as const;
