import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { showsPath, showsQueryKey } from './show-path';
import type { ShowSummary } from './types';

export const getShows = (guildId: string, signal?: AbortSignal) => api.get<ShowSummary[]>(showsPath(guildId), signal);

export const showsQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: [...showsQueryKey(guildId), 'list'] as const,
    queryFn: ({ signal }) => getShows(guildId, signal),
  });

export function useShows(guildId: string) {
  return useQuery(showsQueryOptions(guildId));
}
