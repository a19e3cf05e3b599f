import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type Handover = 'mail' | 'meeting';
export type MyBeeStatus = 'organiser' | 'active' | 'invited' | null;
export type PersonRef = { membershipId: number; name: string };

export type BeeSummary = {
  id: number;
  name: string;
  description: string | null;
  handover: Handover;
  startMonth: string;
  months: number;
  organiser: PersonRef;
  memberCount: number;
  myStatus: MyBeeStatus;
};

const guildPath = (guildId: string) => `/guilds/${encodeURIComponent(guildId)}`;

export const beesPath = (guildId: string) => `${guildPath(guildId)}/bees`;

export const getBees = (guildId: string, signal?: AbortSignal) => api.get<BeeSummary[]>(beesPath(guildId), signal);

export const beesQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: ['guilds', guildId, 'bees'] as const,
    queryFn: ({ signal }) => getBees(guildId, signal),
  });

export function useBees(guildId: string) {
  return useQuery(beesQueryOptions(guildId));
}
