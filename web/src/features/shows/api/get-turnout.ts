import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { showPath, showQueryKey } from './show-path';
import type { Turnout } from './types';

/** How often the ballot desk asks again while voting is open. */
export const TURNOUT_REFRESH_MS = 10_000;

export const getTurnout = (guildId: string, showId: string, signal?: AbortSignal) =>
  api.get<Turnout>(`${showPath(guildId, showId)}/voting/turnout`, signal);

export const turnoutQueryOptions = (guildId: string, showId: string) =>
  queryOptions({
    queryKey: [...showQueryKey(guildId, showId), 'turnout'] as const,
    queryFn: ({ signal }) => getTurnout(guildId, showId, signal),
  });

/** Counts only, never standings; refreshed every 10 s while voting is open. */
export function useTurnout(guildId: string, showId: string) {
  return useQuery({
    ...turnoutQueryOptions(guildId, showId),
    refetchInterval: (query) => (query.state.data?.state === 'open' ? TURNOUT_REFRESH_MS : false),
  });
}
