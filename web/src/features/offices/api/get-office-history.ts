import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Term } from './get-offices';

export type OfficeHistory = { today: string; terms: Term[] };

export const getOfficeHistory = (guildId: string, signal?: AbortSignal) =>
  api.get<OfficeHistory>(`/guilds/${encodeURIComponent(guildId)}/offices/history`, signal);

export const officeHistoryQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: ['guilds', guildId, 'offices', 'history'] as const,
    queryFn: ({ signal }) => getOfficeHistory(guildId, signal),
  });

export function useOfficeHistory(guildId: string) {
  return useQuery(officeHistoryQueryOptions(guildId));
}
