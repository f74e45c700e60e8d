import { QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

/**
 * One QueryClient for the app. A 4xx answer will not change by asking again (not signed in, not a
 * member, not found), so only network failures and 5xx are retried, and at most twice.
 */
export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 15_000,
        retry: (failures, err) => failures < 2 && !(isApiError(err) && err.status >= 400 && err.status < 500),
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
}
