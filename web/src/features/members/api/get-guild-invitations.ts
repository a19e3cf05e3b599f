import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { guildQueryOptions } from './get-guild';

export type PendingInvitation = {
  id: number | string;
  email: string;
  roles?: string[];
  invitedByName?: string;
  createdAt?: string;
  expiresAt?: string;
};

type InvitationsResponse = { invitations: PendingInvitation[] } | PendingInvitation[];

export const getGuildInvitations = async (guildId: string, signal?: AbortSignal): Promise<PendingInvitation[]> => {
  const data = await api.get<InvitationsResponse>(`/guilds/${encodeURIComponent(guildId)}/invitations`, signal);
  return Array.isArray(data) ? data : (data?.invitations ?? []);
};

export const guildInvitationsQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: [...guildQueryOptions(guildId).queryKey, 'invitations'] as const,
    queryFn: ({ signal }) => getGuildInvitations(guildId, signal),
  });

export function useGuildInvitations(guildId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...guildInvitationsQueryOptions(guildId), ...options });
}
