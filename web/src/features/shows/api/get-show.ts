import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { showPath, showQueryKey } from './show-path';
import type { Show } from './types';

export const getShow = (guildId: string, showId: string, signal?: AbortSignal) => api.get<Show>(showPath(guildId, showId), signal);

export const showQueryOptions = (guildId: string, showId: string) =>
  queryOptions({
    queryKey: [...showQueryKey(guildId, showId), 'detail'] as const,
    queryFn: ({ signal }) => getShow(guildId, showId, signal),
  });

export function useShow(guildId: string, showId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...showQueryOptions(guildId, showId), ...options });
}
