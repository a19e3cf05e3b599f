import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { showPath, showQueryKey } from './show-path';
import type { CodeBatch } from './types';

export const CODES_MAX = 2000;

const codesPath = (guildId: string, showId: string) => `${showPath(guildId, showId)}/voting/codes`;

export const getCodeBatches = (guildId: string, showId: string, signal?: AbortSignal) =>
  api.get<{ batches: CodeBatch[] }>(codesPath(guildId, showId), signal);

export const codeBatchesQueryOptions = (guildId: string, showId: string) =>
  queryOptions({
    queryKey: [...showQueryKey(guildId, showId), 'codes'] as const,
    queryFn: ({ signal }) => getCodeBatches(guildId, showId, signal),
  });

export function useCodeBatches(guildId: string, showId: string) {
  return useQuery(codeBatchesQueryOptions(guildId, showId));
}

export type CreatedCodes = { batch: number; count: number; codesIssued: number };

export const createCodes = (guildId: string, showId: string, count: number) => api.post<CreatedCodes>(codesPath(guildId, showId), { count });

export function useCreateCodes(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (count: number) => createCodes(guildId, showId, count),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: codeBatchesQueryOptions(guildId, showId).queryKey }),
        queryClient.invalidateQueries({ queryKey: [...showQueryKey(guildId, showId), 'turnout'] }),
      ]),
  });
}
