import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { beePath } from './get-bee';
import { beesQueryOptions } from './get-bees';

export const joinBee = (guildId: string, beeId: string) => api.post<unknown>(`${beePath(guildId, beeId)}/join`, {});

export function useJoinBee(guildId: string, beeId: string, alsoInvalidate: readonly QueryKey[] = []) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => joinBee(guildId, beeId),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: beesQueryOptions(guildId).queryKey }),
        ...alsoInvalidate.map((queryKey) => queryClient.invalidateQueries({ queryKey })),
      ]),
  });
}
