import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { beePath } from './get-bee';
import { beesQueryOptions } from './get-bees';

export const leaveBee = (guildId: string, beeId: string) => api.post<unknown>(`${beePath(guildId, beeId)}/leave`, {});

export function useLeaveBee(guildId: string, beeId: string, alsoInvalidate: readonly QueryKey[] = []) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => leaveBee(guildId, beeId),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: beesQueryOptions(guildId).queryKey }),
        ...alsoInvalidate.map((queryKey) => queryClient.invalidateQueries({ queryKey })),
      ]),
  });
}
