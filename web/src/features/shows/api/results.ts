import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { showPath, showQueryKey } from './show-path';
import type { Results } from './types';

const resultsPath = (guildId: string, showId: string) => `${showPath(guildId, showId)}/results`;

export const getResults = (guildId: string, showId: string, signal?: AbortSignal) => api.get<Results>(resultsPath(guildId, showId), signal);

export const resultsQueryOptions = (guildId: string, showId: string) =>
  queryOptions({
    queryKey: [...showQueryKey(guildId, showId), 'results'] as const,
    queryFn: ({ signal }) => getResults(guildId, showId, signal),
  });

export function useResults(guildId: string, showId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...resultsQueryOptions(guildId, showId), ...options });
}

export type DecisionInput = { categoryId: number | null; order: number[]; note: string };

/** Every results change answers with the results; they replace what is shown. */
function useResultsMutation<TInput>(guildId: string, showId: string, fn: (input: TInput) => Promise<Results>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (results) => {
      queryClient.setQueryData(resultsQueryOptions(guildId, showId).queryKey, results);
      return queryClient.invalidateQueries({ queryKey: showQueryKey(guildId, showId), predicate: (q) => q.queryKey.at(-1) !== 'results' });
    },
  });
}

export const useRecordDecision = (guildId: string, showId: string) =>
  useResultsMutation(guildId, showId, (input: DecisionInput) => api.post<Results>(`${resultsPath(guildId, showId)}/decisions`, input));

export const useRemoveDecision = (guildId: string, showId: string) =>
  useResultsMutation(guildId, showId, (decisionId: number) =>
    api.delete<Results>(`${resultsPath(guildId, showId)}/decisions/${encodeURIComponent(String(decisionId))}`),
  );

export const usePublishResults = (guildId: string, showId: string) =>
  useResultsMutation(guildId, showId, () => api.post<Results>(`${resultsPath(guildId, showId)}/publish`));
