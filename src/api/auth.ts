import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { apiRequest, resetCsrfToken } from './client';
import { queryKeys } from './keys';
import type { Me, SignInBody } from './types';

/**
 * Drop every cached resource except "me", which is then overwritten. Keeping the "me"
 * query object (rather than clearing the whole cache) keeps its observers attached.
 */
function forgetEverythingButMe(queryClient: QueryClient): void {
  queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== queryKeys.me[0] });
}

/** The signed-in user, or null when no one is (GET /api/auth/session answers 200 either way). */
export function useMe() {
  return useQuery({
    queryKey: queryKeys.me,
    queryFn: async ({ signal }): Promise<Me | null> => (await apiRequest<{ user: Me | null }>('/api/auth/session', { signal })).user,
    staleTime: 60_000,
  });
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (body: SignInBody) => {
      resetCsrfToken(); // a token from a previous session may be stale
      return apiRequest<Me>('/api/auth/login', { method: 'POST', body });
    },
    onSuccess: (me) => {
      resetCsrfToken(); // the session is renewed on sign-in
      forgetEverythingButMe(queryClient); // nothing cached for an earlier user may leak into this one
      queryClient.setQueryData(queryKeys.me, me);
    },
  });
}

/**
 * Sign out. `leave` runs before the cache is cleared (typically a navigation to the
 * sign-in page), so the page being left never sees itself signed out and never
 * remembers itself as the place to come back to.
 */
export function useSignOut(leave?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest<void>('/api/auth/logout', { method: 'POST' }),
    onSettled: () => {
      leave?.();
      resetCsrfToken();
      forgetEverythingButMe(queryClient);
      queryClient.setQueryData(queryKeys.me, null);
    },
  });
}

/** Change one's own password; the server ends the user's other sessions, this one stays. */
export function useChangePassword() {
  return useMutation({
    mutationFn: (body: { currentPassword: string; newPassword: string }) => apiRequest<void>('/api/auth/password', { method: 'POST', body }),
  });
}
