/**
 * What the "invert" job writes: each iteration as it goes (the resume checkpoint) and, once, the
 * result, residuals and statistics. Every write first checks, under a row lock, that the inversion
 * is still running under this attempt, so a stale worker (taken over after a stall) or a
 * cancelled inversion writes nothing.
 */
import type { EntityManager } from 'typeorm';
import type { CheckerboardResult, InversionCheckpoint, IterationRecord } from '../../shared/inversion/types';
import type { Residual } from '../../shared/residuals';
import { dataSource } from '../../server/db/dataSource';
import { pack, unpackFloat32 } from '../../server/db/packed-arrays';

async function lockOwn(em: EntityManager, id: string, attempt: number): Promise<boolean> {
  const [row] = await em.query('SELECT status, attempts FROM inversions WHERE id = $1 FOR UPDATE', [id]);
  return row?.status === 'running' && row.attempts === attempt;
}

/** True while the inversion is still running under this attempt (polled to notice a cancel). */
export async function stillOwn(id: string, attempt: number): Promise<boolean> {
  const [row] = await dataSource.query('SELECT status, attempts FROM inversions WHERE id = $1', [id]);
  return row?.status === 'running' && row.attempts === attempt;
}

/** Stores one iteration and the rest of the checkpoint in one transaction; false when this attempt may no longer write. */
export async function saveIteration(id: string, attempt: number, record: IterationRecord, checkpoint: InversionCheckpoint): Promise<boolean> {
  return dataSource.transaction(async (em) => {
    if (!(await lockOwn(em, id, attempt))) return false;
    await em.query(
      `INSERT INTO inversion_iterations (inversion_id, iteration, chi2, rms_ms, smoothing, seconds, velocity) VALUES ($1, $2, $3, $4, $5, $6, $7)`,
      [id, record.iteration, record.chi2, record.rmsMs, record.smoothing, record.seconds, pack(checkpoint.velocity)],
    );
    await em.query('UPDATE inversions SET next_smoothing = $2, scale = $3 WHERE id = $1', [id, checkpoint.nextSmoothing, checkpoint.scale]);
    return true;
  });
}

/** The checkpoint of an earlier attempt, from its last stored iteration; undefined when none was stored. */
export async function loadCheckpoint(id: string): Promise<InversionCheckpoint | undefined> {
  const rows: { iteration: number; chi2: number; rms_ms: number; smoothing: number | null; seconds: number }[] = await dataSource.query(
    'SELECT iteration, chi2, rms_ms, smoothing, seconds FROM inversion_iterations WHERE inversion_id = $1 ORDER BY iteration',
    [id],
  );
  if (!rows.length) return undefined;
  const last = rows.at(-1)!.iteration;
  const [{ velocity, next_smoothing, scale }] = await dataSource.query(
    `SELECT it.velocity, i.next_smoothing, i.scale FROM inversion_iterations it JOIN inversions i ON i.id = it.inversion_id WHERE it.inversion_id = $1 AND it.iteration = $2`,
    [id, last],
  );
  return {
    history: rows.map((r) => ({ iteration: r.iteration, chi2: r.chi2, rmsMs: r.rms_ms, smoothing: r.smoothing, seconds: r.seconds })),
    velocity: unpackFloat32(velocity),
    nextSmoothing: next_smoothing,
    scale,
  };
}

export type ResidualRow = Residual & { pickIndex: number; excluded: boolean };

export interface FinalResult {
  velocity: Float32Array;
  coverage: Float32Array;
  hits: Int32Array;
  doi: Float64Array;
  computed: Float64Array;
  shots: { shotId: string; x: number; z: number }[];
  checkerboard?: CheckerboardResult;
  residuals: ResidualRow[];
  stats: object;
}

/** Stores the result, the residual rows and the statistics, and marks the inversion done; false when it was cancelled meanwhile. */
export async function finishInversion(id: string, attempt: number, r: FinalResult): Promise<boolean> {
  return dataSource.transaction(async (em) => {
    if (!(await lockOwn(em, id, attempt))) return false;
    const cb = r.checkerboard;
    await em.query(
      `INSERT INTO inversion_results (inversion_id, velocity, coverage, hits, doi, computed, shots, checkerboard, checker_true, checker_recovered)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10)`,
      [
        id, pack(r.velocity), pack(r.coverage), pack(r.hits), pack(r.doi), pack(r.computed), JSON.stringify(r.shots),
        cb ? JSON.stringify({ size: cb.size, amplitude: cb.amplitude, correlation: cb.correlation, coverageThreshold: cb.coverageThreshold }) : null,
        cb ? pack(cb.truePattern) : null,
        cb ? pack(cb.recovered) : null,
      ],
    );
    const rows = r.residuals;
    await em.query(
      `INSERT INTO inversion_residuals (inversion_id, pick_index, shot_id, receiver_x, receiver_z, observed_s, computed_s, residual_s, normalised, sigma_s, excluded)
       SELECT $1, * FROM unnest($2::int[], $3::text[], $4::float8[], $5::float8[], $6::float8[], $7::float8[], $8::float8[], $9::float8[], $10::float8[], $11::bool[])`,
      [
        id,
        rows.map((p) => p.pickIndex),
        rows.map((p) => p.shotId),
        rows.map((p) => p.receiverX),
        rows.map((p) => p.receiverZ),
        rows.map((p) => p.observed),
        rows.map((p) => p.computed),
        rows.map((p) => p.residual),
        rows.map((p) => p.normalised),
        rows.map((p) => p.sigma),
        rows.map((p) => p.excluded),
      ],
    );
    await em.query(`UPDATE inversions SET status = 'done', stats = $2, finished_at = now() WHERE id = $1`, [id, JSON.stringify(r.stats)]);
    return true;
  });
}
