import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { guildInvitationsQueryOptions } from './get-guild-invitations';

export const revokeInvitation = (guildId: string, invitationId: string | number) =>
  api.delete(`/guilds/${encodeURIComponent(guildId)}/invitations/${encodeURIComponent(String(invitationId))}`);

export function useRevokeInvitation(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string | number) => revokeInvitation(guildId, invitationId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: guildInvitationsQueryOptions(guildId).queryKey }),
  });
}
