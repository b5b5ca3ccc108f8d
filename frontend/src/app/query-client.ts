import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from '@/lib/api-client';
import { sessionKeys } from '@/lib/session';

/** 4xx answers are decisions, not hiccups: retrying them only delays the message. */
const shouldRetry = (failureCount: number, error: unknown) =>
  !(isApiError(error) && error.status >= 400 && error.status < 500) && failureCount < 2;

export function createQueryClient(): QueryClient {
  const queryClient: QueryClient = new QueryClient({
    // A 401 anywhere means the session ended (expired, signed out in another tab): re-ask
    // who is signed in, and the auth guard sends the person to sign in and back again.
    queryCache: new QueryCache({
      onError: (error, query) => {
        if (isApiError(error) && error.status === 401 && query.queryKey[0] !== sessionKeys.me()[0]) {
          void queryClient.invalidateQueries({ queryKey: sessionKeys.me() });
        }
      },
    }),
    mutationCache: new MutationCache({
      onError: (error) => {
        if (isApiError(error) && error.status === 401 && error.code === 'unauthenticated') {
          void queryClient.invalidateQueries({ queryKey: sessionKeys.me() });
        }
      },
    }),
    defaultOptions: {
      queries: { retry: shouldRetry, staleTime: 15_000, refetchOnWindowFocus: true },
      mutations: { retry: false },
    },
  });
  return queryClient;
}
