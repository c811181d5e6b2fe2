/**
 * A finished inversion saved as a model version of its line (issue 11 item 4): a raw-velocity model
 * file (FORMATS.md §1) on the inversion's grid and surface, with the ray coverage and the DOI line
 * as the optional extras FORMATS.md §3 names, and `source: { inversion: id }` saying where it came
 * from. Saved once: a second call answers with the version already made.
 */
import { MODEL_FORMAT } from '../../shared/schemas/model';
import type { ModelFile } from '../../shared/model';
import type { Grid } from '../../shared/grid';
import { dataSource } from '../db/dataSource';
import { unpackFloat32, unpackFloat64 } from '../db/packed-arrays';
import { Inversion } from '../entities';
import { HttpError } from '../http/errors';
import { rasterOffThread } from '../threads/read-pool';
import { audit } from './audit';
import { insertModelVersion, validateModelFile } from './models';

/** Name under which inversions are saved; versions count up per line like any other name. */
export const INVERTED_MODEL_NAME = 'inverted';

export async function saveInversionAsModel(actorId: string, projectId: string, inversionId: string): Promise<{ id: string; version: number; created: boolean }> {
  const inversion = await dataSource.getRepository(Inversion).findOneByOrFail({ id: inversionId });
  if (inversion.savedModelId) return { ...(await versionOf(inversion.savedModelId)), created: false };
  if (inversion.status !== 'done') throw new HttpError(409, 'not_done', `The inversion is ${inversion.status}; only a finished inversion can be saved as a model.`);
  const [result] = await dataSource.query('SELECT velocity, coverage, doi FROM inversion_results WHERE inversion_id = $1', [inversionId]);
  if (!result) throw new HttpError(409, 'not_done', 'The inversion is done but its result is missing; start it again.');
  const model = validateModelFile(modelFileOf(inversion, unpackFloat32(result.velocity), unpackFloat32(result.coverage), unpackFloat64(result.doi)));
  const raster = await rasterOffThread(model);
  const stats = inversion.stats as { chi2?: number; iterations?: number } | null;
  const comment = `From inversion ${inversion.label || inversion.id.slice(0, 8)}: pick set revision ${inversion.pickSetRevision}, ` +
    `${inversion.startKind === 'model' ? 'started from a saved model' : 'automatic gradient start'}, χ² ${stats?.chi2?.toFixed(2) ?? '–'} after ${stats?.iterations ?? '–'} iterations.`;

  return dataSource.transaction(async (em) => {
    // Two saves at once: the second waits here and then finds the first one's version.
    const [locked] = await em.query('SELECT saved_model_id FROM inversions WHERE id = $1 FOR UPDATE', [inversionId]);
    if (locked.saved_model_id) return { ...(await versionOf(locked.saved_model_id)), created: false };
    const saved = await insertModelVersion(em, actorId, projectId, inversion.lineId, model, raster, { name: INVERTED_MODEL_NAME, comment, basedOn: inversion.startModelId });
    await em.query('UPDATE inversions SET saved_model_id = $2 WHERE id = $1', [inversionId, saved.id]);
    await audit(em, { actorId, action: 'inversion.save_model', objectType: 'inversion', objectId: inversionId, projectId, detail: { modelId: saved.id, version: saved.version } });
    return { id: saved.id, version: saved.version, created: true };
  });
}

async function versionOf(modelId: string): Promise<{ id: string; version: number }> {
  const [row] = await dataSource.query('SELECT id, version FROM velocity_models WHERE id = $1', [modelId]);
  return { id: row.id, version: row.version };
}

/**
 * The model file. Air nodes (NaN) carry the velocity of the topmost ground node of their column, as
 * rasterising does, since a raw grid holds a velocity everywhere; the surface says they are air.
 */
export function modelFileOf(inversion: { id: string; grid: Grid; surface: [number, number][] | null }, velocity: Float32Array, coverage: Float32Array, doi: Float64Array): ModelFile {
  const { nx, nz } = inversion.grid;
  const v = new Array<number>(nx * nz);
  for (let ix = 0; ix < nx; ix++) {
    let firstGround = NaN;
    for (let iz = 0; iz < nz && Number.isNaN(firstGround); iz++) if (Number.isFinite(velocity[iz * nx + ix])) firstGround = velocity[iz * nx + ix];
    for (let iz = 0; iz < nz; iz++) {
      const here = velocity[iz * nx + ix];
      const value = Number.isFinite(here) ? here : firstGround;
      // A column with no ground at all cannot occur under a valid surface; 1000 m/s keeps the file valid if it does.
      v[iz * nx + ix] = Number.isFinite(value) ? Math.round(value * 10) / 10 : 1000;
    }
  }
  const { x0, dx, z0, dz } = inversion.grid;
  return {
    format: MODEL_FORMAT,
    grid: { x0, dx, nx, z0, dz, nz },
    ...(inversion.surface ? { surface: inversion.surface } : {}),
    velocity: v,
    coverage: Array.from(coverage, (c, i) => (Number.isFinite(velocity[i]) && Number.isFinite(c) ? Math.round(c * 100) / 100 : null)),
    doi: Array.from(doi, (d) => (Number.isFinite(d) ? Math.round(d * 1000) / 1000 : null)),
    source: { inversion: inversion.id },
  } as ModelFile;
}
