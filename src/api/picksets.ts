import { useSubmissionKey } from './submissionKey';
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest, apiUpload } from './client';
import { queryKeys } from './keys';
import type { NewRevisionBody, PickSetCreated, PickSetDetail } from './types';

const pickSetPath = (pickSetId: string) => `/api/picksets/${encodeURIComponent(pickSetId)}`;

/** Where the original file can be downloaded, exactly as it was uploaded. */
export const pickSetFileUrl = (pickSetId: string) => `${pickSetPath(pickSetId)}/file`;

/** One pick set with its picks and QC, at a given revision (null: the latest). */
export function usePickSet(pickSetId: string | null, revision: number | null) {
  return useQuery({
    queryKey: queryKeys.pickSetRevision(pickSetId ?? '', revision),
    queryFn: ({ signal }) =>
      apiRequest<PickSetDetail>(`${pickSetPath(pickSetId ?? '')}${revision === null ? '' : `?revision=${revision}`}`, { signal }),
    enabled: Boolean(pickSetId),
    // Pick sets never change once stored; only new revisions appear.
    staleTime: 5 * 60_000,
    placeholderData: keepPreviousData,
  });
}

export function useUploadPickSet(lineId: string) {
  const queryClient = useQueryClient();
  const submission = useSubmissionKey();
  return useMutation({
    mutationFn: ({ file, onProgress, signal }: { file: File; onProgress: (fraction: number) => void; signal?: AbortSignal }) => {
      const form = new FormData();
      form.append('file', file, file.name);
      return apiUpload<PickSetCreated>(`/api/lines/${encodeURIComponent(lineId)}/picksets`, form, { onProgress, signal, idempotencyKey: submission.current() });
    },
    onSettled: submission.renew,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.line(lineId) }),
  });
}

export function useCreateRevision(pickSetId: string, lineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: NewRevisionBody) =>
      apiRequest<{ number: number }>(`${pickSetPath(pickSetId)}/revisions`, { method: 'POST', body }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.pickSet(pickSetId) });
      await queryClient.invalidateQueries({ queryKey: queryKeys.line(lineId) });
    },
  });
}

/** Retire (with a reason) or reinstate a pick set; the line's lists are refreshed afterwards. */
export function useRetirePickSet(pickSetId: string, lineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (reason: string | null) =>
      apiRequest<void>(`${pickSetPath(pickSetId)}/${reason === null ? 'reinstate' : 'retire'}`, { method: 'POST', body: reason === null ? {} : { reason } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.line(lineId) }),
  });
}
