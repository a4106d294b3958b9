import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError, isUnauthorized } from '../lib/api-client';
import { queryKeys } from '../lib/query-keys';

/**
 * The client's QueryClient. Answers in 4xx are final (no retries); a 401 from any call means the session
 * has ended, so the signed-in user is fetched again and the route guard sends the person to sign in.
 */
export function createQueryClient(): QueryClient {
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error, query) => {
        if (isUnauthorized(error) && query.queryKey[0] !== queryKeys.me[0]) sessionEnded();
      },
    }),
    mutationCache: new MutationCache({
      onError: (error) => {
        if (isUnauthorized(error)) sessionEnded();
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: (failures, error) => !(isApiError(error) && error.status >= 400 && error.status < 500) && failures < 2,
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });

  function sessionEnded() {
    void queryClient.invalidateQueries({ queryKey: queryKeys.me });
  }

  return queryClient;
}

export const queryClient = createQueryClient();
