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
