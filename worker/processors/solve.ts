/**
 * The "solve" job: one forward run. Loads the model version and the pick-set revision the run
 * recorded, solves every shot on worker threads, and writes fields, residuals, rays and statistics
 * in one transaction. The job id is the run id: a job picked up again after a crash starts over
 * and replaces whatever an earlier attempt wrote, so a run never has two sets of residuals.
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
import { workerExecArgv } from '../threads/exec-argv';
import type { RunShotResult, RunShotTask } from '../threads/run-shot';
import { shareModel } from '../threads/shared-model';
import { saveRunResults, type ShotOutput } from './solveResults';

export class RunCancelled extends Error {}

let pool: Piscina<RunShotTask, RunShotResult> | null = null;
function threads(): Piscina<RunShotTask, RunShotResult> {
  pool ??= new Piscina({
    filename: new URL('../threads/run-shot.ts', import.meta.url).href,
    maxThreads: Math.max(1, availableParallelism()),
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
     WHERE id = $1 AND status IN ('queued', 'running') RETURNING model_id, pick_set_id, pick_set_revision, scheme_order`,
    [runId],
  );
  if (!run) return { runId, status: (await statusOf(runId)) ?? 'missing' }; // cancelled before it started
  try {
    const outputs = await solveShots(runId, run, job);
    const done = await saveRunResults(runId, outputs.shots, outputs.solveSeconds, outputs.activeNodes);
    return { runId, status: done ? 'done' : ((await statusOf(runId)) ?? 'missing') };
  } catch (err) {
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
}

async function solveShots(runId: string, run: RunRow, job: Job) {
  const [model, picks, revisions] = await Promise.all([loadModelVersion(run.model_id), loadPicks(run.pick_set_id), listRevisions(run.pick_set_id)]);
  const revision = revisions.find((r) => r.number === run.pick_set_revision);
  if (!revision) throw new Error(`pick-set revision ${run.pick_set_revision} is missing`);
  const { raster, shots, excluded } = prepareRunInputs(model.model, picks, revision.exclusions.map((e) => e.index));
  const { grid } = raster;
  const shared = shareModel(raster);
  let activeNodes = 0;
  for (let i = 0; i < raster.active.length; i++) activeNodes += raster.active[i];

  let done = 0;
  let solveSeconds = 0;
  let cancelled = false;
  const results = await Promise.all(
    shots.map(async (shot): Promise<ShotOutput> => {
      const r = await threads().run({ grid, ...shared, source: shot.source, receivers: shot.receivers, order: run.scheme_order, modelKey: run.model_id });
      if (!r.ok) throw new Error(`shot ${shot.shotId}: ${r.message}`);
      solveSeconds += r.solveSeconds;
      done++;
      // Progress for the page, and a look at whether someone cancelled in the meantime.
      const [row] = await updateReturning<{ status: string }>('UPDATE runs SET shots_done = $2 WHERE id = $1 RETURNING status', [runId, done]);
      if (row?.status !== 'running') cancelled = true;
      await job.updateProgress({ done, total: shots.length });
      const residuals: ResidualInput[] = shot.picks.map((p, i) => ({
        shotId: shot.shotId, receiverX: p.receiverX, receiverZ: shot.receivers[2 * i + 1], observed: p.time, computed: r.times[i], sigma: p.sigma,
      }));
      return {
        shotId: shot.shotId, source: shot.source, field: r.field,
        picks: computeResiduals(residuals).map((res, i) => ({ ...res, pickIndex: pickIndexOf(shot.picks[i]), excluded: excluded.has(pickIndexOf(shot.picks[i])), ray: r.rays[i] })),
      };
    }),
  );
  if (cancelled || (await statusOf(runId)) !== 'running') throw new RunCancelled();
  return { shots: results, solveSeconds, activeNodes };
}
