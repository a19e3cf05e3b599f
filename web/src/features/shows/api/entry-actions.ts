import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { entryPath } from './save-entry';
import { showPath, showQueryKey } from './show-path';
import type { Entry } from './types';

export const withdrawEntry = (guildId: string, showId: string, entryId: number) => api.post<Entry>(`${entryPath(guildId, showId, entryId)}/withdraw`);

export type ReviewInput = { decision: 'accept' } | { decision: 'decline'; reason: string };

export const reviewEntry = (guildId: string, showId: string, entryId: number, input: ReviewInput) =>
  api.post<Entry>(`${entryPath(guildId, showId, entryId)}/review`, input);

/** Numbers the accepted entries that have none, in category order. */
export const numberEntries = (guildId: string, showId: string) => api.post<Entry[]>(`${showPath(guildId, showId)}/entries/number`, {});

function useShowMutation<TInput, TResult>(guildId: string, showId: string, fn: (input: TInput) => Promise<TResult>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: showQueryKey(guildId, showId) }),
  });
}

export const useWithdrawEntry = (guildId: string, showId: string) =>
  useShowMutation(guildId, showId, (entryId: number) => withdrawEntry(guildId, showId, entryId));

export const useReviewEntry = (guildId: string, showId: string) =>
  useShowMutation(guildId, showId, ({ entryId, input }: { entryId: number; input: ReviewInput }) => reviewEntry(guildId, showId, entryId, input));

export const useNumberEntries = (guildId: string, showId: string) => useShowMutation(guildId, showId, () => numberEntries(guildId, showId));
