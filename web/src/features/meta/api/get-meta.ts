import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type Meta = { devInbox: boolean };

export const getMeta = (signal?: AbortSignal) => api.get<Meta>('/meta', signal);

export const metaQueryOptions = () =>
  queryOptions({
    queryKey: ['meta'] as const,
    queryFn: ({ signal }) => getMeta(signal),
    staleTime: Infinity,
  });

export function useMeta() {
  return useQuery(metaQueryOptions());
}
