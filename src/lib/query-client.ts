import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

// Only "no session" counts: a 401 `bad_credentials` from the sign-in form is a wrong password.
function isUnauthorized(err: unknown): boolean {
  return isApiError(err) && err.status === 401 && err.code === 'not_signed_in';
}

/**
 * One QueryClient for the app. A 4xx answer will not change by asking again (not signed in, not a
 * member, not found), so only network failures and 5xx are retried, and at most twice.
 * `onUnauthorized` runs when any request answers 401 `not_signed_in` — the session ended (expired, or signed out
 * in another tab) — so the app can send the visitor to sign in instead of showing errors.
 */
export function createQueryClient(onUnauthorized?: (client: QueryClient) => void): QueryClient {
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: (err) => isUnauthorized(err) && onUnauthorized?.(client) }),
    mutationCache: new MutationCache({ onError: (err) => isUnauthorized(err) && onUnauthorized?.(client) }),
    defaultOptions: {
      queries: {
        staleTime: 15_000,
        retry: (failures, err) => failures < 2 && !(isApiError(err) && err.status >= 400 && err.status < 500),
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
  return client;
}
