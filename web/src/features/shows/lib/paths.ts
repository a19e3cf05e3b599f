/** The show pages' addresses, in the same shape as config/paths.ts (path for the router, getHref for links). */
const part = (value: string | number) => encodeURIComponent(String(value));
const show = (guildId: string | number, showId: string | number) => `/guilds/${part(guildId)}/shows/${part(showId)}`;

export const showPaths = {
  list: {
    path: '/guilds/:guildId/shows',
    getHref: (guildId: string | number) => `/guilds/${part(guildId)}/shows`,
  },
  create: {
    path: '/guilds/:guildId/shows/new',
    getHref: (guildId: string | number) => `/guilds/${part(guildId)}/shows/new`,
  },
  show: {
    path: '/guilds/:guildId/shows/:showId',
    getHref: show,
  },
  settings: {
    path: '/guilds/:guildId/shows/:showId/settings',
    getHref: (guildId: string | number, showId: string | number) => `${show(guildId, showId)}/settings`,
  },
  enter: {
    path: '/guilds/:guildId/shows/:showId/enter',
    getHref: (guildId: string | number, showId: string | number) => `${show(guildId, showId)}/enter`,
  },
  editEntry: {
    path: '/guilds/:guildId/shows/:showId/entries/:entryId/edit',
    getHref: (guildId: string | number, showId: string | number, entryId: string | number) =>
      `${show(guildId, showId)}/entries/${part(entryId)}/edit`,
  },
  vote: {
    path: '/guilds/:guildId/shows/:showId/vote',
    getHref: (guildId: string | number, showId: string | number) => `${show(guildId, showId)}/vote`,
  },
  results: {
    path: '/guilds/:guildId/shows/:showId/results',
    getHref: (guildId: string | number, showId: string | number) => `${show(guildId, showId)}/results`,
  },
  entriesReview: {
    path: '/guilds/:guildId/shows/:showId/entries-review',
    getHref: (guildId: string | number, showId: string | number, search = '') => `${show(guildId, showId)}/entries-review${search}`,
  },
  votingDesk: {
    path: '/guilds/:guildId/shows/:showId/voting',
    getHref: (guildId: string | number, showId: string | number) => `${show(guildId, showId)}/voting`,
  },
  /** Visitors, signed out: type the code from a ballot card. */
  visitorVote: {
    path: '/vote',
    getHref: () => '/vote',
  },
  visitorBallot: {
    path: '/vote/:code',
    getHref: (code: string) => `/vote/${part(code)}`,
  },
} as const;
