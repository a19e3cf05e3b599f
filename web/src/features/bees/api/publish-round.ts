import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { beeQueryOptions } from './get-bee';
import { mergeRoundResponse, roundPath, roundQueryOptions, type Round, type RoundPage } from './get-round';

export const publishRound = (guildId: string, beeId: string, month: string) =>
  api.post<Round | RoundPage>(`${roundPath(guildId, beeId, month)}/publish`, {});

export function usePublishRound(guildId: string, beeId: string, month: string) {
  const queryClient = useQueryClient();
  const key = roundQueryOptions(guildId, beeId, month).queryKey;
  return useMutation({
    mutationFn: () => publishRound(guildId, beeId, month),
    onSuccess: async (round) => {
      queryClient.setQueryData<RoundPage>(key, (page) => mergeRoundResponse(page, round));
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: key }),
        queryClient.invalidateQueries({ queryKey: beeQueryOptions(guildId, beeId).queryKey, exact: true }),
      ]);
    },
  });
}
