import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { beeQueryOptions } from './get-bee';
import { roundPath, roundQueryOptions, type Round, type RoundPage } from './get-round';

export const publishRound = (guildId: string, beeId: string, month: string) =>
  api.post<Round>(`${roundPath(guildId, beeId, month)}/publish`, {});

export function usePublishRound(guildId: string, beeId: string, month: string) {
  const queryClient = useQueryClient();
  const key = roundQueryOptions(guildId, beeId, month).queryKey;
  return useMutation({
    mutationFn: () => publishRound(guildId, beeId, month),
    onSuccess: async (round) => {
      if (round && typeof round === 'object') {
        queryClient.setQueryData<RoundPage>(key, (page) => (page ? { ...page, round } : page));
      }
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: key }),
        queryClient.invalidateQueries({ queryKey: beeQueryOptions(guildId, beeId).queryKey, exact: true }),
      ]);
    },
  });
}
