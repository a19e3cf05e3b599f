import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { dashboardQueryOptions } from '@/features/dashboard/api/get-dashboard';
import { membersQueryOptions } from '@/features/members/api/get-members';

const guildPath = (guildId: string | number) => `/guilds/${encodeURIComponent(String(guildId))}`;
const memberPath = (guildId: string | number, membershipId: string | number) =>
  `${guildPath(guildId)}/members/${encodeURIComponent(String(membershipId))}`;

export type Departure = { membershipId: number; name: string; status: 'left'; leftAt: string; eraseRequestedAt: string | null };

export type ErasurePlan = {
  membershipId: number;
  name: string;
  newName: string;
  leftAt: string | null;
  eraseRequestedAt: string | null;
  refusals: { code: string; message: string }[];
  erases: string[];
  keeps: string[];
};

export type Erased = { membershipId: number; name: string; erasedAt: string; photosRemoved: number; showEntriesChanged: number };

export const leaveGuild = (guildId: string | number, eraseRequest: boolean) => api.post<Departure>(`${guildPath(guildId)}/leave`, { eraseRequest });
export const recordDeparture = (guildId: string, membershipId: number) => api.post<Departure>(`${memberPath(guildId, membershipId)}/departure`, {});
export const getErasurePlan = (guildId: string, membershipId: number, signal?: AbortSignal) =>
  api.get<ErasurePlan>(`${memberPath(guildId, membershipId)}/erasure`, signal);
export const eraseMember = (guildId: string, membershipId: number) => api.post<Erased>(`${memberPath(guildId, membershipId)}/erasure`, { confirm: true });

/** She leaves one of her guilds (profile page). */
export function useLeaveGuild() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ guildId, eraseRequest }: { guildId: number; eraseRequest: boolean }) => leaveGuild(guildId, eraseRequest),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: dashboardQueryOptions().queryKey }),
  });
}

/** An officer records that a member has left. */
export function useRecordDeparture(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (membershipId: number) => recordDeparture(guildId, membershipId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersQueryOptions(guildId).queryKey }),
  });
}

export const erasurePlanQueryOptions = (guildId: string, membershipId: number) =>
  queryOptions({
    queryKey: ['guilds', guildId, 'members', membershipId, 'erasure'],
    queryFn: ({ signal }) => getErasurePlan(guildId, membershipId, signal),
    staleTime: 0,
  });

export function useErasurePlan(guildId: string, membershipId: number | null) {
  return useQuery({ ...erasurePlanQueryOptions(guildId, membershipId ?? 0), enabled: membershipId !== null });
}

export function useEraseMember(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (membershipId: number) => eraseMember(guildId, membershipId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersQueryOptions(guildId).queryKey }),
  });
}
