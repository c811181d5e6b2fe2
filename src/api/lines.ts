import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from './client';
import { queryKeys } from './keys';
import type { Line, LineDetail, NewLineBody } from './types';

export function useLine(lineId: string) {
  return useQuery({
    queryKey: queryKeys.line(lineId),
    queryFn: ({ signal }) => apiRequest<LineDetail>(`/api/lines/${encodeURIComponent(lineId)}`, { signal }),
  });
}

export function useCreateLine(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: NewLineBody) =>
      apiRequest<Line>(`/api/projects/${encodeURIComponent(projectId)}/lines`, { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.project(projectId) }),
  });
}
