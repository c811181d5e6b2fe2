import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ModelFile } from '../../shared/model';
import { apiRequest } from './client';
import { modelKeys, queryKeys } from './keys';
import type { LineDetail, ModelSaved, ModelVersionDetail, ModelVersionSummary } from './types';

/** The line's saved versions, as GET /api/lines/:lineId lists them (its type there is still open). */
export const lineModelVersions = (models: unknown[]): ModelVersionSummary[] => models as ModelVersionSummary[];

/** One saved version; versions are immutable, so it never goes stale. */
export function useModelVersion(modelId: string | null) {
  return useQuery({
    queryKey: modelKeys.version(modelId ?? ''),
    queryFn: ({ signal }) => apiRequest<ModelVersionDetail>(`/api/models/${encodeURIComponent(modelId ?? '')}`, { signal }),
    enabled: Boolean(modelId),
    staleTime: Infinity,
  });
}

export interface SaveModelInput {
  model: ModelFile;
  name: string;
  comment: string;
  basedOn: string | null;
}

/** Save as a new version (never overwrites); the line's version list is refreshed afterwards. */
export function useSaveModel(lineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ model, name, comment, basedOn }: SaveModelInput) => {
      const q = new URLSearchParams({ name });
      if (comment) q.set('comment', comment);
      if (basedOn) q.set('basedOn', basedOn);
      return apiRequest<ModelSaved>(`/api/lines/${encodeURIComponent(lineId)}/models?${q.toString()}`, { method: 'POST', body: model });
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.line(lineId) }),
  });
}

/**
 * The line (stations, pick sets, versions) for the model pages. Same key and request as
 * useLine in lines.ts, so the two share one cache entry; this one can wait for a line id that
 * is only known once a model version has loaded.
 */
export function useLineOfModel(lineId: string | null) {
  return useQuery({
    queryKey: queryKeys.line(lineId ?? ''),
    queryFn: ({ signal }) => apiRequest<LineDetail>(`/api/lines/${encodeURIComponent(lineId ?? '')}`, { signal }),
    enabled: Boolean(lineId),
  });
}
