import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { showPath, showQueryKey } from './show-path';
import type { BallotChoicesPayload, MemberBallot } from './types';

const ballotPath = (guildId: string, showId: string) => `${showPath(guildId, showId)}/ballot`;

export const getBallot = (guildId: string, showId: string, signal?: AbortSignal) => api.get<MemberBallot>(ballotPath(guildId, showId), signal);

export const ballotQueryOptions = (guildId: string, showId: string) =>
  queryOptions({
    queryKey: [...showQueryKey(guildId, showId), 'ballot'] as const,
    queryFn: ({ signal }) => getBallot(guildId, showId, signal),
  });

export function useBallot(guildId: string, showId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...ballotQueryOptions(guildId, showId), ...options });
}

export const castBallot = (guildId: string, showId: string, choices: BallotChoicesPayload) =>
  api.post<{ ok: true }>(ballotPath(guildId, showId), { choices });

export function useCastBallot(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (choices: BallotChoicesPayload) => castBallot(guildId, showId, choices),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ballotQueryOptions(guildId, showId).queryKey }),
  });
}

/** A paper ballot keyed in at the desk, with the code printed on it. */
export const recordPaperBallot = (guildId: string, showId: string, code: string, choices: BallotChoicesPayload) =>
  api.post<{ ok: true; ballotsCast: number }>(`${showPath(guildId, showId)}/voting/paper`, { code, choices });

export function useRecordPaperBallot(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ code, choices }: { code: string; choices: BallotChoicesPayload }) => recordPaperBallot(guildId, showId, code, choices),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: [...showQueryKey(guildId, showId), 'turnout'] }),
  });
}
