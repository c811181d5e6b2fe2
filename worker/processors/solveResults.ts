import type { EntityManager } from 'typeorm';
import { runStats, type Residual } from '../../shared/residuals';
import { sToMs } from '../../shared/units';
import { dataSource } from '../../server/db/dataSource';

export interface ShotOutput {
  shotId: string;
  source: { x: number; z: number };
  /** Float32 field, deflated. */
  field: Uint8Array;
  picks: ShotPick[];
}

export type ShotPick = Residual & { pickIndex: number; excluded: boolean; ray: Float32Array | null };

/** What the end of the run needs from each shot once its field has been written: the residuals, without rays. */
export type StoredShot = { shotId: string; picks: (Residual & { excluded: boolean })[] };

/**
 * The attempt that may write: the row is still running and no later attempt has started
 * (a job picked up again after a stall bumps `attempts`, so a stale worker writes nothing).
 */
async function lockOwnRun(em: EntityManager, runId: string, attempt: number): Promise<boolean> {
  const [run] = await em.query('SELECT status, attempts FROM runs WHERE id = $1 FOR UPDATE', [runId]);
  return run?.status === 'running' && run.attempts === attempt;
}

/** Removes whatever an earlier attempt (or a cancelled or failed one) left. */
export async function clearRunResults(runId: string): Promise<void> {
  await dataSource.transaction(async (em) => {
    await em.query('DELETE FROM run_fields WHERE run_id = $1', [runId]);
    await em.query('DELETE FROM run_residuals WHERE run_id = $1', [runId]);
  });
}

/**
 * Writes one finished shot (field, residuals, rays) and the progress count in one transaction, so
 * memory never holds more than the shots in flight. Returns false (and writes nothing) when the run
 * was cancelled or taken over by a later attempt.
 */
export async function saveShotResults(runId: string, attempt: number, shot: ShotOutput): Promise<boolean> {
  return dataSource.transaction(async (em) => {
    if (!(await lockOwnRun(em, runId, attempt))) return false;
    await em.query('INSERT INTO run_fields (run_id, shot_id, source_x, source_z, data) VALUES ($1, $2, $3, $4, $5)', [runId, shot.shotId, shot.source.x, shot.source.z, Buffer.from(shot.field)]);
    const rows = shot.picks;
    await em.query(
      `INSERT INTO run_residuals (run_id, pick_index, shot_id, receiver_x, receiver_z, observed_s, computed_s, residual_s, normalised, sigma_s, excluded, ray)
       SELECT $1, * FROM unnest($2::int[], $3::text[], $4::float8[], $5::float8[], $6::float8[], $7::float8[], $8::float8[], $9::float8[], $10::float8[], $11::bool[], $12::bytea[])`,
      [
        runId,
        rows.map((r) => r.pickIndex),
        rows.map((r) => r.shotId),
        rows.map((r) => r.receiverX),
        rows.map((r) => r.receiverZ),
        rows.map((r) => r.observed),
        rows.map((r) => r.computed),
        rows.map((r) => r.residual),
        rows.map((r) => r.normalised),
        rows.map((r) => r.sigma),
        rows.map((r) => r.excluded),
        rows.map((r) => (r.ray ? Buffer.from(r.ray.buffer, r.ray.byteOffset, r.ray.byteLength) : null)),
      ],
    );
    await em.query('UPDATE runs SET shots_done = shots_done + 1 WHERE id = $1', [runId]);
    return true;
  });
}

/** Marks the run done with its statistics, once every shot is stored. False when it was cancelled meanwhile. */
export async function finishRun(runId: string, attempt: number, shots: readonly StoredShot[], solveSeconds: number, activeNodes: number): Promise<boolean> {
  return dataSource.transaction(async (em) => {
    if (!(await lockOwnRun(em, runId, attempt))) return false;
    await em.query(`UPDATE runs SET status = 'done', stats = $2, shots_done = shots_total, finished_at = now() WHERE id = $1`, [runId, summarise(shots, solveSeconds, activeNodes)]);
    return true;
  });
}

/** Statistics over the picks that count (not excluded), in ms at the edge. */
export function summarise(outputs: readonly StoredShot[], solveSeconds: number, activeNodes: number) {
  const used = outputs.flatMap((s) => s.picks.filter((p) => !p.excluded));
  const stats = runStats(used);
  const ms = (v: number | null) => (v === null ? null : sToMs(v));
  return {
    rms_ms: ms(stats.run.rms),
    chi2: stats.run.chi2,
    max_abs_residual_ms: ms(stats.run.maxAbs),
    mean_residual_ms: ms(stats.run.mean),
    shots: outputs.length,
    picks: used.length,
    excluded: outputs.reduce((n, s) => n + s.picks.length, 0) - used.length,
    solve_seconds: solveSeconds,
    active_nodes: activeNodes,
    by_shot: stats.shots.map((s) => ({ shotId: s.shotId, count: s.count, rms_ms: ms(s.rms), chi2: s.chi2, max_abs_residual_ms: ms(s.maxAbs), mean_residual_ms: ms(s.mean) })),
    by_receiver: stats.receivers.map((s) => ({ receiverX: s.receiverX, count: s.count, rms_ms: ms(s.rms), chi2: s.chi2, max_abs_residual_ms: ms(s.maxAbs) })),
  };
}
