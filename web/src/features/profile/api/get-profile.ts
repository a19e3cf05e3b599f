import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type Profile = { name: string; email?: string };

export const getProfile = (signal?: AbortSignal) => api.get<Profile>('/profile', signal);

export const profileQueryOptions = () =>
  queryOptions({
    queryKey: ['profile'] as const,
    queryFn: ({ signal }) => getProfile(signal),
  });

export function useProfile() {
  return useQuery(profileQueryOptions());
}
