import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { beePath, beeQueryOptions } from './get-bee';

export const removeBeeMember = (guildId: string, beeId: string, membershipId: number) =>
  api.delete(`${beePath(guildId, beeId)}/members/${encodeURIComponent(String(membershipId))}`);

export function useRemoveBeeMember(guildId: string, beeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (membershipId: number) => removeBeeMember(guildId, beeId, membershipId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: beeQueryOptions(guildId, beeId).queryKey }),
  });
}
