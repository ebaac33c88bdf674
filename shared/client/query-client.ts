// The app's QueryClient: no retries for answers that will not change (4xx), and a 401 anywhere means the session
// ended, so the session is asked for again (the signed-in layout then sends the user to sign in).
import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';
import { queryKeys } from './queries';

function isFinal(error: unknown): boolean {
  return isApiError(error) && error.status >= 400 && error.status < 500;
}

export function createAppQueryClient(): QueryClient {
  const onError = (error: unknown) => {
    if (isApiError(error) && error.status === 401) {
      void client.invalidateQueries({ queryKey: queryKeys.session });
    }
  };
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError }),
    defaultOptions: {
      queries: {
        retry: (failureCount, error) => !isFinal(error) && failureCount < 2,
        staleTime: 15_000,
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
  return client;
}
