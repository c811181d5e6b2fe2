import { Router, type Request, type Response } from 'express';
import { HttpError } from '../http/errors';
import { authorize } from '../policies/authorize';
import { projectOfInversion, projectOfModel, projectOfRun } from '../policies/scopes';
import { EXPORT_FILES, inversionSection, modelSection, runSection, writeExport, type ExportFile, type LoadedSection } from '../services/exports';

/**
 * Sections leave Timefield for CAD and GIS (issue 19): the same four files from a model version, a
 * forward run and an inversion, for whoever may read the section. Query: rock (interface:N or m/s),
 * classes (excavatability bands, "none" for none), levels (iso-velocities for the DXF), threshold
 * (inversion coverage, m of ray).
 */
function fileParam(req: Request): ExportFile {
  const file = req.params.file as string;
  if (!(EXPORT_FILES as readonly string[]).includes(file)) throw new HttpError(404, 'unknown_export', `No export called "${file}": use one of ${EXPORT_FILES.join(', ')}.`);
  return file as ExportFile;
}

const query = (req: Request, key: string): string | undefined => (typeof req.query[key] === 'string' ? (req.query[key] as string).slice(0, 500) : undefined);

function send(res: Response, loaded: LoadedSection, file: ExportFile, req: Request): void {
  const out = writeExport(loaded, file, { rock: query(req, 'rock'), classes: query(req, 'classes'), levels: query(req, 'levels') });
  res.type(out.type).attachment(out.name).send(out.body);
}

export function exportsRouter(): Router {
  const r = Router();
  r.get('/models/:modelId/export/:file', authorize('model.read', projectOfModel), async (req, res) => {
    const file = fileParam(req);
    send(res, await modelSection(req.params.modelId as string), file, req);
  });
  r.get('/runs/:runId/export/:file', authorize('run.read', projectOfRun), async (req, res) => {
    const file = fileParam(req);
    send(res, await runSection(req.params.runId as string), file, req);
  });
  r.get('/inversions/:inversionId/export/:file', authorize('inversion.read', projectOfInversion), async (req, res) => {
    const file = fileParam(req);
    const t = query(req, 'threshold');
    const threshold = t === undefined ? 1 : Number(t);
    if (!(threshold >= 0 && threshold <= 1000)) throw new HttpError(400, 'invalid_threshold', 'threshold must be a ray length between 0 and 1000 m.');
    send(res, await inversionSection(req.params.inversionId as string, threshold), file, req);
  });
  return r;
}
