import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client.ts';

/**
 * Whether a failed query is worth another try: network trouble and 5xx are, a 4xx is the
 * same answer next time. At most two retries.
 */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (failureCount >= 2) return false;
  if (!isApiError(error)) return true;
  return error.status === 0 || error.status >= 500;
}

export interface QueryClientHooks {
  /** Called when any request answers 401: the session has ended (expired, signed out elsewhere). */
  onUnauthorized?: () => void;
}

export function createQueryClient({ onUnauthorized }: QueryClientHooks = {}): QueryClient {
  const notice = (error: unknown) => {
    if (isApiError(error) && error.status === 401) onUnauthorized?.();
  };
  return new QueryClient({
    queryCache: new QueryCache({ onError: notice }),
    mutationCache: new MutationCache({ onError: notice }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: shouldRetry,
        refetchOnWindowFocus: false,
      },
      mutations: { retry: false },
    },
  });
}
