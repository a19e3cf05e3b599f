import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type Term = {
  id: number;
  role: string;
  roleLabel: string;
  membershipId: number;
  name: string;
  startsOn: string;
  /** Her access ends on this day; null = no end date yet. */
  endsOn: string | null;
  note: string;
  recordedBy: { membershipId: number; name: string } | null;
  createdAt: string;
};

export type Office = { role: string; label: string; holders: Term[]; upcoming: Term[] };
export type Offices = { today: string; offices: Office[] };

export const getOffices = (guildId: string, signal?: AbortSignal) =>
  api.get<Offices>(`/guilds/${encodeURIComponent(guildId)}/offices`, signal);

export const officesQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: ['guilds', guildId, 'offices'] as const,
    queryFn: ({ signal }) => getOffices(guildId, signal),
  });

export function useOffices(guildId: string) {
  return useQuery(officesQueryOptions(guildId));
}
