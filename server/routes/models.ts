import { Router } from 'express';
import { z } from 'zod';
import { gunzip } from 'node:zlib';
import { promisify } from 'node:util';
import { HttpError } from '../http/errors';
import { largeJsonBody } from '../http/json-body';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { projectOfLine, projectOfModel } from '../policies/scopes';
import { loadModelRaster, loadModelVersionText, saveModelVersion } from '../services/models';

const gunzipAsync = promisify(gunzip);

const saveQuery = z.object({
  name: z.string().trim().min(1).max(80).optional().default('main'),
  comment: z.string().trim().max(1000).optional().default(''),
  basedOn: z.uuid('must be a model version id').optional(),
});

export function modelsRouter(): Router {
  const r = Router();

  // Body: a model file (FORMATS.md §1). Query: name (default "main"), comment, basedOn.
  r.post('/lines/:lineId/models', authorize('line.models.create', projectOfLine), ...largeJsonBody, async (req, res) => {
    const q = parse(saveQuery, req.query);
    const saved = await saveModelVersion(req.user!.id, req.access!.projectId, req.params.lineId as string, req.body, {
      name: q.name, comment: q.comment, basedOn: q.basedOn ?? null,
    });
    res.status(201).json(saved);
  });

  r.get('/models/:modelId', authorize('model.read', projectOfModel), async (req, res) => {
    // Summary stored at save; the model file is spliced in as the stored JSON text (no parse, no re-stringify).
    const [{ head, modelJson }, { summary }] = await Promise.all([
      loadModelVersionText(req.params.modelId as string), loadModelRaster(req.params.modelId as string),
    ]);
    const rest = JSON.stringify({ ...head, summary });
    res.type('application/json').send(`${rest.slice(0, -1)},"model":${modelJson}}`);
  });

  // The rasterised velocity grid, Float32 little-endian, row-major iz outer; air nodes are NaN.
  r.get('/models/:modelId/grid', authorize('model.read', projectOfModel), async (req, res) => {
    // Stored gzip'd at save: sent as is to clients that accept gzip, else inflated off the event loop.
    const { summary, velocityGz } = await loadModelRaster(req.params.modelId as string);
    res.set('X-Grid', JSON.stringify(summary.grid)).type('application/octet-stream').vary('Accept-Encoding');
    if (req.acceptsEncodings('gzip') === 'gzip') res.set('Content-Encoding', 'gzip').send(velocityGz);
    else res.send(await gunzipAsync(velocityGz));
  });

  r.put('/models/:modelId', authorize('model.update', projectOfModel), () => {
    throw new HttpError(409, 'immutable', 'Saved model versions cannot be changed. Save your changes as a new version instead.');
  });

  return r;
}
