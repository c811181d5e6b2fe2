import { dataSource } from '../db/dataSource';
import { sToMs } from '../../shared/units';
import type { Grid } from '../../shared/grid';

/** One row per pick, ms at the edge, sorted by shot then receiver x. */
export async function loadResidualRows(runId: string) {
  const rows = await dataSource.query(
    `SELECT pick_index, shot_id, receiver_x, receiver_z, observed_s, computed_s, residual_s, normalised, sigma_s, excluded
     FROM run_residuals WHERE run_id = $1 ORDER BY shot_id, receiver_x, pick_index`,
    [runId],
  );
  return rows.map(presentResidualRow);
}

/** A stored residual row (run_residuals, inversion_residuals) as the API shows it: ms, and flags worth a look. */
export function presentResidualRow(r: Record<string, never>) {
  return {
    pickIndex: r.pick_index,
    shotId: r.shot_id,
    receiverX: r.receiver_x,
    receiverZ: r.receiver_z,
    observedMs: sToMs(r.observed_s),
    computedMs: sToMs(r.computed_s),
    residualMs: sToMs(r.residual_s),
    normalised: r.normalised,
    sigmaMs: sToMs(r.sigma_s),
    excluded: r.excluded,
    // Beyond three sigma: worth a look (common practice, no source).
    flags: [...(r.excluded ? ['excluded'] : []), ...(Math.abs(r.normalised) > 3 ? ['beyond_3_sigma'] : [])],
  };
}

export async function loadFieldRow(runId: string, shotId: string): Promise<{ grid: Grid; source: { x: number; z: number }; data: Buffer } | null> {
  const [row] = await dataSource.query(
    `SELECT f.data, f.source_x, f.source_z, m.content->'grid' AS grid
     FROM run_fields f JOIN runs r ON r.id = f.run_id JOIN velocity_models m ON m.id = r.model_id
     WHERE f.run_id = $1 AND f.shot_id = $2`,
    [runId, shotId],
  );
  if (!row) return null;
  const { x0, dx, nx, z0, dz, nz } = row.grid;
  return { grid: { x0, dx, nx, z0, dz, nz }, source: { x: row.source_x, z: row.source_z }, data: row.data };
}

export async function loadRays(runId: string, shotId?: string) {
  const rows = await dataSource.query(
    `SELECT pick_index, shot_id, ray FROM run_residuals WHERE run_id = $1 AND ray IS NOT NULL ${shotId ? 'AND shot_id = $2' : ''} ORDER BY shot_id, receiver_x`,
    shotId ? [runId, shotId] : [runId],
  );
  return rows.map((r: { pick_index: number; shot_id: string; ray: Buffer }) => {
    const f = new Float32Array(new Uint8Array(r.ray).buffer); // a copy: bytea buffers need not be 4-byte aligned
    return { pickIndex: r.pick_index, shotId: r.shot_id, points: Array.from(f, (v) => Math.round(v * 1000) / 1000) };
  });
}

/** The runs of a line, newest first, with what they solved and their headline figures. */
export async function listLineRuns(lineId: string) {
  const rows = await dataSource.query(
    `SELECT r.id, r.status, r.scheme_order, r.model_id, m.name AS model_name, m.version AS model_version, r.pick_set_id, s.file_name,
            r.pick_set_revision, r.shots_done, r.shots_total, r.stats->'rms_ms' AS rms_ms, r.stats->'chi2' AS chi2,
            r.created_at, r.finished_at, u.name AS created_by_name
     FROM runs r JOIN velocity_models m ON m.id = r.model_id JOIN pick_sets s ON s.id = r.pick_set_id LEFT JOIN users u ON u.id = r.created_by
     WHERE r.line_id = $1 ORDER BY r.created_at DESC`,
    [lineId],
  );
  return rows.map((r: Record<string, never>) => ({
    id: r.id, status: r.status, order: r.scheme_order,
    model: { id: r.model_id, name: r.model_name, version: r.model_version },
    pickSet: { id: r.pick_set_id, fileName: r.file_name, revision: r.pick_set_revision },
    progress: { done: r.shots_done, total: r.shots_total },
    rmsMs: r.rms_ms, chi2: r.chi2, createdAt: r.created_at, finishedAt: r.finished_at, createdBy: r.created_by_name,
  }));
}
