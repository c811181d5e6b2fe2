/**
 * The "invert" job: one travel-time inversion. Builds the problem from what the row recorded (the
 * pick-set revision's picks on the recorded grid and surface, the start), runs the engine
 * (shared/inversion) with its forward steps on worker threads, stores every iteration as it goes,
 * then the result. The job id is the inversion id: a job taken up again after its worker died
 * goes on from the last stored iteration (the checkpoint), so history rows are never written twice
 * and the result is written once. A cancel is noticed within a second and stops the engine.
 */
import type { Job } from 'bullmq';
import { gradientStart, inversionShots, invert } from '../../shared/inversion';
import type { InversionProblem, InversionResult, InversionSettings } from '../../shared/inversion/types';
import { rasteriseModel } from '../../shared/model';
import type { PlacedShot } from '../../shared/picks';
import { computeResiduals } from '../../shared/residuals';
import type { Grid } from '../../shared/grid';
import { dataSource } from '../../server/db/dataSource';
import { updateReturning } from '../../server/db/returning';
import { HttpError } from '../../server/http/errors';
import { placeInversionPicks, surfaceRaster } from '../../server/services/inversionInputs';
import { loadModelVersion } from '../../server/services/models';
import { listRevisions, loadPicks, type StoredPick } from '../../server/services/pickSets';
import { openModellers } from './invert-modeller';
import { finishInversion, loadCheckpoint, saveIteration, stillOwn, type ResidualRow } from './invertResults';

/** How often a running inversion looks whether it was cancelled (ms). */
const CANCEL_POLL_MS = 1000;

export interface InversionRow {
  id: string;
  pick_set_id: string;
  pick_set_revision: number;
  start_kind: 'gradient' | 'model';
  start_model_id: string | null;
  start_v0: number | null;
  grid: Grid;
  surface: [number, number][] | null;
  settings: InversionSettings;
  attempts: number;
}

const statusOf = async (id: string): Promise<string> =>
  (await dataSource.query('SELECT status FROM inversions WHERE id = $1', [id]))[0]?.status ?? 'missing';

export async function invertJob(job: Job<{ inversionId: string }>): Promise<{ inversionId: string; status: string }> {
  const id = job.data.inversionId;
  const [row] = await updateReturning<InversionRow>(
    `UPDATE inversions SET status = 'running', started_at = now(), attempts = attempts + 1, error = NULL
     WHERE id = $1 AND status IN ('queued', 'running')
     RETURNING id, pick_set_id, pick_set_revision, start_kind, start_model_id, start_v0, grid, surface, settings, attempts`,
    [id],
  );
  if (!row) return { inversionId: id, status: await statusOf(id) }; // cancelled before it started
  try {
    await runInversion(row, job);
    return { inversionId: id, status: await statusOf(id) };
  } catch (err) {
    const why = (err as Error).message;
    const message = err instanceof HttpError ? `The inversion could not start: ${why}` : `The inversion stopped with an error: ${why}`;
    await dataSource.query(`UPDATE inversions SET status = 'failed', error = $2, finished_at = now() WHERE id = $1 AND status = 'running' AND attempts = $3`, [id, message, row.attempts]);
    throw err;
  }
}

async function runInversion(row: InversionRow, job: Job): Promise<void> {
  const started = performance.now();
  const { problem, placed } = await buildProblem(row);
  const resumeFrom = await loadCheckpoint(row.id);
  const stop = new AbortController();
  const watch = setInterval(() => {
    stillOwn(row.id, row.attempts).then((own) => own || stop.abort(), () => undefined);
  }, CANCEL_POLL_MS);
  const modellers = await openModellers();
  try {
    const result = await invert(problem, modellers.modeller(problem), {
      signal: stop.signal,
      resumeFrom,
      onIteration: async (record, checkpoint) => {
        if (!(await saveIteration(row.id, row.attempts, record, checkpoint))) return stop.abort();
        await job.updateProgress({ iteration: record.iteration, maxIterations: problem.settings.maxIterations });
      },
    });
    if (result.stopReason === 'cancelled' || stop.signal.aborted) return;
    // Excluded picks are not inverted, but their residuals against the final model are shown (flagged), as runs show them.
    const excludedShots = inversionShots(placed.excludedShots);
    const excludedTimes = excludedShots.length ? (await modellers.modeller({ ...problem, shots: excludedShots }).forward(result.velocity)).times : new Float64Array(0);
    const residuals = [...residualRows(placed.shots, result.computed, false), ...residualRows(placed.excludedShots, excludedTimes, true)];
    const resumedSeconds = resumeFrom ? resumeFrom.history.reduce((s, r) => s + r.seconds, 0) : 0;
    await finishInversion(row.id, row.attempts, {
      velocity: result.velocity,
      coverage: result.coverage,
      hits: result.hits,
      doi: result.doi,
      computed: result.computed,
      shots: placed.shots.map((s) => ({ shotId: s.shotId, x: s.source.x, z: s.source.z })),
      checkerboard: result.checkerboard,
      residuals,
      stats: statsOf(result, placed.picks, placed.shots.length, (performance.now() - started) / 1000 + resumedSeconds),
    });
  } finally {
    clearInterval(watch);
    await modellers.close();
  }
}

/** The engine's problem from the recorded inputs; the gradient start is fitted again (deterministic) and recorded once. */
export async function buildProblem(row: InversionRow) {
  const [picks, revisions] = await Promise.all([loadPicks(row.pick_set_id), listRevisions(row.pick_set_id)]);
  const revision = revisions.find((r) => r.number === row.pick_set_revision);
  if (!revision) throw new Error(`pick-set revision ${row.pick_set_revision} is missing`);
  const raster = row.start_kind === 'model' ? rasteriseModel((await loadModelVersion(row.start_model_id!)).model) : surfaceRaster(row.grid, row.surface);
  const placed = placeInversionPicks(raster, picks, revision.exclusions.map((e) => e.index));
  const shots = inversionShots(placed.shots);
  let start = raster.velocity;
  if (row.start_kind === 'gradient') {
    const fit = gradientStart(raster.grid, raster.active, raster.surfaceZ, shots, row.settings);
    start = fit.velocity;
    if (row.start_v0 === null) await dataSource.query('UPDATE inversions SET start_v0 = $2, start_k = $3 WHERE id = $1', [row.id, fit.v0, fit.k]);
  }
  // A saved model's own structure (its layers) is kept: the smoothing measures the change from it.
  const problem: InversionProblem = { grid: raster.grid, active: raster.active, start, shots, settings: row.settings, surface: raster.surface, smoothingActsOn: row.start_kind === 'model' ? 'departure' : 'model' };
  return { problem, placed, raster };
}

/** Residual rows in problem order; picks no wave reaches (no finite time) have no row. */
function residualRows(shots: readonly PlacedShot[], computed: Float64Array, excluded: boolean): ResidualRow[] {
  const out: ResidualRow[] = [];
  let at = 0;
  for (const shot of shots) {
    shot.picks.forEach((p, i) => {
      const t = computed[at++];
      if (!Number.isFinite(t)) return;
      const [r] = computeResiduals([{ shotId: shot.shotId, receiverX: p.receiverX, receiverZ: shot.receivers[2 * i + 1], observed: p.time, computed: t, sigma: p.sigma }]);
      out.push({ ...r, pickIndex: (p as StoredPick).index, excluded });
    });
  }
  return out;
}

/** InversionView.stats: the last iteration's misfit, counts, why it stopped, and where the time went. */
function statsOf(result: InversionResult, picks: number, shots: number, totalSeconds: number) {
  const last = result.history.at(-1)!;
  const round = (v: number) => Math.round(v * 1000) / 1000;
  return {
    chi2: last.chi2,
    rms_ms: last.rmsMs,
    picks,
    shots,
    iterations: last.iteration,
    stopReason: result.stopReason,
    checkerboardCorrelation: result.checkerboard?.correlation ?? null,
    timings: { forward: round(result.timings.forwardSeconds), matrix: round(result.timings.matrixSeconds), lsqr: round(result.timings.lsqrSeconds), total: round(totalSeconds) },
  };
}
