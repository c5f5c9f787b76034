import { QueryCache, QueryClient, type DefaultOptions } from '@tanstack/react-query';

import { isApiError } from './api-client';
import { authKeys } from './auth';
import { forgetKept } from './kept-me';

const defaultOptions: DefaultOptions = {
  queries: {
    staleTime: 30_000,
    refetchOnWindowFocus: false,
    // Retrying a 4xx gives the same answer; retry only what may be a passing hiccup.
    retry: (failureCount, error) =>
      failureCount < 2 && !(isApiError(error) && error.status >= 400 && error.status < 500),
  },
};

/** One cache for the whole app; a 401 anywhere means the session is gone. */
export function createQueryClient(overrides: DefaultOptions = {}): QueryClient {
  const queryClient: QueryClient = new QueryClient({
    defaultOptions: {
      queries: { ...defaultOptions.queries, ...overrides.queries },
      mutations: { ...defaultOptions.mutations, ...overrides.mutations },
    },
    queryCache: new QueryCache({
      onError: (error) => {
        if (isApiError(error, 401)) {
          forgetKept();
          queryClient.setQueryData(authKeys.me(), null);
        }
      },
    }),
  });
  return queryClient;
}
