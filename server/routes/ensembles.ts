import { Router } from 'express';
import type { Queue } from 'bullmq';
import { startEnsembleBody } from '../../shared/schemas/ensembles';
import { idempotent } from '../http/idempotency';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { projectOfEnsemble, projectOfInversion } from '../policies/scopes';
import { listEnsembleMembers, listInversionEnsembles, loadEnsembleSection, loadEnsembleView } from '../services/ensembleReads';
import { cancelEnsemble, startEnsemble } from '../services/ensembles';

/** Ensembles of inversions (issue 20): start from a finished inversion, follow, read the combined section, cancel. */
export function ensemblesRouter(queue: Queue): Router {
  const r = Router();
  const idOf = (req: { params: Record<string, unknown> }) => req.params.ensembleId as string;

  r.post('/inversions/:inversionId/ensembles', authorize('ensembles.create', projectOfInversion), idempotent(), async (req, res) => {
    const started = await startEnsemble(req.user!.id, req.access!.projectId, req.params.inversionId as string, parse(startEnsembleBody, req.body), queue);
    res.status(202).json(started);
  });

  r.get('/inversions/:inversionId/ensembles', authorize('ensemble.read', projectOfInversion), async (req, res) => {
    res.json(await listInversionEnsembles(req.params.inversionId as string));
  });

  r.get('/ensembles/:ensembleId', authorize('ensemble.read', projectOfEnsemble), async (req, res) => {
    res.json(await loadEnsembleView(idOf(req)));
  });

  r.get('/ensembles/:ensembleId/members', authorize('ensemble.read', projectOfEnsemble), async (req, res) => {
    res.json(await listEnsembleMembers(idOf(req)));
  });

  r.get('/ensembles/:ensembleId/section', authorize('ensemble.read', projectOfEnsemble), async (req, res) => {
    res.json(await loadEnsembleSection(idOf(req)));
  });

  r.post('/ensembles/:ensembleId/cancel', authorize('ensemble.cancel', projectOfEnsemble), async (req, res) => {
    await cancelEnsemble(req.user!.id, req.access!.projectId, idOf(req), queue);
    res.json(await loadEnsembleView(idOf(req)));
  });

  return r;
}
