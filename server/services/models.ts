import type { EntityManager } from 'typeorm';
import { dataSource } from '../db/dataSource';
import { VelocityModel } from '../entities';
import { HttpError } from '../http/errors';
import { parseModelFile, type ModelFile } from '../../shared/model';
import { rasterOffThread } from '../threads/read-pool';
import type { RasterResult } from '../threads/read-tasks';
import { audit } from './audit';

export interface SaveModelOptions {
  name: string;
  comment: string;
  basedOn: string | null;
}

/** Validates a model file; 422 with a JSON path per problem (FORMATS.md §1). */
export function validateModelFile(json: unknown): ModelFile {
  const parsed = parseModelFile(json);
  if (!parsed.ok) {
    const first = parsed.issues[0];
    throw new HttpError(422, 'invalid_model', `The model was not saved: ${first.path ? `${first.path}: ` : ''}${first.message}`, parsed.issues);
  }
  return parsed.model;
}

/** Saves a new immutable version (next number for this line and name) and returns it with its warnings. */
export async function saveModelVersion(actorId: string, projectId: string, lineId: string, json: unknown, opts: SaveModelOptions) {
  const model = validateModelFile(json);
  // Rasterised once, off the request thread, and stored beside the version (reads serve it as is).
  const raster = await rasterOffThread(model);
  return dataSource.transaction((em) => insertModelVersion(em, actorId, projectId, lineId, model, raster, opts));
}

/** The insert of saveModelVersion, inside the caller's transaction (a version saved together with another change). */
export async function insertModelVersion(em: EntityManager, actorId: string, projectId: string, lineId: string, model: ModelFile, raster: RasterResult, opts: SaveModelOptions) {
  // One writer per line at a time, so two saves cannot take the same number.
  await em.query('SELECT id FROM survey_lines WHERE id = $1 FOR UPDATE', [lineId]);
  if (opts.basedOn) {
    const [base] = await em.query('SELECT line_id FROM velocity_models WHERE id = $1', [opts.basedOn]);
    if (!base || base.line_id !== lineId) throw new HttpError(422, 'validation_failed', 'basedOn: no model version of this line has that id', [{ path: 'basedOn', message: 'no model version of this line has that id' }]);
  }
  const [{ next }] = await em.query('SELECT coalesce(max(version), 0) + 1 AS next FROM velocity_models WHERE line_id = $1 AND name = $2', [lineId, opts.name]);
  const saved = await em.save(
    em.create(VelocityModel, {
      lineId, name: opts.name, version: next, comment: opts.comment, basedOn: opts.basedOn, content: model as object,
      nx: model.grid.nx, nz: model.grid.nz, createdBy: actorId,
    }),
  );
  await em.query('INSERT INTO model_rasters (model_id, summary, velocity_gz) VALUES ($1, $2, $3)', [saved.id, JSON.stringify(raster.summary), Buffer.from(raster.velocityGz)]);
  await audit(em, { actorId, action: 'model.save', objectType: 'velocity_model', objectId: saved.id, projectId, detail: { name: opts.name, version: next } });
  return { id: saved.id, version: next as number, name: opts.name, warnings: raster.summary.warnings };
}

export async function loadModelVersion(id: string) {
  const [row] = await dataSource.query(
    `SELECT m.id, m.line_id, m.name, m.version, m.comment, m.based_on, m.content, m.created_at, m.created_by, u.name AS created_by_name
     FROM velocity_models m LEFT JOIN users u ON u.id = m.created_by WHERE m.id = $1`,
    [id],
  );
  if (!row) throw new HttpError(404, 'not_found', 'Not found.');
  return {
    id: row.id as string, lineId: row.line_id as string, name: row.name as string, version: row.version as number, comment: row.comment as string,
    basedOn: row.based_on as string | null, createdAt: row.created_at as Date,
    createdBy: row.created_by ? { id: row.created_by as string, name: row.created_by_name as string } : null,
    model: row.content as ModelFile,
  };
}

export async function listModelVersions(lineId: string) {
  const rows = await dataSource.query(
    `SELECT m.id, m.name, m.version, m.comment, m.based_on, m.nx, m.nz, m.created_at, m.created_by, u.name AS created_by_name
     FROM velocity_models m LEFT JOIN users u ON u.id = m.created_by WHERE m.line_id = $1 ORDER BY m.name, m.version DESC`,
    [lineId],
  );
  return rows.map((r: Record<string, never>) => ({
    id: r.id, name: r.name, version: r.version, comment: r.comment, basedOn: r.based_on, nx: r.nx, nz: r.nz, createdAt: r.created_at,
    createdBy: r.created_by ? { id: r.created_by, name: r.created_by_name } : null,
  }));
}

export interface StoredRaster {
  summary: RasterResult['summary'];
  /** gzip of the Float32 little-endian grid, air NaN. */
  velocityGz: Buffer;
}

/**
 * The version's rasterised grid as stored at save time. Versions saved before the table existed
 * are rasterised once, on a worker thread, and stored (immutable input, so never stale).
 */
export async function loadModelRaster(id: string): Promise<StoredRaster> {
  const [row] = await dataSource.query('SELECT summary, velocity_gz FROM model_rasters WHERE model_id = $1', [id]);
  if (row) return { summary: row.summary, velocityGz: row.velocity_gz };
  // Parallel first reads of one old version share one rasterisation.
  let pending = rasterising.get(id);
  if (!pending) {
    pending = rasteriseAndStore(id).finally(() => rasterising.delete(id));
    rasterising.set(id, pending);
  }
  return pending;
}

const rasterising = new Map<string, Promise<StoredRaster>>();

async function rasteriseAndStore(id: string): Promise<StoredRaster> {
  const { model } = await loadModelVersion(id);
  const raster = await rasterOffThread(model);
  const velocityGz = Buffer.from(raster.velocityGz);
  await dataSource.query(
    'INSERT INTO model_rasters (model_id, summary, velocity_gz) VALUES ($1, $2, $3) ON CONFLICT (model_id) DO NOTHING',
    [id, JSON.stringify(raster.summary), velocityGz],
  );
  return { summary: raster.summary, velocityGz };
}

/** Like loadModelVersion, but the model file stays JSON text (a raw 2 M-value grid is not parsed only to be sent again). */
export async function loadModelVersionText(id: string) {
  const [row] = await dataSource.query(
    `SELECT m.id, m.line_id, m.name, m.version, m.comment, m.based_on, m.content::text AS content, m.created_at, m.created_by, u.name AS created_by_name
     FROM velocity_models m LEFT JOIN users u ON u.id = m.created_by WHERE m.id = $1`,
    [id],
  );
  if (!row) throw new HttpError(404, 'not_found', 'Not found.');
  return {
    head: {
      id: row.id as string, lineId: row.line_id as string, name: row.name as string, version: row.version as number, comment: row.comment as string,
      basedOn: row.based_on as string | null, createdAt: row.created_at as Date,
      createdBy: row.created_by ? { id: row.created_by as string, name: row.created_by_name as string } : null,
    },
    modelJson: row.content as string,
  };
}
