import { Router } from 'express';
import type { Queue } from 'bullmq';
import { inflateRawSync } from 'node:zlib';
import { startRunBody } from '../../shared/schemas/runs';
import { dataSource } from '../db/dataSource';
import { Run } from '../entities';
import { HttpError } from '../http/errors';
import { idempotent } from '../http/idempotency';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { projectOfBodyModel, projectOfRun } from '../policies/scopes';
import { presentRun } from '../presenters/run';
import { cancelRun, startRun } from '../services/runs';
import { loadFieldRow, loadResidualRows, loadRays } from '../services/runResults';

export function runsRouter(queue: Queue): Router {
  const r = Router();
  const runOf = (id: string) => dataSource.getRepository(Run).findOneByOrFail({ id });

  r.post('/runs', authorize('runs.create', projectOfBodyModel), idempotent(), async (req, res) => {
    const run = await startRun(req.user!.id, req.access!.projectId, parse(startRunBody, req.body), queue);
    res.status(202).json({ id: run.id, status: run.status });
  });

  r.get('/runs/:runId', authorize('run.read', projectOfRun), async (req, res) => {
    res.json(presentRun(await runOf(req.params.runId as string)));
  });

  r.get('/runs/:runId/residuals', authorize('run.read', projectOfRun), async (req, res) => {
    res.json(await loadResidualRows(req.params.runId as string));
  });

  // The shot's travel-time grid (s): Float32 little-endian, row-major iz outer, air NaN; grid and source in headers.
  r.get('/runs/:runId/fields/:shotId', authorize('run.read', projectOfRun), async (req, res) => {
    const row = await loadFieldRow(req.params.runId as string, req.params.shotId as string);
    if (!row) throw new HttpError(404, 'field_not_found', 'This run has no travel-time field for that shot (yet).');
    res
      .set('X-Grid', JSON.stringify(row.grid))
      .set('X-Source', JSON.stringify(row.source))
      .set('Cache-Control', 'private, max-age=3600')
      .type('application/octet-stream')
      .send(inflateRawSync(row.data));
  });

  // Rays of one shot (or all shots) as polylines { pickIndex, shotId, points: [x, z, x, z, …] }.
  r.get('/runs/:runId/rays', authorize('run.read', projectOfRun), async (req, res) => {
    const shotId = typeof req.query.shotId === 'string' ? req.query.shotId : undefined;
    res.json(await loadRays(req.params.runId as string, shotId));
  });

  r.post('/runs/:runId/cancel', authorize('run.cancel', projectOfRun), async (req, res) => {
    res.json(presentRun(await cancelRun(req.user!.id, req.access!.projectId, req.params.runId as string, queue)));
  });

  return r;
}
