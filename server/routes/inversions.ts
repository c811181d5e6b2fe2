import { Router } from 'express';
import type { Queue } from 'bullmq';
import { startInversionBody } from '../../shared/schemas/inversions';
import { idempotent } from '../http/idempotency';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { projectOfBodyPickSet, projectOfInversion, projectOfLine } from '../policies/scopes';
import { loadInversionResiduals, loadInversionSection, loadInversionView, listLineInversions } from '../services/inversionReads';
import { saveInversionAsModel } from '../services/inversionModel';
import { cancelInversion, startInversion } from '../services/inversions';

/** Travel-time inversions (issue 11): start, follow, read the section and residuals, cancel, save as a model. */
export function inversionsRouter(queue: Queue): Router {
  const r = Router();
  const idOf = (req: { params: Record<string, unknown> }) => req.params.inversionId as string;

  r.post('/inversions', authorize('inversions.create', projectOfBodyPickSet), idempotent(), async (req, res) => {
    const inversion = await startInversion(req.user!.id, req.access!.projectId, parse(startInversionBody, req.body), queue);
    res.status(202).json({ id: inversion.id, status: inversion.status });
  });

  r.get('/lines/:lineId/inversions', authorize('inversion.read', projectOfLine), async (req, res) => {
    res.json(await listLineInversions(req.params.lineId as string));
  });

  r.get('/inversions/:inversionId', authorize('inversion.read', projectOfInversion), async (req, res) => {
    res.json(await loadInversionView(idOf(req)));
  });

  r.get('/inversions/:inversionId/section', authorize('inversion.read', projectOfInversion), async (req, res) => {
    res.json(await loadInversionSection(idOf(req)));
  });

  r.get('/inversions/:inversionId/residuals', authorize('inversion.read', projectOfInversion), async (req, res) => {
    res.json(await loadInversionResiduals(idOf(req)));
  });

  r.post('/inversions/:inversionId/cancel', authorize('inversion.cancel', projectOfInversion), async (req, res) => {
    await cancelInversion(req.user!.id, req.access!.projectId, idOf(req), queue);
    res.json(await loadInversionView(idOf(req)));
  });

  // 201 with the new version; a repeat answers 200 with the same version (saved once).
  r.post('/inversions/:inversionId/model', authorize('inversion.save_model', projectOfInversion), async (req, res) => {
    const saved = await saveInversionAsModel(req.user!.id, req.access!.projectId, idOf(req));
    res.status(saved.created ? 201 : 200).json({ id: saved.id, version: saved.version });
  });

  return r;
}
