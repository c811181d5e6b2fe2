import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { EnsembleMemberView, EnsembleSectionView, EnsembleView } from '../../shared/schemas/ensembles';
import { apiRequest } from './client';
import { ensembleKeys } from './keys';
import { useSubmissionKey } from './submissionKey';

const ensemblePath = (ensembleId: string) => `/api/ensembles/${encodeURIComponent(ensembleId)}`;

/** Queued and running ensembles change; the others are final. */
export const isEnsembleActive = (status: EnsembleView['status'] | undefined): boolean => status === 'queued' || status === 'running';

/** Members take seconds each; a second and a half keeps the progress live without flooding the API. */
const PROGRESS_POLL_MS = 1500;

export function useInversionEnsembles(inversionId: string, enabled = true) {
  return useQuery({
    queryKey: ensembleKeys.list(inversionId),
    queryFn: ({ signal }) => apiRequest<EnsembleView[]>(`/api/inversions/${encodeURIComponent(inversionId)}/ensembles`, { signal }),
    enabled: Boolean(inversionId) && enabled,
    refetchInterval: (q) => (q.state.data?.some((e) => isEnsembleActive(e.status)) ? 2 * PROGRESS_POLL_MS : false),
    refetchIntervalInBackground: false,
  });
}

export function useEnsemble(ensembleId: string) {
  return useQuery({
    queryKey: ensembleKeys.ensemble(ensembleId),
    queryFn: ({ signal }) => apiRequest<EnsembleView>(ensemblePath(ensembleId), { signal }),
    enabled: Boolean(ensembleId),
    refetchInterval: (q) => (isEnsembleActive(q.state.data?.status) ? PROGRESS_POLL_MS : false),
    refetchIntervalInBackground: false,
  });
}

/** Every member's state and draws; polled with the ensemble while it runs, and read once more when the ensemble's state changes (its last members). */
export function useEnsembleMembers(ensembleId: string, status: EnsembleView['status'] | undefined) {
  const active = isEnsembleActive(status);
  return useQuery({
    queryKey: [...ensembleKeys.members(ensembleId), status ?? 'unknown'],
    queryFn: ({ signal }) => apiRequest<EnsembleMemberView[]>(`${ensemblePath(ensembleId)}/members`, { signal }),
    enabled: Boolean(ensembleId),
    refetchInterval: active ? PROGRESS_POLL_MS : false,
    refetchIntervalInBackground: false,
  });
}

export function useEnsembleSection(ensembleId: string, enabled: boolean) {
  return useQuery({
    queryKey: ensembleKeys.section(ensembleId),
    queryFn: ({ signal }) => apiRequest<EnsembleSectionView>(`${ensemblePath(ensembleId)}/section`, { signal }),
    enabled: Boolean(ensembleId) && enabled,
    staleTime: Infinity,
  });
}

export interface StartEnsembleInput {
  members: number;
  vary: { start: boolean; smoothing: boolean; picks: 'none' | 'sigma' | 'bootstrap' };
  rockVelocity: number;
  rockVelocityMax?: number;
  seed?: number;
  label?: string;
}

export function useStartEnsemble(inversionId: string) {
  const queryClient = useQueryClient();
  const submission = useSubmissionKey();
  return useMutation({
    mutationFn: (body: StartEnsembleInput) =>
      apiRequest<{ id: string; status: string }>(`/api/inversions/${encodeURIComponent(inversionId)}/ensembles`, { method: 'POST', body, idempotencyKey: submission.current() }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ensembleKeys.list(inversionId) }),
    onSettled: submission.renew,
  });
}

export function useCancelEnsemble(ensembleId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest<EnsembleView>(`${ensemblePath(ensembleId)}/cancel`, { method: 'POST' }),
    onSettled: async () => {
      await queryClient.invalidateQueries({ queryKey: ensembleKeys.ensemble(ensembleId) });
      await queryClient.invalidateQueries({ queryKey: ensembleKeys.members(ensembleId) });
    },
  });
}
