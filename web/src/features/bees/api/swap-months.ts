import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { beePath, beeQueryOptions, type Bee } from './get-bee';

export const swapMonthsSchema = yup.object({
  monthA: yup.string().required('Choose the first month.'),
  monthB: yup
    .string()
    .required('Choose the second month.')
    .notOneOf([yup.ref('monthA')], 'Choose two different months.'),
});
export type SwapMonthsValues = { monthA: string; monthB: string };

export const swapMonths = (guildId: string, beeId: string, input: SwapMonthsValues) =>
  api.post<Bee>(`${beePath(guildId, beeId)}/rotation/swap`, input);

export function useSwapMonths(guildId: string, beeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SwapMonthsValues) => swapMonths(guildId, beeId, input),
    onSuccess: (bee) => {
      if (bee && typeof bee === 'object' && 'rotation' in bee) queryClient.setQueryData(beeQueryOptions(guildId, beeId).queryKey, bee);
      return queryClient.invalidateQueries({ queryKey: beeQueryOptions(guildId, beeId).queryKey });
    },
  });
}
