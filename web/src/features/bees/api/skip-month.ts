import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { beePath, beeQueryOptions, type Bee } from './get-bee';

export type SkipMonthInput = { month: string; skipped: boolean };

export const skipMonth = (guildId: string, beeId: string, input: SkipMonthInput) =>
  api.post<Bee>(`${beePath(guildId, beeId)}/rotation/skip`, input);

export function useSkipMonth(guildId: string, beeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SkipMonthInput) => skipMonth(guildId, beeId, input),
    onSuccess: (bee) => {
      if (bee && typeof bee === 'object' && 'rotation' in bee) queryClient.setQueryData(beeQueryOptions(guildId, beeId).queryKey, bee);
      return queryClient.invalidateQueries({ queryKey: beeQueryOptions(guildId, beeId).queryKey });
    },
  });
}
