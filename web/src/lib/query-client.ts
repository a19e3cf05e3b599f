import { QueryCache, QueryClient, type DefaultOptions } from '@tanstack/react-query';
import { isApiError } from './api-client';
import { userQueryOptions } from './auth';

export const queryConfig = {
  queries: {
    staleTime: 30_000,
    refetchOnWindowFocus: false,
    retry: (failureCount, error) => {
      // Client errors will not fix themselves on a retry.
      if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
      return failureCount < 2;
    },
  },
  mutations: {
    retry: false,
  },
} satisfies DefaultOptions;

export function createQueryClient(): QueryClient {
  const client: QueryClient = new QueryClient({
    defaultOptions: queryConfig,
    queryCache: new QueryCache({
      onError: (error, query) => {
        // The session ended (expired, or signed out in another tab): forget the user so
        // RequireAuth sends them to sign in and back.
        const meKey = userQueryOptions().queryKey;
        if (isApiError(error) && error.status === 401 && query.queryKey[0] !== meKey[0]) {
          client.setQueryData(meKey, null);
        }
      },
    }),
  });
  return client;
}
