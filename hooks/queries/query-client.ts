/** The app's QueryClient and its one staleness setting. */
import { QueryClient } from '@tanstack/react-query';
import { ApiProblem } from '../api-client';

/** Lists change only through this app's own mutations, which invalidate them. */
export const STALE_TIME_MS = 30_000;

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: STALE_TIME_MS,
        // A 4xx will not get better by asking again.
        retry: (failureCount, error) => !(error instanceof ApiProblem && error.status >= 400 && error.status < 500) && failureCount < 2,
        refetchOnWindowFocus: false,
      },
      mutations: { retry: false },
    },
  });
}
