/**
 * The "solve" job: one forward run. Loads the model version and the pick-set revision the run
 * recorded, solves the shots on worker threads and stores each shot (field, residuals, rays) as it
 * finishes, then the statistics. The job id is the run id: a job picked up again after a crash
 * starts over, first removing what an earlier attempt stored, so a run never has two sets of residuals.
 */
import { availableParallelism } from 'node:os';
import type { Job } from 'bullmq';
import Piscina from 'piscina';
import { computeResiduals, type ResidualInput } from '../../shared/residuals';
import { dataSource } from '../../server/db/dataSource';
import { updateReturning } from '../../server/db/returning';
import { loadModelVersion } from '../../server/services/models';
import { listRevisions, loadPicks } from '../../server/services/pickSets';
import { pickIndexOf, prepareRunInputs } from '../../server/services/runInputs';
import { HttpError } from '../../server/http/errors';
import type { PlacedShot } from '../../shared/picks';
import { workerExecArgv } from '../threads/exec-argv';
import type { RunShotResult, RunShotTask } from '../threads/run-shot';
import { shareModel } from '../threads/shared-model';
import { clearRunResults, finishRun, saveShotResults, type StoredShot } from './solveResults';

export class RunCancelled extends Error {}

/** Solver threads of this worker: every core, or WORKER_THREADS to keep the worker's memory lower (README, "Memory"). */
export const SOLVER_THREADS = Math.max(1, Number(process.env.WORKER_THREADS) || availableParallelism());
const THREADS = SOLVER_THREADS;
let pool: Piscina<RunShotTask, RunShotResult> | null = null;
function threads(): Piscina<RunShotTask, RunShotResult> {
  pool ??= new Piscina({
    filename: new URL('../threads/run-shot.ts', import.meta.url).href,
    maxThreads: THREADS,
    idleTimeout: 5 * 60_000,
    execArgv: workerExecArgv(),
  });
  return pool;
}

export async function closeSolvePool(): Promise<void> {
  await pool?.destroy();
  pool = null;
}

const statusOf = async (runId: string): Promise<string | undefined> =>
  (await dataSource.query('SELECT status FROM runs WHERE id = $1', [runId]))[0]?.status;

export async function solveJob(job: Job<{ runId: string }>): Promise<{ runId: string; status: string }> {
  const { runId } = job.data;
  const [run] = await updateReturning<RunRow>(
    `UPDATE runs SET status = 'running', started_at = now(), shots_done = 0, attempts = attempts + 1, error = NULL
     WHERE id = $1 AND status IN ('queued', 'running') RETURNING model_id, pick_set_id, pick_set_revision, scheme_order, attempts`,
    [runId],
  );
  if (!run) return { runId, status: (await statusOf(runId)) ?? 'missing' }; // cancelled before it started
  await clearRunResults(runId);
  try {
    const done = await solveShots(runId, run, job);
    return { runId, status: done ? 'done' : ((await statusOf(runId)) ?? 'missing') };
  } catch (err) {
    // A cancelled or failed run keeps no half set of shots.
    await clearRunResults(runId).catch(() => undefined);
    if (err instanceof RunCancelled) return { runId, status: 'cancelled' };
    const message = err instanceof HttpError ? err.message : `The solve stopped with an error: ${(err as Error).message}`;
    await dataSource.query(`UPDATE runs SET status = 'failed', error = $2, finished_at = now() WHERE id = $1 AND status = 'running'`, [runId, message]);
    throw err;
  }
}

interface RunRow {
  model_id: string;
  pick_set_id: string;
  pick_set_revision: number;
  scheme_order: 1 | 2;
  attempts: number;
}

async function solveShots(runId: string, run: RunRow, job: Job): Promise<boolean> {
  const [model, picks, revisions] = await Promise.all([loadModelVersion(run.model_id), loadPicks(run.pick_set_id), listRevisions(run.pick_set_id)]);
  const revision = revisions.find((r) => r.number === run.pick_set_revision);
  if (!revision) throw new Error(`pick-set revision ${run.pick_set_revision} is missing`);
  const { raster, shots, excluded } = prepareRunInputs(model.model, picks, revision.exclusions.map((e) => e.index));
  const shared = shareModel(raster);
  let activeNodes = 0;
  for (let i = 0; i < raster.active.length; i++) activeNodes += raster.active[i];

  const stored: StoredShot[] = [];
  let solveSeconds = 0;
  // The first shot that fails (or finds the run cancelled) stops the others: queued shots are
  // withdrawn from the thread pool, shots in flight finish but are not stored.
  const stop = new AbortController();
  const solveOne = async (shot: PlacedShot): Promise<void> => {
    const r = await threads().run(
      { grid: raster.grid, ...shared, source: shot.source, receivers: shot.receivers, order: run.scheme_order, modelKey: run.model_id },
      { signal: stop.signal },
    );
    if (!r.ok) throw new Error(`shot ${shot.shotId}: ${r.message}`);
    if (stop.signal.aborted) return;
    solveSeconds += r.solveSeconds;
    const residuals = residualsOf(shot, r.times, excluded);
    const saved = await saveShotResults(runId, run.attempts, {
      shotId: shot.shotId, source: shot.source, field: r.field, picks: residuals.map((p, i) => ({ ...p, ray: r.rays[i] })),
    });
    if (!saved) throw new RunCancelled();
    stored.push({ shotId: shot.shotId, picks: residuals });
    await job.updateProgress({ done: stored.length, total: shots.length });
  };
  await runAll(shots, THREADS, solveOne, stop);
  return finishRun(runId, run.attempts, stored, solveSeconds, activeNodes);
}

function residualsOf(shot: PlacedShot, times: Float64Array, excluded: Set<number>) {
  const inputs: ResidualInput[] = shot.picks.map((p, i) => ({
    shotId: shot.shotId, receiverX: p.receiverX, receiverZ: shot.receivers[2 * i + 1], observed: p.time, computed: times[i], sigma: p.sigma,
  }));
  return computeResiduals(inputs).map((res, i) => ({ ...res, pickIndex: pickIndexOf(shot.picks[i]), excluded: excluded.has(pickIndexOf(shot.picks[i])) }));
}

/**
 * Runs `task` over `items` with at most `limit` in flight (so at most that many fields wait in
 * memory to be stored). The first error aborts `stop` and is thrown once the tasks in flight settle.
 */
export async function runAll<T>(items: readonly T[], limit: number, task: (item: T) => Promise<void>, stop: AbortController): Promise<void> {
  let next = 0;
  let failure: unknown = null;
  const lane = async () => {
    while (next < items.length && !stop.signal.aborted) {
      const item = items[next++];
      try {
        await task(item);
      } catch (err) {
        if (!stop.signal.aborted) {
          failure = err;
          stop.abort();
        }
      }
    }
  };
  await Promise.all(Array.from({ length: Math.min(limit, items.length) }, lane));
  if (failure) throw failure;
}
