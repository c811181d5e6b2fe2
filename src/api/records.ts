import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { readRecord, type SeismicRecord } from '../../shared/records';
import type { PicksFromRecordsBody, RecordDetailView, RecordGeometryBody, RecordSummaryView } from '../../shared/schemas/records';
import { apiRequest, apiUpload } from './client';
import { ApiError, toApiError } from './errors';
import { queryKeys } from './keys';
import type { PickSetCreated } from './types';

/** Field records of a line (issue 12). Headers come as JSON; the samples are read from the original file in the browser. */
export const recordKeys = {
  list: (lineId: string) => ['lines', lineId, 'records'] as const,
  detail: (recordId: string) => ['records', recordId] as const,
  file: (recordId: string) => ['records', recordId, 'file'] as const,
};

const linePath = (lineId: string) => `/api/lines/${encodeURIComponent(lineId)}`;
const recordPath = (recordId: string) => `/api/records/${encodeURIComponent(recordId)}`;
export const recordFileUrl = (recordId: string) => `${recordPath(recordId)}/file`;

export function useRecords(lineId: string) {
  return useQuery({ queryKey: recordKeys.list(lineId), queryFn: ({ signal }) => apiRequest<RecordSummaryView[]>(`${linePath(lineId)}/records`, { signal }) });
}

export const recordDetailQuery = (recordId: string) => ({
  queryKey: recordKeys.detail(recordId),
  queryFn: ({ signal }: { signal: AbortSignal }) => apiRequest<RecordDetailView>(recordPath(recordId), { signal }),
});

export function useRecordDetail(recordId: string | null) {
  return useQuery({ ...recordDetailQuery(recordId ?? ''), enabled: Boolean(recordId) });
}

/** The original file, read with shared/records. A stored file never changes, so it is read once. */
async function fetchRecordFile(recordId: string, fileName: string, signal: AbortSignal): Promise<SeismicRecord> {
  const res = await fetch(recordFileUrl(recordId), { credentials: 'same-origin', signal, headers: { Accept: 'application/octet-stream' } });
  if (!res.ok) throw await toApiError(res);
  try {
    return readRecord(new Uint8Array(await res.arrayBuffer()), fileName);
  } catch (err) {
    throw new ApiError(502, 'unreadable_record', `The stored file could not be read again: ${(err as Error).message}`);
  }
}

export const recordFileQuery = (recordId: string, fileName: string) => ({
  queryKey: recordKeys.file(recordId),
  queryFn: ({ signal }: { signal: AbortSignal }) => fetchRecordFile(recordId, fileName, signal),
  staleTime: Infinity,
  gcTime: 30 * 60_000,
});

export function useRecordFile(recordId: string | null, fileName: string) {
  return useQuery({ ...recordFileQuery(recordId ?? '', fileName), enabled: Boolean(recordId) });
}

export function useUploadRecord(lineId: string) {
  return useMutation({
    mutationFn: ({ file, onProgress, signal }: { file: File; onProgress: (fraction: number) => void; signal?: AbortSignal }) => {
      const form = new FormData();
      form.append('file', file, file.name);
      return apiUpload<RecordSummaryView>(`${linePath(lineId)}/records`, form, { onProgress, signal });
    },
  });
}

export function useUpdateRecord(lineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ recordId, body }: { recordId: string; body: RecordGeometryBody }) => apiRequest<RecordDetailView>(recordPath(recordId), { method: 'PATCH', body }),
    onSuccess: async (detail) => {
      queryClient.setQueryData(recordKeys.detail(detail.id), detail);
      await queryClient.invalidateQueries({ queryKey: recordKeys.list(lineId) });
    },
  });
}

export function useDeleteRecord(lineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (recordId: string) => apiRequest<void>(recordPath(recordId), { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: recordKeys.list(lineId) }),
  });
}

export function useSavePicksFromRecords(lineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: PicksFromRecordsBody) => apiRequest<PickSetCreated>(`${linePath(lineId)}/picksets/from-records`, { method: 'POST', body }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.line(lineId) });
      await queryClient.invalidateQueries({ queryKey: recordKeys.list(lineId) });
    },
  });
}
