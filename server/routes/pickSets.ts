import { Router } from 'express';
import { exclusionsBody } from '../../shared/schemas/pickSets';
import { HttpError } from '../http/errors';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { projectOfPickSet } from '../policies/scopes';
import { presentPickSet } from '../presenters/pickSet';
import { addRevision, getPickSetHead, listRevisions, loadOriginal, loadPicks } from '../services/pickSets';

export function pickSetsRouter(): Router {
  const r = Router();

  // ?revision=N picks an earlier revision; the latest by default.
  r.get('/picksets/:pickSetId', authorize('pickset.read', projectOfPickSet), async (req, res) => {
    const id = req.params.pickSetId as string;
    const [head, picks, revisions] = await Promise.all([getPickSetHead(id), loadPicks(id), listRevisions(id)]);
    const wanted = req.query.revision === undefined ? revisions.at(-1)!.number : Number(req.query.revision);
    const revision = revisions.find((rv) => rv.number === wanted);
    if (!revision) throw new HttpError(404, 'revision_not_found', `This pick set has revisions 0 to ${revisions.at(-1)!.number}.`);
    res.json(presentPickSet(head, picks, revisions, revision));
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

  return r;
}
