/** The Officers page's address, in the same shape as config/paths.ts. */
export const officePaths = {
  officers: {
    path: '/guilds/:guildId/officers',
    getHref: (guildId: string | number) => `/guilds/${encodeURIComponent(String(guildId))}/officers`,
  },
} as const;
