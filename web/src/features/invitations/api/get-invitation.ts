import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type InvitationDetails = {
  guildName: string;
  guildTown?: string;
  email: string;
  invitedByName: string | null;
  hasAccount: boolean;
  expiresAt: string;
};

export const getInvitation = (token: string, signal?: AbortSignal) =>
  api.get<InvitationDetails>(`/invitations/${encodeURIComponent(token)}`, signal);

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['invitations', token] as const,
    queryFn: ({ signal }) => getInvitation(token, signal),
    retry: false,
  });

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}
