import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest, apiUpload } from './client';
import { queryKeys } from './keys';
import type { Line, LineDetail, NewLineBody, Station } from './types';

const linePath = (lineId: string) => `/api/lines/${encodeURIComponent(lineId)}`;

export function useLine(lineId: string) {
  return useQuery({
    queryKey: queryKeys.line(lineId),
    queryFn: ({ signal }) => apiRequest<LineDetail>(linePath(lineId), { signal }),
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

/** The station table replaces the whole previous one, from edited rows or from a CSV file. */
export type StationsInput = { kind: 'rows'; rows: Station[] } | { kind: 'file'; file: File };

export function useSaveStations(lineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: StationsInput) => {
      const path = `${linePath(lineId)}/stations`;
      if (input.kind === 'rows') return apiRequest<{ stations: Station[] }>(path, { method: 'PUT', body: input.rows });
      const form = new FormData();
      form.append('file', input.file, input.file.name);
      return apiUpload<{ stations: Station[] }>(path, form, { method: 'PUT' });
    },
    onSuccess: ({ stations }) => {
      queryClient.setQueryData<LineDetail>(queryKeys.line(lineId), (old) => (old ? { ...old, stations } : old));
      return queryClient.invalidateQueries({ queryKey: queryKeys.line(lineId) });
    },
  });
}

/** An earlier station table of a line (each save keeps the one it replaced). */
export interface StationRevisionSummary {
  number: number;
  stations: number;
  replacedAt: string;
  replacedBy: { id: string; name: string } | null;
}

export function useStationRevisions(lineId: string) {
  return useQuery({
    queryKey: [...queryKeys.line(lineId), 'station-revisions'] as const,
    queryFn: ({ signal }) => apiRequest<StationRevisionSummary[]>(`${linePath(lineId)}/stations/revisions`, { signal }),
  });
}

export function useRestoreStations(lineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (number: number) => apiRequest<{ stations: Station[] }>(`${linePath(lineId)}/stations/revisions/${number}/restore`, { method: 'POST' }),
    onSuccess: ({ stations }) => {
      queryClient.setQueryData<LineDetail>(queryKeys.line(lineId), (old) => (old ? { ...old, stations } : old));
      return queryClient.invalidateQueries({ queryKey: queryKeys.line(lineId) });
    },
  });
}
