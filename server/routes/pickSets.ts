import { Router } from 'express';
import { exclusionsBody, retirePickSetBody } from '../../shared/schemas/pickSets';
import { HttpError } from '../http/errors';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { projectOfPickSet } from '../policies/scopes';
import { presentPickSetJson } from '../presenters/pickSet';
import { farPositions, picksJson, RECIPROCAL_TOLERANCE_MS, revisionQcJson, shotsOf } from '../services/pickSetReads';
import { addRevision, getPickSetHead, listRevisions, loadOriginal, setPickSetRetired } from '../services/pickSets';

export function pickSetsRouter(): Router {
  const r = Router();

  // ?revision=N picks an earlier revision; the latest by default.
  r.get('/picksets/:pickSetId', authorize('pickset.read', projectOfPickSet), async (req, res) => {
    const id = req.params.pickSetId as string;
    const [head, revisions] = await Promise.all([getPickSetHead(id), listRevisions(id)]);
    const wanted = req.query.revision === undefined ? revisions.at(-1)!.number : Number(req.query.revision);
    const revision = revisions.find((rv) => rv.number === wanted);
    if (!revision) throw new HttpError(404, 'revision_not_found', `This pick set has revisions 0 to ${revisions.at(-1)!.number}.`);
    // Heavy parts come as JSON text: picks built by PostgreSQL, checks stored per revision (services/pickSetReads.ts).
    const [picks, qcJson, shots, far] = await Promise.all([
      picksJson(id, revision.exclusions), revisionQcJson(id, revision.number, revision.exclusions), shotsOf(id), farPositions(id, head.lineId),
    ]);
    res.type('application/json').send(presentPickSetJson({
      head, revisions, revision, shots, picksJson: picks, qcJson, reciprocalToleranceMs: RECIPROCAL_TOLERANCE_MS, far,
    }));
  });

  r.post('/picksets/:pickSetId/revisions', authorize('pickset.revise', projectOfPickSet), async (req, res) => {
    const body = parse(exclusionsBody, req.body);
    res.status(201).json(await addRevision(req.user!.id, req.access!.projectId, req.params.pickSetId as string, body));
  });

  r.get('/picksets/:pickSetId/file', authorize('pickset.read', projectOfPickSet), async (req, res) => {
    const id = req.params.pickSetId as string;
    const [head, bytes] = await Promise.all([getPickSetHead(id), loadOriginal(id)]);
    res.attachment(head.fileName).type('text/csv').send(bytes);
  });

  r.post('/picksets/:pickSetId/retire', authorize('pickset.retire', projectOfPickSet), async (req, res) => {
    await setPickSetRetired(req.user!.id, req.access!.projectId, req.params.pickSetId as string, parse(retirePickSetBody, req.body));
    res.status(204).end();
  });

  r.post('/picksets/:pickSetId/reinstate', authorize('pickset.retire', projectOfPickSet), async (req, res) => {
    await setPickSetRetired(req.user!.id, req.access!.projectId, req.params.pickSetId as string, null);
    res.status(204).end();
  });

  return r;
}
