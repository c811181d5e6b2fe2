/**
 * The "ensemble-member" job: one member of an ensemble of inversions (issue 20). It rebuilds the base
 * inversion's problem from its row, applies the member's recorded draws (shared/uncertainty), runs the
 * inversion, judges the model against the observed picks and stores the member's section. The member
 * that finishes last combines the ensemble (ensembleCombine.ts).
 *
 * Members are short, so they keep no iteration checkpoint: a member whose worker dies is taken up
 * again by another worker (BullMQ's stalled-job check) and starts over; the attempt number fences the
 * stale worker's writes off. A cancel is noticed within a second.
 */
import type { Job } from 'bullmq';
import { invert } from '../../shared/inversion';
import { chi2AgainstOriginal } from '../../shared/uncertainty/perturb';
import { memberProblem, type EnsembleBase } from '../../shared/uncertainty/member';
import type { MemberPlan } from '../../shared/uncertainty/plan';
import { dataSource } from '../../server/db/dataSource';
import { pack } from '../../server/db/packed-arrays';
import { updateReturning } from '../../server/db/returning';
import { WORKER_NAME } from '../identity';
import { combineWhenComplete } from './ensembleCombine';
import { buildProblem, type InversionRow } from './invert';
import { sharedModellers } from './invert-modeller';

const CANCEL_POLL_MS = 1000;

export interface MemberJobData {
  ensembleId: string;
  index: number;
}

export async function ensembleMemberJob(job: Job<MemberJobData>): Promise<{ ensembleId: string; index: number; status: string }> {
  const { ensembleId, index } = job.data;
  const [member] = await updateReturning<{ plan: MemberPlan; attempts: number; inversion_id: string }>(
    `UPDATE ensemble_members m SET status = 'running', attempts = m.attempts + 1, worker = $3, started_at = now(), error = NULL
     FROM ensembles e
     WHERE m.ensemble_id = $1 AND m.index = $2 AND e.id = m.ensemble_id
       AND e.status IN ('queued', 'running') AND m.status IN ('queued', 'running')
     RETURNING m.plan, m.attempts, e.inversion_id`,
    [ensembleId, index, WORKER_NAME],
  );
  if (!member) return { ensembleId, index, status: 'skipped' }; // cancelled, or done by an earlier attempt
  await dataSource.query(`UPDATE ensembles SET status = 'running', started_at = now() WHERE id = $1 AND status = 'queued'`, [ensembleId]);
  try {
    await runMember(ensembleId, index, member.attempts, member.plan, member.inversion_id);
  } catch (err) {
    await dataSource.query(
      `UPDATE ensemble_members SET status = 'failed', error = $4, finished_at = now() WHERE ensemble_id = $1 AND index = $2 AND attempts = $3 AND status = 'running'`,
      [ensembleId, index, member.attempts, `The member stopped with an error: ${(err as Error).message}`],
    );
  }
  await combineWhenComplete(ensembleId);
  const [row] = await dataSource.query('SELECT status FROM ensemble_members WHERE ensemble_id = $1 AND index = $2', [ensembleId, index]);
  return { ensembleId, index, status: row?.status ?? 'missing' };
}

async function runMember(ensembleId: string, index: number, attempt: number, plan: MemberPlan, inversionId: string): Promise<void> {
  const started = performance.now();
  const base = await ensembleBase(inversionId);
  const problem = memberProblem(base, plan);
  const stop = new AbortController();
  const own = async () => {
    const [row] = await dataSource.query('SELECT status, attempts FROM ensemble_members WHERE ensemble_id = $1 AND index = $2', [ensembleId, index]);
    return row?.status === 'running' && row.attempts === attempt;
  };
  const watch = setInterval(() => void own().then((mine) => mine || stop.abort(), () => undefined), CANCEL_POLL_MS);
  const modellers = sharedModellers();
  try {
    const result = await invert(problem, modellers.modeller(problem), { signal: stop.signal });
    if (result.stopReason === 'cancelled' || stop.signal.aborted) return;
    const last = result.history.at(-1)!;
    const chi2 = chi2AgainstOriginal(base.problem.shots, problem.shots, result.computed);
    await dataSource.query(
      `UPDATE ensemble_members SET status = 'done', chi2 = $4, rms_ms = $5, iterations = $6, seconds = $7, velocity = $8, coverage = $9, doi = $10, finished_at = now()
       WHERE ensemble_id = $1 AND index = $2 AND attempts = $3 AND status = 'running'`,
      [ensembleId, index, attempt, Number.isFinite(chi2) ? chi2 : null, last.rmsMs, last.iteration, (performance.now() - started) / 1000, pack(result.velocity), pack(result.coverage), pack(result.doi)],
    );
  } finally {
    clearInterval(watch);
    await modellers.close();
  }
}

/** The base inversion's problem and the gradient it fitted; kept for the next member of the same ensemble. */
let cached: { inversionId: string; base: EnsembleBase } | null = null;

async function ensembleBase(inversionId: string): Promise<EnsembleBase> {
  if (cached?.inversionId === inversionId) return cached.base;
  const [row] = await dataSource.query(
    `SELECT id, pick_set_id, pick_set_revision, start_kind, start_model_id, start_v0, start_k, grid, surface, settings, attempts FROM inversions WHERE id = $1`,
    [inversionId],
  );
  if (!row) throw new Error('the base inversion was deleted');
  const { problem, raster } = await buildProblem(row as InversionRow);
  const base: EnsembleBase = {
    problem,
    surfaceZ: raster.surfaceZ,
    fit: row.start_kind === 'gradient' && row.start_v0 !== null ? { v0: row.start_v0, k: row.start_k } : null,
  };
  cached = { inversionId, base };
  return base;
}
