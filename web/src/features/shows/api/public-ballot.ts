import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import { publicBallotPath } from './show-path';
import type { Ballot, BallotChoicesPayload } from './types';

/** A visitor's ballot, by the code on her card; no sign-in. */
export const getPublicBallot = (code: string, signal?: AbortSignal) => api.get<Ballot>(publicBallotPath(code), signal);

export const publicBallotQueryOptions = (code: string) =>
  queryOptions({
    queryKey: ['public', 'ballots', code] as const,
    queryFn: ({ signal }) => getPublicBallot(code, signal),
    // An unknown or used code will not change by asking again.
    retry: (count, error) => !(isApiError(error) && error.status >= 400 && error.status < 500) && count < 2,
    staleTime: Infinity,
  });

export function usePublicBallot(code: string) {
  return useQuery({ ...publicBallotQueryOptions(code), enabled: code !== '' });
}

export const castPublicBallot = (code: string, choices: BallotChoicesPayload) => api.post<{ ok: true }>(publicBallotPath(code), { choices });

export function useCastPublicBallot(code: string) {
  return useMutation({ mutationFn: (choices: BallotChoicesPayload) => castPublicBallot(code, choices) });
}
