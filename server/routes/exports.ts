import { Router, type Request, type Response } from 'express';
import { HttpError } from '../http/errors';
import { authorize } from '../policies/authorize';
import { projectFromParam, projectOfInversion, projectOfModel, projectOfRun } from '../policies/scopes';
import { planDxf, planGeoJson } from '../../shared/exports/plan';
import { projectPlan } from '../services/plan';
import { toLonLat } from '../geo/crs';
import { EXPORT_FILES, fileSafe, inversionSection, modelSection, runSection, writeExport, type ExportFile, type LoadedSection } from '../services/exports';

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
  res.type(out.type);
  // The pages read the JSON table; every other file is a download.
  if (file !== 'depth-to-rock.json') res.attachment(out.name);
  res.send(out.body);
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
  // The project's plan: JSON for the plan view, DXF in the project's grid, GeoJSON in WGS 84.
  r.get('/projects/:projectId/plan', authorize('project.plan', projectFromParam), async (req, res) => {
    res.json((await projectPlan(req.access!.projectId)).plan);
  });
  r.get('/projects/:projectId/plan.dxf', authorize('project.plan', projectFromParam), async (req, res) => {
    const { plan } = await projectPlan(req.access!.projectId);
    res.type('application/dxf').attachment(`${fileSafe(plan.project)}-plan.dxf`).send(planDxf(plan, new Date().toISOString().slice(0, 10)));
  });
  r.get('/projects/:projectId/plan.geojson', authorize('project.plan', projectFromParam), async (req, res) => {
    const { plan, crs } = await projectPlan(req.access!.projectId);
    if (!crs) throw new HttpError(422, 'no_coordinates', 'GeoJSON needs real-world coordinates: set the project’s coordinate system first.');
    if (crs.noDatumShift) throw new HttpError(422, 'no_coordinates', `${crs.noDatumShift}, so GeoJSON (WGS 84) cannot be written.`);
    res.type('application/geo+json').attachment(`${fileSafe(plan.project)}-plan.geojson`).send(JSON.stringify(planGeoJson(plan, (e, n) => toLonLat(crs.code, e, n))));
  });
  return r;
}
