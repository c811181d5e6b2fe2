import type { Queue } from 'bullmq';
import { gridForLine } from '../../shared/inversion/grid-for-line';
import { rasteriseModel } from '../../shared/model';
import type { StartInversionBody } from '../../shared/schemas/inversions';
import { dataSource } from '../db/dataSource';
import { Inversion } from '../entities';
import { HttpError } from '../http/errors';
import { addJob } from '../queue/queue';
import { audit } from './audit';
import { checkGridSize, placeInversionPicks, surfaceRaster } from './inversionInputs';
import { loadModelVersion } from './models';
import { listRevisions, loadPicks, refuseRetired, type StoredPick } from './pickSets';
import { listStations } from './stations';

const invalid = (path: string, message: string) => new HttpError(422, 'validation_failed', `${path}: ${message}`, [{ path, message }]);

/**
 * Checks everything an inversion needs before anything is queued (the pick-set revision, the start
 * model on the same line, the grid within limits, enough picks from enough shots, every source and
 * receiver inside the grid and in the ground), then records the inversion and queues it.
 */
export async function startInversion(actorId: string, projectId: string, body: StartInversionBody, queue: Queue): Promise<Inversion> {
  const [pickSet] = await dataSource.query('SELECT s.line_id, l.project_id FROM pick_sets s JOIN survey_lines l ON l.id = s.line_id WHERE s.id = $1', [body.pickSetId]);
  if (!pickSet || pickSet.project_id !== projectId) throw invalid('pickSetId', 'no pick set of this project has that id');
  await refuseRetired(body.pickSetId);
  const lineId: string = pickSet.line_id;
  const [picks, revisions] = await Promise.all([loadPicks(body.pickSetId), listRevisions(body.pickSetId)]);
  const revision = body.pickSetRevision === undefined ? revisions.at(-1)! : revisions.find((r) => r.number === body.pickSetRevision);
  if (!revision) throw invalid('pickSetRevision', `this pick set has revisions 0 to ${revisions.at(-1)!.number}`);
  const excluded = revision.exclusions.map((e) => e.index);

  const plan = body.start.kind === 'model' ? await modelStart(body.start.modelId, projectId, lineId) : await gradientStart(lineId, picks, excluded, body.start.spacing);
  const placed = placeInversionPicks(plan.raster, picks, excluded, body.start.kind === 'model' ? 'start.modelId' : 'start.spacing');

  const inversion = await dataSource.transaction(async (em) => {
    const saved = await em.save(
      em.create(Inversion, {
        lineId, pickSetId: body.pickSetId, pickSetRevision: revision.number,
        startKind: body.start.kind, startModelId: plan.modelId, startSpacing: plan.spacing,
        grid: plan.raster.grid, surface: plan.surface, settings: body.settings, label: body.label,
        status: 'queued', shots: placed.shots.length, picks: placed.picks, createdBy: actorId,
      }),
    );
    await audit(em, {
      actorId, action: 'inversion.start', objectType: 'inversion', objectId: saved.id, projectId,
      detail: { pickSetId: body.pickSetId, revision: revision.number, start: body.start, settings: body.settings },
    });
    return saved;
  });
  try {
    await addJob(queue, 'invert', { inversionId: inversion.id }, inversion.id);
  } catch (err) {
    // No row may wait for a job that was never queued.
    await dataSource.transaction(async (em) => {
      await em.delete(Inversion, { id: inversion.id });
      await audit(em, { actorId, action: 'inversion.not_queued', objectType: 'inversion', objectId: inversion.id, projectId, detail: { reason: 'queue unreachable' } });
    });
    throw err;
  }
  return inversion;
}

/** A saved model version of the same line: its grid, surface and velocities. */
async function modelStart(modelId: string, projectId: string, lineId: string) {
  const [owner] = await dataSource.query('SELECT m.line_id, l.project_id FROM velocity_models m JOIN survey_lines l ON l.id = m.line_id WHERE m.id = $1', [modelId]);
  // A model of another project looks exactly like one that does not exist.
  if (!owner || owner.project_id !== projectId) throw invalid('start.modelId', 'no model version of this project has that id');
  if (owner.line_id !== lineId) throw new HttpError(409, 'different_lines', 'The start model and the pick set belong to different survey lines.');
  const { model } = await loadModelVersion(modelId);
  checkGridSize(model.grid, 'start.modelId');
  return { raster: rasteriseModel(model), surface: (model.surface as [number, number][] | undefined) ?? null, modelId, spacing: null };
}

/**
 * The automatic start's grid: the line's stations (or, without a station table, the receivers of
 * the picks, at their elevation or 0 m) and its shots, at the given or the default spacing.
 */
async function gradientStart(lineId: string, picks: readonly StoredPick[], excluded: readonly number[], spacing: number | undefined) {
  const stations = await listStations(lineId);
  const skip = new Set(excluded);
  const used = picks.filter((p) => !skip.has(p.index));
  const geometry = stations.length >= 2 ? stations : used.map((p) => ({ x: p.receiverX, z: p.receiverZ ?? 0 }));
  const line = gridForLine({ stations: geometry, shotXs: [...new Set(used.map((p) => p.sourceX))] }, spacing);
  checkGridSize(line.grid, 'start.spacing');
  return { raster: surfaceRaster(line.grid, line.surface), surface: line.surface, modelId: null, spacing: line.spacing };
}

/** Cancels a queued or running inversion. A running job notices within about a second and stops. */
export async function cancelInversion(actorId: string, projectId: string, inversionId: string, queue: Queue): Promise<Inversion> {
  const inversion = await dataSource.transaction(async (em) => {
    const found = await em.findOne(Inversion, { where: { id: inversionId }, lock: { mode: 'pessimistic_write' } });
    if (!found) throw new HttpError(404, 'not_found', 'Not found.');
    if (found.status !== 'queued' && found.status !== 'running') {
      throw new HttpError(409, 'not_cancellable', `The inversion is already ${found.status}.`);
    }
    found.status = 'cancelled';
    found.finishedAt = new Date();
    await em.save(found);
    await audit(em, { actorId, action: 'inversion.cancel', objectType: 'inversion', objectId: inversionId, projectId });
    return found;
  });
  // A waiting job is removed; an active one is locked by its worker and stops on its own.
  const job = await queue.getJob(inversionId);
  if (job && (await job.isWaiting())) await job.remove().catch(() => undefined);
  return inversion;
}
