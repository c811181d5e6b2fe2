import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { BoreholeBody, BoreholeView } from '../../shared/schemas/boreholes';
import { apiRequest, apiUpload } from './client';

/** Boreholes and trial pits of a line (issue 13). Under the line's key, so refreshing the line refreshes them. */
export const boreholeKeys = { list: (lineId: string) => ['lines', lineId, 'boreholes'] as const };

const linePath = (lineId: string) => `/api/lines/${encodeURIComponent(lineId)}/boreholes`;

export function useBoreholes(lineId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ queryKey: boreholeKeys.list(lineId), queryFn: ({ signal }) => apiRequest<BoreholeView[]>(linePath(lineId), { signal }), enabled: options.enabled ?? true });
}

function useRefresh(lineId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: boreholeKeys.list(lineId) });
}

/** Create (no id) or replace (with id) one hole. */
export function useSaveBorehole(lineId: string) {
  const refresh = useRefresh(lineId);
  return useMutation({
    mutationFn: ({ id, body }: { id: string | null; body: BoreholeBody }) =>
      id ? apiRequest<BoreholeView>(`/api/boreholes/${encodeURIComponent(id)}`, { method: 'PUT', body }) : apiRequest<BoreholeView>(linePath(lineId), { method: 'POST', body }),
    onSuccess: refresh,
  });
}

export function useDeleteBorehole(lineId: string) {
  const refresh = useRefresh(lineId);
  return useMutation({ mutationFn: (id: string) => apiRequest<void>(`/api/boreholes/${encodeURIComponent(id)}`, { method: 'DELETE' }), onSuccess: refresh });
}

export function useUploadBoreholes(lineId: string) {
  const refresh = useRefresh(lineId);
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.append('file', file, file.name);
      return apiUpload<{ created: number; boreholes: BoreholeView[] }>(`${linePath(lineId)}/file`, form);
    },
    onSuccess: refresh,
  });
}
