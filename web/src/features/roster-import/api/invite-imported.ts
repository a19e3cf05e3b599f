import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type InviteImportedResult = {
  sent: { membershipId: number; name: string; email: string }[];
  skipped: { membershipId: number; name: string | null; reason: string }[];
};

export const INVITE_BATCH = 100;

/** Sends the invitations 100 to a request (each takes a moment on the server) and adds up the answers. */
export async function inviteImported(guildId: string, membershipIds: number[]): Promise<InviteImportedResult> {
  const total: InviteImportedResult = { sent: [], skipped: [] };
  for (let i = 0; i < membershipIds.length; i += INVITE_BATCH) {
    const part = await api.post<InviteImportedResult>(`/guilds/${encodeURIComponent(guildId)}/roster-import/invitations`, {
      membershipIds: membershipIds.slice(i, i + INVITE_BATCH),
    });
    total.sent.push(...part.sent);
    total.skipped.push(...part.skipped);
  }
  return total;
}

export function useInviteImported(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (membershipIds: number[]) => inviteImported(guildId, membershipIds),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['guilds', guildId] }),
  });
}
