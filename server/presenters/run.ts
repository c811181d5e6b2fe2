import type { Run } from '../entities';

/** GET /api/runs/:runId — state, progress as shots done / total, and the statistics once done. */
export function presentRun(r: Run) {
  return {
    id: r.id,
    lineId: r.lineId,
    modelId: r.modelId,
    pickSetId: r.pickSetId,
    pickSetRevision: r.pickSetRevision,
    order: r.order,
    status: r.status,
    progress: { done: r.shotsDone, total: r.shotsTotal, fraction: r.shotsTotal ? r.shotsDone / r.shotsTotal : 0 },
    stats: r.stats,
    error: r.error ?? undefined,
    createdAt: r.createdAt,
    startedAt: r.startedAt,
    finishedAt: r.finishedAt,
  };
}
