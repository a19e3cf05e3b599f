import { QueryClient, type DefaultOptions } from '@tanstack/react-query';
import { isApiError } from './api-client';

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
  return new QueryClient({ defaultOptions: queryConfig });
}
