import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import type { InversionSectionView, InversionView, StartInversionBody } from '../../shared/schemas/inversions';
import { apiRequest } from './client';
import { inversionKeys, queryKeys } from './keys';
import { useSubmissionKey } from './submissionKey';
import type { ResidualRow } from './types';

const inversionPath = (inversionId: string) => `/api/inversions/${encodeURIComponent(inversionId)}`;

export type InversionStatus = InversionView['status'];

/** Queued and running inversions change; the others are final. */
export const isInversionActive = (status: InversionStatus | undefined): boolean => status === 'queued' || status === 'running';

/** How often a queued or running inversion is asked for its progress (ms); one iteration takes a second or more. */
const PROGRESS_POLL_MS = 1000;

/** The line's inversions, newest first; refreshed while any of them is still queued or running. */
export function useLineInversions(lineId: string) {
  return useQuery({
    queryKey: inversionKeys.list(lineId),
    queryFn: ({ signal }) => apiRequest<InversionView[]>(`/api/lines/${encodeURIComponent(lineId)}/inversions`, { signal }),
    enabled: Boolean(lineId),
    refetchInterval: (q) => (q.state.data?.some((i) => isInversionActive(i.status)) ? 2 * PROGRESS_POLL_MS : false),
    refetchIntervalInBackground: false,
  });
}

/** One inversion, polled while it is queued or running; when it settles the line's list is refreshed too. */
export function useInversion(inversionId: string) {
  const queryClient = useQueryClient();
  const query = useQuery({
    queryKey: inversionKeys.inversion(inversionId),
    queryFn: ({ signal }) => apiRequest<InversionView>(inversionPath(inversionId), { signal }),
    enabled: Boolean(inversionId),
    refetchInterval: (q) => (isInversionActive(q.state.data?.status) ? PROGRESS_POLL_MS : false),
    refetchIntervalInBackground: false,
    staleTime: (q) => (isInversionActive(q.state.data?.status) ? 0 : 30_000),
  });
  const status = query.data?.status;
  const lineId = query.data?.lineId;
  const previous = useRef(status);
  useEffect(() => {
    if (isInversionActive(previous.current) && status && !isInversionActive(status) && lineId) {
      void queryClient.invalidateQueries({ queryKey: inversionKeys.list(lineId) });
    }
    previous.current = status;
  }, [status, lineId, queryClient]);
  return query;
}

/** The final section of a finished inversion; it never changes, so it is fetched once. */
export function useInversionSection(inversionId: string, enabled = true) {
  return useQuery({
    queryKey: inversionKeys.section(inversionId),
    queryFn: ({ signal }) => apiRequest<InversionSectionView>(`${inversionPath(inversionId)}/section`, { signal }),
    enabled: Boolean(inversionId) && enabled,
    staleTime: Infinity,
  });
}

/** Residual rows of a finished inversion, the same shape as a run's. */
export function useInversionResiduals(inversionId: string, enabled = true) {
  return useQuery({
    queryKey: inversionKeys.residuals(inversionId),
    queryFn: ({ signal }) => apiRequest<ResidualRow[]>(`${inversionPath(inversionId)}/residuals`, { signal }),
    enabled: Boolean(inversionId) && enabled,
    staleTime: Infinity,
  });
}

export interface InversionStarted {
  id: string;
  status: InversionStatus;
}

export function useStartInversion(lineId: string) {
  const queryClient = useQueryClient();
  const submission = useSubmissionKey();
  return useMutation({
    mutationFn: (body: StartInversionBody) => apiRequest<InversionStarted>('/api/inversions', { method: 'POST', body, idempotencyKey: submission.current() }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: inversionKeys.list(lineId) }),
    onSettled: submission.renew,
  });
}

export function useCancelInversion(inversionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest<unknown>(`${inversionPath(inversionId)}/cancel`, { method: 'POST' }),
    // Whatever the answer, the inversion's real state is on the server.
    onSettled: () => queryClient.invalidateQueries({ queryKey: inversionKeys.inversion(inversionId) }),
  });
}

export interface InversionModelSaved {
  id: string;
  version: number;
}

/** Save the final model as a new model version of the line; the line's model list changes. */
export function useSaveInversionModel(inversionId: string, lineId: string) {
  const queryClient = useQueryClient();
  const submission = useSubmissionKey();
  return useMutation({
    mutationFn: () => apiRequest<InversionModelSaved>(`${inversionPath(inversionId)}/model`, { method: 'POST', idempotencyKey: submission.current() }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: inversionKeys.inversion(inversionId) });
      await queryClient.invalidateQueries({ queryKey: queryKeys.line(lineId) });
    },
    onSettled: submission.renew,
  });
}
