import type { Queue } from 'bullmq';
import { dataSource } from '../db/dataSource';
import { Run } from '../entities';
import { HttpError } from '../http/errors';
import { addJob } from '../queue/queue';
import type { StartRunBody } from '../../shared/schemas/runs';
import { audit } from './audit';
import { loadModelVersion } from './models';
import { listRevisions, loadPicks, refuseRetired } from './pickSets';
import { prepareRunInputs } from './runInputs';

/**
 * Checks everything a solve needs before anything is queued (same line, grid within limits,
 * every source and receiver inside the model and in the ground), then records the run and queues it.
 */
export async function startRun(actorId: string, projectId: string, body: StartRunBody, queue: Queue): Promise<Run> {
  const model = await loadModelVersion(body.modelId);
  const [pickSet] = await dataSource.query('SELECT s.line_id, l.project_id FROM pick_sets s JOIN survey_lines l ON l.id = s.line_id WHERE s.id = $1', [body.pickSetId]);
  // A pick set of another project looks exactly like one that does not exist.
  if (!pickSet || pickSet.project_id !== projectId) {
    throw new HttpError(422, 'validation_failed', 'pickSetId: no pick set of this project has that id', [{ path: 'pickSetId', message: 'no pick set of this project has that id' }]);
  }
  await refuseRetired(body.pickSetId);
  if (pickSet.line_id !== model.lineId) {
    throw new HttpError(409, 'different_lines', 'The model and the pick set belong to different survey lines.');
  }
  const [picks, revisions] = await Promise.all([loadPicks(body.pickSetId), listRevisions(body.pickSetId)]);
  const revision = revisions.at(-1)!;
  const inputs = prepareRunInputs(model.model, picks, revision.exclusions.map((e) => e.index));

  const run = await dataSource.transaction(async (em) => {
    const saved = await em.save(
      em.create(Run, {
        lineId: model.lineId, modelId: model.id, pickSetId: body.pickSetId, pickSetRevision: revision.number,
        order: body.order, status: 'queued', shotsTotal: inputs.shots.length, createdBy: actorId,
      }),
    );
    await audit(em, { actorId, action: 'run.start', objectType: 'run', objectId: saved.id, projectId, detail: { modelId: model.id, pickSetId: body.pickSetId, order: body.order } });
    return saved;
  });
  try {
    await addJob(queue, 'solve', { runId: run.id }, run.id);
  } catch (err) {
    // No row may wait for a job that was never queued.
    await dataSource.transaction(async (em) => {
      await em.delete(Run, { id: run.id });
      await audit(em, { actorId, action: 'run.not_queued', objectType: 'run', objectId: run.id, projectId, detail: { reason: 'queue unreachable' } });
    });
    throw err;
  }
  return run;
}

/** Cancels a queued or running run. A running job notices between shots and writes nothing. */
export async function cancelRun(actorId: string, projectId: string, runId: string, queue: Queue): Promise<Run> {
  const run = await dataSource.transaction(async (em) => {
    const found = await em.findOne(Run, { where: { id: runId }, lock: { mode: 'pessimistic_write' } });
    if (!found) throw new HttpError(404, 'not_found', 'Not found.');
    if (found.status !== 'queued' && found.status !== 'running') {
      throw new HttpError(409, 'not_cancellable', `The run is already ${found.status}.`);
    }
    found.status = 'cancelled';
    found.finishedAt = new Date();
    await em.save(found);
    await audit(em, { actorId, action: 'run.cancel', objectType: 'run', objectId: runId, projectId });
    return found;
  });
  // A waiting job is removed; an active one is locked by its worker and stops on its own.
  const job = await queue.getJob(runId);
  if (job && (await job.isWaiting())) await job.remove().catch(() => undefined);
  return run;
}
