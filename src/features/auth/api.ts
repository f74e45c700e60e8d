import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginBody, OkResponse, ResetBody, ResetRequestBody, SignupBody, UserResponse } from '../../../shared/api';
import { ApiError, api } from '../../lib/api-client';

export const authKeys = { me: ['auth', 'me'] as const };

/**
 * The signed-in user, or null when signed out: 401 `not_signed_in` is an answer here, not an
 * error, so pages can decide between "sign in" and their content without an error boundary.
 */
export const meQueryOptions = queryOptions({
  queryKey: authKeys.me,
  queryFn: async () => {
    try {
      return (await api.get<UserResponse>('/api/auth/me')).user;
    } catch (err) {
      if (err instanceof ApiError && err.status === 401) return null;
      throw err;
    }
  },
  staleTime: 60_000,
});

/** After signing in, up or out, every cached answer belonged to somebody else: start afresh. */
function useResetAfterAuthChange() {
  const qc = useQueryClient();
  return (user: UserResponse['user'] | null) => {
    qc.removeQueries({ predicate: (q) => q.queryKey[0] !== 'auth' });
    qc.setQueryData(authKeys.me, user);
  };
}

export function useSignIn() {
  const reset = useResetAfterAuthChange();
  return useMutation({
    mutationFn: (body: LoginBody) => api.post<UserResponse>('/api/auth/login', body),
    onSuccess: ({ user }) => reset(user),
  });
}

export function useSignUp() {
  const reset = useResetAfterAuthChange();
  return useMutation({
    mutationFn: (body: SignupBody) => api.post<UserResponse>('/api/auth/signup', body),
    onSuccess: ({ user }) => reset(user),
  });
}

/**
 * Signing out loads the sign-in page afresh instead of navigating inside the app: every cache,
 * open board socket and private try-out state of the previous user goes with the old page, and
 * no signed-in page gets to re-render as "signed out" (which would bounce through `?next=`).
 */
export function useSignOut() {
  return useMutation({
    mutationFn: () => api.post<void>('/api/auth/logout'),
    onSuccess: () => window.location.assign('/signin'),
  });
}

export function useResetRequest() {
  return useMutation({ mutationFn: (body: ResetRequestBody) => api.post<OkResponse>('/api/auth/reset-request', body) });
}

export function useResetPassword() {
  return useMutation({ mutationFn: (body: ResetBody) => api.post<OkResponse>('/api/auth/reset', body) });
}
