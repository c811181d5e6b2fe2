import { useSubmissionKey } from './submissionKey';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import type { Grid } from '../../shared/grid';
import type { ModelFile } from '../../shared/model';
import { apiRequest } from './client';
import { ApiError, toApiError } from './errors';
import { queryKeys, runKeys } from './keys';
import type { LineDetail, LineRunSummary, PersonRef, PickSetDetail, RayPath, ResidualRow, RunDetail, RunStarted, RunStatus, StartRunBody } from './types';

const runPath = (runId: string) => `/api/runs/${encodeURIComponent(runId)}`;

/** Queued and running runs change; the others are final. */
export const isRunActive = (status: RunStatus | undefined): boolean => status === 'queued' || status === 'running';

/** The line's runs, as GET /api/lines/:lineId lists them (the line type keeps them open). */
export const lineRuns = (runs: unknown[]): LineRunSummary[] => runs as LineRunSummary[];

/** How often a queued or running run is asked for its progress (ms). A demo run takes a few seconds. */
const PROGRESS_POLL_MS = 600;

/**
 * One run, polled while it is queued or running. When it settles, the line (whose run list
 * shows status and headline misfit) is refreshed too.
 */
export function useRun(runId: string) {
  const queryClient = useQueryClient();
  const query = useQuery({
    queryKey: runKeys.run(runId),
    queryFn: ({ signal }) => apiRequest<RunDetail>(runPath(runId), { signal }),
    enabled: Boolean(runId),
    refetchInterval: (q) => (isRunActive(q.state.data?.status) ? PROGRESS_POLL_MS : false),
    refetchIntervalInBackground: false,
    staleTime: (q) => (isRunActive(q.state.data?.status) ? 0 : Infinity),
  });
  const status = query.data?.status;
  const lineId = query.data?.lineId;
  const previous = useRef(status);
  useEffect(() => {
    if (isRunActive(previous.current) && status && !isRunActive(status) && lineId) {
      void queryClient.invalidateQueries({ queryKey: queryKeys.line(lineId) });
    }
    previous.current = status;
  }, [status, lineId, queryClient]);
  return query;
}

export function useStartRun(lineId: string) {
  const queryClient = useQueryClient();
  const submission = useSubmissionKey();
  return useMutation({
    mutationFn: (body: StartRunBody) => apiRequest<RunStarted>('/api/runs', { method: 'POST', body, idempotencyKey: submission.current() }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.line(lineId) }),
    onSettled: submission.renew,
  });
}

export function useCancelRun(runId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest<RunDetail>(`${runPath(runId)}/cancel`, { method: 'POST' }),
    onSuccess: (run) => {
      queryClient.setQueryData(runKeys.run(runId), run);
      return queryClient.invalidateQueries({ queryKey: queryKeys.line(run.lineId) });
    },
    // "Already finished": the run moved on meanwhile, so fetch its real state.
    onError: () => queryClient.invalidateQueries({ queryKey: runKeys.run(runId) }),
  });
}

/** Residual rows of a finished run; they never change, so they are fetched once. */
export function useResiduals(runId: string, enabled = true) {
  return useQuery({
    queryKey: runKeys.residuals(runId),
    queryFn: ({ signal }) => apiRequest<ResidualRow[]>(`${runPath(runId)}/residuals`, { signal }),
    enabled: Boolean(runId) && enabled,
    staleTime: Infinity,
  });
}

export function useRays(runId: string, shotId: string | null) {
  return useQuery({
    queryKey: runKeys.rays(runId, shotId ?? ''),
    queryFn: ({ signal }) => apiRequest<RayPath[]>(`${runPath(runId)}/rays?shotId=${encodeURIComponent(shotId ?? '')}`, { signal }),
    enabled: Boolean(runId && shotId),
    staleTime: Infinity,
  });
}

/** A Float32 grid sent as bytes (travel times in s, or velocities in m/s); NaN marks air. */
export interface BinaryGrid {
  grid: Grid;
  values: Float32Array;
  /** The shot's source position (travel-time fields only). */
  source: { x: number; z: number } | null;
}

function parseHeaderJson(res: Response, name: string): unknown {
  const text = res.headers.get(name);
  if (!text) return null;
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

function isGrid(g: unknown): g is Grid {
  if (!g || typeof g !== 'object') return false;
  const o = g as Record<string, unknown>;
  return ['x0', 'dx', 'nx', 'z0', 'dz', 'nz'].every((k) => typeof o[k] === 'number' && Number.isFinite(o[k]));
}

/** Fetch a binary grid with the session cookie; the grid shape must match the byte count exactly. */
export async function fetchBinaryGrid(path: string, signal?: AbortSignal): Promise<BinaryGrid> {
  const res = await fetch(path, { credentials: 'same-origin', signal, headers: { Accept: 'application/octet-stream' } });
  if (!res.ok) throw await toApiError(res);
  const grid = parseHeaderJson(res, 'X-Grid');
  const bytes = await res.arrayBuffer();
  if (!isGrid(grid) || grid.nx * grid.nz * 4 !== bytes.byteLength) {
    throw new ApiError(502, 'bad_grid', 'The grid arrived incomplete or without its description. Reload the page to try again.');
  }
  const source = parseHeaderJson(res, 'X-Source') as { x: number; z: number } | null;
  return { grid, values: new Float32Array(bytes), source };
}

const fieldQuery = (runId: string, shotId: string) => ({
  queryKey: runKeys.field(runId, shotId),
  queryFn: ({ signal }: { signal: AbortSignal }) => fetchBinaryGrid(`${runPath(runId)}/fields/${encodeURIComponent(shotId)}`, signal),
  staleTime: Infinity,
  // A field is ~0.2 MB on the demo grid and up to 8 MB on the largest; keep a few minutes, not forever.
  gcTime: 5 * 60_000,
});

/** One shot's travel-time field, cached per (run, shot). */
export function useShotField(runId: string, shotId: string | null) {
  return useQuery({ ...fieldQuery(runId, shotId ?? ''), enabled: Boolean(runId && shotId) });
}

/** Warm the cache for shots the user is likely to pick next, so switching feels instant. */
export function usePrefetchFields(runId: string, shotIds: string[]) {
  const queryClient = useQueryClient();
  // A string key, so a new array with the same shots does not prefetch again.
  const key = shotIds.join('\u0000');
  useEffect(() => {
    if (!runId || !key) return;
    for (const shotId of key.split('\u0000')) void queryClient.prefetchQuery(fieldQuery(runId, shotId));
  }, [runId, key, queryClient]);
}

/** The solved model version: its file (surface, layer bases) as saved. */
export interface RunModel {
  id: string;
  lineId: string;
  name: string;
  version: number;
  comment: string;
  createdAt: string;
  createdBy: PersonRef | null;
  model: ModelFile;
}

export function useRunModel(modelId: string | undefined) {
  return useQuery({
    queryKey: runKeys.model(modelId ?? ''),
    queryFn: ({ signal }) => apiRequest<RunModel>(`/api/models/${encodeURIComponent(modelId ?? '')}`, { signal }),
    enabled: Boolean(modelId),
    staleTime: Infinity,
  });
}

/** The model's rasterised velocities (m/s), exactly as the solver saw them. */
export function useModelGrid(modelId: string | undefined) {
  return useQuery({
    queryKey: runKeys.modelGrid(modelId ?? ''),
    queryFn: ({ signal }) => fetchBinaryGrid(`/api/models/${encodeURIComponent(modelId ?? '')}/grid`, signal),
    enabled: Boolean(modelId),
    staleTime: Infinity,
  });
}

/** The run's line (stations, its other runs). Same cache entry as the line page, so it is often there already. */
export function useRunLine(lineId: string | undefined) {
  return useQuery({
    queryKey: queryKeys.line(lineId ?? ''),
    queryFn: ({ signal }) => apiRequest<LineDetail>(`/api/lines/${encodeURIComponent(lineId ?? '')}`, { signal }),
    enabled: Boolean(lineId),
  });
}

/** The shots (source positions) of the pick set revision a run used. Shares the line page's cache entry. */
export function useRunShots(pickSetId: string | undefined, revision: number | undefined) {
  return useQuery({
    queryKey: queryKeys.pickSetRevision(pickSetId ?? '', revision ?? null),
    queryFn: ({ signal }) =>
      apiRequest<PickSetDetail>(`/api/picksets/${encodeURIComponent(pickSetId ?? '')}${revision === undefined ? '' : `?revision=${revision}`}`, { signal }),
    enabled: Boolean(pickSetId),
    staleTime: 5 * 60_000,
    select: (d) => d.shots,
  });
}
