import type { QueryClient } from '@tanstack/react-query';

/** After any change to terms: the offices, the history, the members' roles and my own roles. */
export const invalidateOffices = (queryClient: QueryClient, guildId: string) =>
  queryClient.invalidateQueries({ queryKey: ['guilds', guildId] });
