function withRedirect(path: string, redirectTo?: string | null): string {
  return redirectTo ? `${path}?redirectTo=${encodeURIComponent(redirectTo)}` : path;
}

export const TREASURER_SECTIONS = ['ledger', 'roster', 'record', 'report', 'settings', 'audit'] as const;
export type TreasurerSection = (typeof TREASURER_SECTIONS)[number];

export const paths = {
  home: {
    path: '/',
    getHref: () => '/',
  },
  signIn: {
    path: '/sign-in',
    getHref: (redirectTo?: string | null) => withRedirect('/sign-in', redirectTo),
  },
  forgotPassword: {
    path: '/forgot-password',
    getHref: () => '/forgot-password',
  },
  resetPassword: {
    path: '/reset-password',
    getHref: (token?: string) => (token ? `/reset-password?token=${encodeURIComponent(token)}` : '/reset-password'),
  },
  invitation: {
    path: '/invitations/:token',
    getHref: (token: string) => `/invitations/${encodeURIComponent(token)}`,
  },
  unsubscribe: {
    path: '/unsubscribe',
    getHref: () => '/unsubscribe',
  },
  newGuild: {
    path: '/guilds/new',
    getHref: () => '/guilds/new',
  },
  members: {
    path: '/guilds/:guildId/members',
    getHref: (guildId: string | number) => `/guilds/${encodeURIComponent(String(guildId))}/members`,
  },
  rosterImport: {
    path: '/guilds/:guildId/members/import',
    getHref: (guildId: string | number) => `/guilds/${encodeURIComponent(String(guildId))}/members/import`,
  },
  bees: {
    path: '/guilds/:guildId/bees',
    getHref: (guildId: string | number) => `/guilds/${encodeURIComponent(String(guildId))}/bees`,
  },
  bee: {
    path: '/guilds/:guildId/bees/:beeId',
    getHref: (guildId: string | number, beeId: string | number) =>
      `/guilds/${encodeURIComponent(String(guildId))}/bees/${encodeURIComponent(String(beeId))}`,
  },
  round: {
    path: '/guilds/:guildId/bees/:beeId/rounds/:month',
    getHref: (guildId: string | number, beeId: string | number, month: string) =>
      `/guilds/${encodeURIComponent(String(guildId))}/bees/${encodeURIComponent(String(beeId))}/rounds/${encodeURIComponent(month)}`,
  },
  dues: {
    path: '/guilds/:guildId/dues',
    getHref: (guildId: string | number, options: { cancelled?: boolean } = {}) =>
      `/guilds/${encodeURIComponent(String(guildId))}/dues${options.cancelled ? '?cancelled=1' : ''}`,
  },
  duesReturn: {
    path: '/guilds/:guildId/dues/return',
    getHref: (guildId: string | number, invoiceId: string | number) =>
      `/guilds/${encodeURIComponent(String(guildId))}/dues/return?invoice=${encodeURIComponent(String(invoiceId))}`,
  },
  treasurer: {
    path: '/guilds/:guildId/treasurer',
    /** No section is the first one (the ledger); `search` is a query string for it, e.g. "?member=12". */
    getHref: (guildId: string | number, section?: TreasurerSection, search = '') =>
      `/guilds/${encodeURIComponent(String(guildId))}/treasurer${section ? `/${section}` : ''}${search}`,
  },
  layoutPlanner: {
    path: '/layout-planner',
    getHref: () => '/layout-planner',
  },
  profile: {
    path: '/profile',
    getHref: () => '/profile',
  },
  devInbox: {
    path: '/dev/inbox',
    getHref: (messageId?: string) => (messageId ? `/dev/inbox?id=${encodeURIComponent(messageId)}` : '/dev/inbox'),
  },
} as const;

// Only follow redirect targets that stay on this site.
export function safeRedirect(target: string | null | undefined, fallback: string = paths.home.getHref()): string {
  if (!target || !target.startsWith('/') || target.startsWith('//') || target.startsWith('/\\')) return fallback;
  return target;
}
