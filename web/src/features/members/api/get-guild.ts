import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type Guild = {
  id: number | string;
  name: string;
  town: string;
  timeZone: string;
  currency: string;
  myRoles: string[];
};

export const getGuild = (guildId: string, signal?: AbortSignal) =>
  api.get<Guild>(`/guilds/${encodeURIComponent(guildId)}`, signal);

export const guildQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: ['guilds', guildId] as const,
    queryFn: ({ signal }) => getGuild(guildId, signal),
  });

export function useGuild(guildId: string) {
  return useQuery(guildQueryOptions(guildId));
}
