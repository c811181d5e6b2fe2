import { randomInt } from 'node:crypto';
import type { Queue } from 'bullmq';
import type { StartEnsembleBody } from '../../shared/schemas/ensembles';
import { planMembers } from '../../shared/uncertainty/plan';
import { dataSource } from '../db/dataSource';
import { HttpError } from '../http/errors';
import { addJobs } from '../queue/queue';
import { audit } from './audit';

/** The queue's job id of a member, so a repeated add never duplicates it (BullMQ refuses ':' in custom ids). */
export const memberJobId = (ensembleId: string, index: number) => `ensemble-${ensembleId}-${index}`;

/**
 * Records an ensemble of a finished inversion (same pick-set revision, grid, start and settings) with
 * one row per member and its seeded draws, then queues one job per member, so the members spread
 * over every worker on the queue.
 */
export async function startEnsemble(actorId: string, projectId: string, inversionId: string, body: StartEnsembleBody, queue: Queue): Promise<{ id: string; status: string }> {
  const [base] = await dataSource.query('SELECT status, line_id FROM inversions WHERE id = $1', [inversionId]);
  if (!base) throw new HttpError(404, 'not_found', 'Not found.');
  if (base.status !== 'done') throw new HttpError(409, 'not_done', `The inversion is ${base.status}; an ensemble repeats a finished inversion.`);
  const seed = body.seed ?? randomInt(0, 2 ** 32);
  const plans = planMembers(body.members, seed, body.vary);
  const id: string = await dataSource.transaction(async (em) => {
    const [row] = await em.query(
      `INSERT INTO ensembles (inversion_id, line_id, members, seed, variation, rock_velocity_min, rock_velocity_max, coverage_threshold, label, created_by)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10) RETURNING id`,
      [inversionId, base.line_id, body.members, seed, JSON.stringify(body.vary), body.rockVelocity, body.rockVelocityMax ?? body.rockVelocity, body.coverageThreshold, body.label, actorId],
    );
    await em.query(
      `INSERT INTO ensemble_members (ensemble_id, index, plan) SELECT $1, * FROM unnest($2::int[], $3::jsonb[])`,
      [row.id, plans.map((p) => p.index), plans.map((p) => JSON.stringify(p))],
    );
    await audit(em, {
      actorId, action: 'ensemble.start', objectType: 'ensemble', objectId: row.id, projectId,
      detail: { inversionId, members: body.members, seed, vary: body.vary, rockVelocity: [body.rockVelocity, body.rockVelocityMax ?? body.rockVelocity] },
    });
    return row.id;
  });
  try {
    await addJobs(queue, plans.map((p) => ({ name: 'ensemble-member', data: { ensembleId: id, index: p.index }, jobId: memberJobId(id, p.index) })));
  } catch (err) {
    // No row may wait for jobs that were never queued.
    await dataSource.transaction(async (em) => {
      await em.query('DELETE FROM ensembles WHERE id = $1', [id]);
      await audit(em, { actorId, action: 'ensemble.not_queued', objectType: 'ensemble', objectId: id, projectId, detail: { reason: 'queue unreachable' } });
    });
    throw err;
  }
  return { id, status: 'queued' };
}

/** Cancels every member that has not finished; running members notice within about a second. */
export async function cancelEnsemble(actorId: string, projectId: string, ensembleId: string, queue: Queue): Promise<void> {
  const waiting: number[] = await dataSource.transaction(async (em) => {
    const [found] = await em.query('SELECT status FROM ensembles WHERE id = $1 FOR UPDATE', [ensembleId]);
    if (!found) throw new HttpError(404, 'not_found', 'Not found.');
    if (found.status !== 'queued' && found.status !== 'running') throw new HttpError(409, 'not_cancellable', `The ensemble is already ${found.status}.`);
    await em.query(`UPDATE ensembles SET status = 'cancelled', finished_at = now() WHERE id = $1`, [ensembleId]);
    const rows = await em.query(
      `UPDATE ensemble_members SET status = 'cancelled', finished_at = now() WHERE ensemble_id = $1 AND status IN ('queued', 'running') RETURNING index`,
      [ensembleId],
    );
    await audit(em, { actorId, action: 'ensemble.cancel', objectType: 'ensemble', objectId: ensembleId, projectId });
    return (Array.isArray(rows[0]) ? rows[0] : rows).map((r: { index: number }) => r.index);
  });
  // Waiting jobs are removed; active ones are locked by their workers and stop on their own.
  for (const index of waiting) {
    const job = await queue.getJob(memberJobId(ensembleId, index)).catch(() => undefined);
    if (job && (await job.isWaiting().catch(() => false))) await job.remove().catch(() => undefined);
  }
}
