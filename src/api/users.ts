import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from './client';
import { queryKeys } from './keys';
import type { DirectoryEntry, NewUserBody, User, UserPatch } from './types';

/** All accounts (admin only). */
export function useUsers() {
  return useQuery({
    queryKey: queryKeys.users,
    queryFn: ({ signal }) => apiRequest<User[]>('/api/users', { signal }),
  });
}

/** Active accounts to choose from when adding project members (admin and leads). */
export function useUserDirectory(options: { enabled?: boolean } = {}) {
  return useQuery({
    queryKey: queryKeys.userDirectory,
    queryFn: ({ signal }) => apiRequest<DirectoryEntry[]>('/api/users/directory', { signal }),
    enabled: options.enabled ?? true,
  });
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: NewUserBody) => apiRequest<User>('/api/users', { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.users }),
  });
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, patch }: { userId: string; patch: UserPatch }) =>
      apiRequest<User>(`/api/users/${encodeURIComponent(userId)}`, { method: 'PATCH', body: patch }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.users });
      await queryClient.invalidateQueries({ queryKey: queryKeys.me });
    },
  });
}

/** An administrator e-mails an account's owner a one-time link to set a new password. */
export function useSendResetLink() {
  return useMutation({
    mutationFn: (userId: string) => apiRequest<{ sentTo: string; expiresAt: string }>(`/api/users/${encodeURIComponent(userId)}/password-reset`, { method: 'POST' }),
  });
}

/** The owner sets a new password from the link's token (no sign-in needed). */
export function useFinishPasswordReset() {
  return useMutation({
    mutationFn: (body: { token: string; newPassword: string }) => apiRequest<void>('/api/auth/password-reset', { method: 'POST', body }),
  });
}
