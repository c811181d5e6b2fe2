import { Router } from 'express';
import { z } from 'zod';
import { rasteriseModel } from '../../shared/model';
import { summariseRaster } from '../../shared/model/summary';
import { HttpError } from '../http/errors';
import { largeJsonBody } from '../http/json-body';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { projectOfLine, projectOfModel } from '../policies/scopes';
import { loadModelVersion, saveModelVersion } from '../services/models';

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
    const version = await loadModelVersion(req.params.modelId as string);
    const raster = rasteriseModel(version.model);
    res.json({ ...version, summary: { grid: raster.grid, ...summariseRaster(raster) } });
  });

  // The rasterised velocity grid, Float32 little-endian, row-major iz outer; air nodes are NaN.
  r.get('/models/:modelId/grid', authorize('model.read', projectOfModel), async (req, res) => {
    const { model } = await loadModelVersion(req.params.modelId as string);
    const raster = rasteriseModel(model);
    const out = new Float32Array(raster.velocity);
    for (let i = 0; i < out.length; i++) if (!raster.active[i]) out[i] = Number.NaN;
    res.set('X-Grid', JSON.stringify(raster.grid)).type('application/octet-stream').send(Buffer.from(out.buffer));
  });

  r.put('/models/:modelId', authorize('model.update', projectOfModel), () => {
    throw new HttpError(409, 'immutable', 'Saved model versions cannot be changed. Save your changes as a new version instead.');
  });

  return r;
}
