import { runStats, type Residual } from '../../shared/residuals';
import { sToMs } from '../../shared/units';
import { dataSource } from '../../server/db/dataSource';

export interface ShotOutput {
  shotId: string;
  source: { x: number; z: number };
  /** Float32 field, deflated. */
  field: Uint8Array;
  picks: (Residual & { pickIndex: number; excluded: boolean; ray: Float32Array | null })[];
}

/**
 * Writes a finished run in one transaction, replacing anything an earlier attempt left.
 * Returns false (and writes nothing) when the run was cancelled meanwhile.
 */
export async function saveRunResults(runId: string, shots: readonly ShotOutput[], solveSeconds: number, activeNodes: number): Promise<boolean> {
  return dataSource.transaction(async (em) => {
    const [run] = await em.query('SELECT status FROM runs WHERE id = $1 FOR UPDATE', [runId]);
    if (run?.status !== 'running') return false;
    await em.query('DELETE FROM run_fields WHERE run_id = $1', [runId]);
    await em.query('DELETE FROM run_residuals WHERE run_id = $1', [runId]);
    for (const s of shots) {
      await em.query('INSERT INTO run_fields (run_id, shot_id, source_x, source_z, data) VALUES ($1, $2, $3, $4, $5)', [runId, s.shotId, s.source.x, s.source.z, Buffer.from(s.field)]);
    }
    const rows = shots.flatMap((s) => s.picks);
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
    await em.query(`UPDATE runs SET status = 'done', stats = $2, shots_done = shots_total, finished_at = now() WHERE id = $1`, [runId, summarise(shots, solveSeconds, activeNodes)]);
    return true;
  });
}

/** Statistics over the picks that count (not excluded), in ms at the edge. */
export function summarise(outputs: readonly ShotOutput[], solveSeconds: number, activeNodes: number) {
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
