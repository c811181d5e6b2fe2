import type { InversionIterationView, InversionView } from '../../shared/schemas/inversions';
import type { Inversion } from '../entities';

export interface IterationRow {
  iteration: number;
  chi2: number;
  rms_ms: number;
  smoothing: number | null;
}

/** GET /api/inversions/:inversionId (and each row of a line's list): inputs, state, live history, statistics. */
export function presentInversion(i: Inversion, iterations: readonly IterationRow[], startModelVersion: number | null): InversionView {
  const history: InversionIterationView[] = iterations.map((r) => ({ iteration: r.iteration, chi2: r.chi2, rmsMs: r.rms_ms, smoothing: r.smoothing }));
  const { x0, dx, nx, z0, dz, nz } = i.grid;
  return {
    id: i.id,
    lineId: i.lineId,
    label: i.label,
    status: i.status,
    pickSetId: i.pickSetId,
    pickSetRevision: i.pickSetRevision,
    start: i.startKind === 'model'
      ? { kind: 'model', modelId: i.startModelId!, modelVersion: startModelVersion }
      : { kind: 'gradient', spacing: i.startSpacing!, v0: i.startV0, k: i.startK },
    grid: { x0, dx, nx, z0, dz, nz },
    settings: i.settings,
    history,
    progress: { iteration: history.at(-1)?.iteration ?? 0, maxIterations: i.settings.maxIterations },
    stats: (i.stats as InversionView['stats']) ?? null,
    ...(i.error ? { error: i.error } : {}),
    savedModelId: i.savedModelId,
    createdAt: i.createdAt.toISOString(),
    startedAt: i.startedAt?.toISOString() ?? null,
    finishedAt: i.finishedAt?.toISOString() ?? null,
  };
}
