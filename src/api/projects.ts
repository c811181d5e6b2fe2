import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from './client';
import { queryKeys } from './keys';
import type { NewMemberBody, NewProjectBody, ProjectDetail, ProjectMember, ProjectRole, ProjectSummary } from './types';

const projectPath = (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}`;

export function useProjects() {
  return useQuery({
    queryKey: queryKeys.projects,
    queryFn: ({ signal }) => apiRequest<ProjectSummary[]>('/api/projects', { signal }),
  });
}

export function useProject(projectId: string, options: { enabled?: boolean } = {}) {
  return useQuery({
    queryKey: queryKeys.project(projectId),
    queryFn: ({ signal }) => apiRequest<ProjectDetail>(projectPath(projectId), { signal }),
    enabled: options.enabled ?? true,
  });
}

export function useCreateProject() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: NewProjectBody) => apiRequest<ProjectSummary>('/api/projects', { method: 'POST', body }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.projects });
      // The creator becomes lead of the new project, which changes their role summary.
      await queryClient.invalidateQueries({ queryKey: queryKeys.me });
    },
  });
}

export function useAddMember(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: NewMemberBody) =>
      apiRequest<ProjectMember>(`${projectPath(projectId)}/members`, { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.project(projectId) }),
  });
}

export function useRemoveMember(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) =>
      apiRequest<void>(`${projectPath(projectId)}/members/${encodeURIComponent(userId)}`, { method: 'DELETE' }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.project(projectId) });
      // Removing oneself changes one's own roles and project list.
      await queryClient.invalidateQueries({ queryKey: queryKeys.me });
      await queryClient.invalidateQueries({ queryKey: queryKeys.projects, exact: true });
    },
  });
}

export function useChangeMemberRole(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: ProjectRole }) =>
      apiRequest<ProjectMember>(`${projectPath(projectId)}/members/${encodeURIComponent(userId)}`, { method: 'PATCH', body: { role } }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.project(projectId) });
      // Changing one's own role changes what one may do here.
      await queryClient.invalidateQueries({ queryKey: queryKeys.me });
    },
  });
}

/** The project's settings (lead or administrator): send only what changes. */
export function useUpdateProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: Partial<Pick<ProjectSummary, 'name' | 'site' | 'clientOrganisation' | 'status' | 'velocityColours'> & { crsEpsg: number | null }>) =>
      apiRequest<ProjectSummary>(projectPath(projectId), { method: 'PATCH', body }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.project(projectId) });
      await queryClient.invalidateQueries({ queryKey: queryKeys.projects, exact: true });
    },
  });
}
