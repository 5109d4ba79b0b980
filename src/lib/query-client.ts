import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';
import { sessionQueryKey } from './auth';

/** Retries only what can succeed on a second try: network failures and server errors, not 4xx answers. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.isClientError) return false;
  return failureCount < 2;
}

export function createQueryClient(): QueryClient {
  // A 401 from any API call means the session ended (expired or signed out elsewhere): forget the person, and the
  // signed-in part of the site sends them to the sign-in page, returning afterwards.
  const onError = (error: unknown) => {
    if (isApiError(error) && error.isUnauthenticated && error.code !== 'invalid_credentials') {
      client.setQueryData(sessionQueryKey, null);
    }
  };
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError }),
    defaultOptions: {
      queries: { staleTime: 30_000, retry: shouldRetry, refetchOnWindowFocus: true },
      mutations: { retry: false },
    },
  });
  return client;
}

export const queryClient = createQueryClient();
