import type { Request } from 'express';
import { dataSource } from '../db/dataSource';
import { SurveyLine } from '../entities';

/** Finds the project an object belongs to, from the route's parameters; null when there is none. */
export type ProjectScope = (req: Request) => Promise<string | null>;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export const isUuid = (s: unknown): s is string => typeof s === 'string' && UUID.test(s);

export const projectFromParam: ProjectScope = async (req) => {
  const id = req.params.projectId;
  if (!isUuid(id)) return null;
  const found = await dataSource.query('SELECT id FROM projects WHERE id = $1', [id]);
  return found.length ? id : null;
};

export const projectOfLine: ProjectScope = async (req) => {
  const id = req.params.lineId;
  if (!isUuid(id)) return null;
  const line = await dataSource.getRepository(SurveyLine).findOne({ where: { id }, select: { projectId: true } });
  return line?.projectId ?? null;
};

export const projectOfPickSet: ProjectScope = async (req) => {
  const id = req.params.pickSetId;
  if (!isUuid(id)) return null;
  const rows = await dataSource.query('SELECT l.project_id FROM pick_sets s JOIN survey_lines l ON l.id = s.line_id WHERE s.id = $1', [id]);
  return rows[0]?.project_id ?? null;
};

export const projectOfRecord: ProjectScope = async (req) => {
  const id = req.params.recordId;
  if (!isUuid(id)) return null;
  const rows = await dataSource.query('SELECT l.project_id FROM records r JOIN survey_lines l ON l.id = r.line_id WHERE r.id = $1', [id]);
  return rows[0]?.project_id ?? null;
};

export const projectOfBorehole: ProjectScope = async (req) => {
  const id = req.params.boreholeId;
  if (!isUuid(id)) return null;
  const rows = await dataSource.query('SELECT l.project_id FROM boreholes b JOIN survey_lines l ON l.id = b.line_id WHERE b.id = $1', [id]);
  return rows[0]?.project_id ?? null;
};

export const projectOfModel: ProjectScope = async (req) => {
  const id = req.params.modelId;
  if (!isUuid(id)) return null;
  const rows = await dataSource.query('SELECT l.project_id FROM velocity_models m JOIN survey_lines l ON l.id = m.line_id WHERE m.id = $1', [id]);
  return rows[0]?.project_id ?? null;
};

/** POST /api/runs names its model in the body; the model's line decides the project. */
export const projectOfBodyModel: ProjectScope = async (req) => {
  const id = req.body?.modelId;
  if (!isUuid(id)) return null;
  const rows = await dataSource.query('SELECT l.project_id FROM velocity_models m JOIN survey_lines l ON l.id = m.line_id WHERE m.id = $1', [id]);
  return rows[0]?.project_id ?? null;
};

export const projectOfRun: ProjectScope = async (req) => {
  const id = req.params.runId;
  if (!isUuid(id)) return null;
  const rows = await dataSource.query('SELECT l.project_id FROM runs r JOIN survey_lines l ON l.id = r.line_id WHERE r.id = $1', [id]);
  return rows[0]?.project_id ?? null;
};

export const projectOfReport: ProjectScope = async (req) => {
  const id = req.params.reportId;
  if (!isUuid(id)) return null;
  const rows = await dataSource.query('SELECT project_id FROM reports WHERE id = $1', [id]);
  return rows[0]?.project_id ?? null;
};

/** POST /api/inversions names its pick set in the body; the pick set's line decides the project. */
export const projectOfBodyPickSet: ProjectScope = async (req) => {
  const id = req.body?.pickSetId;
  if (!isUuid(id)) return null;
  const rows = await dataSource.query('SELECT l.project_id FROM pick_sets s JOIN survey_lines l ON l.id = s.line_id WHERE s.id = $1', [id]);
  return rows[0]?.project_id ?? null;
};

export const projectOfInversion: ProjectScope = async (req) => {
  const id = req.params.inversionId;
  if (!isUuid(id)) return null;
  const rows = await dataSource.query('SELECT l.project_id FROM inversions i JOIN survey_lines l ON l.id = i.line_id WHERE i.id = $1', [id]);
  return rows[0]?.project_id ?? null;
};

export const projectOfEnsemble: ProjectScope = async (req) => {
  const id = req.params.ensembleId;
  if (!isUuid(id)) return null;
  const rows = await dataSource.query('SELECT l.project_id FROM ensembles e JOIN survey_lines l ON l.id = e.line_id WHERE e.id = $1', [id]);
  return rows[0]?.project_id ?? null;
};
