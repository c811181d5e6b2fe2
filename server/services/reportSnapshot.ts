import { crsByCode } from '../geo/crs';
import type { EntityManager } from 'typeorm';
import type { ReportSnapshot, SnapshotBorehole } from '../entities/Report';
import { loadOrganisationText } from './organisation';

/** What a report is made from: a finished forward run or a finished inversion. */
export type ReportSource = { runId: string } | { inversionId: string };

/** The report row's source columns as a ReportSource. */
export const sourceOf = (r: { runId: string | null; inversionId: string | null }): ReportSource =>
  r.runId ? { runId: r.runId } : { inversionId: r.inversionId! };

/**
 * Copies what a report shows and what could change under it (stations, names, notes, the
 * consultancy's details); runs, inversions and model versions are immutable and kept by id.
 */
export async function takeReportSnapshot(em: EntityManager, source: ReportSource, preparedById: string | null): Promise<ReportSnapshot> {
  const fromRun = 'runId' in source;
  const [r] = await em.query(
    `SELECT p.name AS project, p.site, p.client_organisation, p.velocity_colour_min, p.velocity_colour_max, p.crs_epsg, l.id AS line_id, l.name AS line, l.notes AS line_notes,
            src.model_id, src.pick_set_revision, s.file_name, author.name AS prepared_by
     FROM ${fromRun ? '(SELECT id, line_id, pick_set_id, pick_set_revision, model_id FROM runs)' : '(SELECT id, line_id, pick_set_id, pick_set_revision, start_model_id AS model_id FROM inversions)'} src
     JOIN survey_lines l ON l.id = src.line_id JOIN projects p ON p.id = l.project_id
     JOIN pick_sets s ON s.id = src.pick_set_id LEFT JOIN users author ON author.id = $2
     WHERE src.id = $1`,
    [fromRun ? source.runId : source.inversionId, preparedById],
  );
  if (!r) throw new Error(`${fromRun ? `run ${source.runId}` : `inversion ${source.inversionId}`} no longer exists`);
  const stations: ReportSnapshot['stations'] = await em.query('SELECT station, x, z, easting, northing FROM stations WHERE line_id = $1 ORDER BY x', [r.line_id]);
  return {
    takenAt: new Date().toISOString(),
    project: { name: r.project, site: r.site, clientOrganisation: r.client_organisation },
    line: { id: r.line_id, name: r.line, notes: r.line_notes },
    stations: stations.map(({ station, x, z, easting, northing }) => ({ station: Number(station), x: Number(x), z: Number(z), ...(easting == null ? {} : { easting: Number(easting), northing: Number(northing) }) })),
    runId: fromRun ? source.runId : null,
    inversionId: fromRun ? null : source.inversionId,
    modelVersionId: r.model_id ?? null,
    pickSet: { file: r.file_name, revision: r.pick_set_revision },
    preparedBy: r.prepared_by ?? 'unknown',
    consultancy: await loadOrganisationText(em),
    boreholes: await lineBoreholes(em, r.line_id),
    velocityColours: { min: Number(r.velocity_colour_min), max: Number(r.velocity_colour_max) },
    crs: r.crs_epsg ? crsLabel(Number(r.crs_epsg)) : null,
    ensembleId: fromRun ? null : await newestEnsemble(em, source.inversionId),
  };
}

/** The newest combined ensemble of an inversion (combined results never change), or null. */
async function newestEnsemble(em: Pick<EntityManager, 'query'>, inversionId: string): Promise<string | null> {
  const [row] = await em.query(`SELECT id FROM ensembles WHERE inversion_id = $1 AND status = 'done' ORDER BY finished_at DESC LIMIT 1`, [inversionId]);
  return row?.id ?? null;
}

/** The line's boreholes and trial pits as a report keeps them (along the line). */
export async function lineBoreholes(em: Pick<EntityManager, 'query'>, lineId: string): Promise<SnapshotBorehole[]> {
  const rows: { name: string; kind: SnapshotBorehole['kind']; x: number; ground_z: number | null; water_depth: number | null; contacts: { depth: number; material: string; rockTop?: boolean }[] }[] =
    await em.query('SELECT name, kind, x, ground_z, water_depth, contacts FROM boreholes WHERE line_id = $1 ORDER BY x, name', [lineId]);
  return rows.map((h) => ({
    name: h.name,
    kind: h.kind,
    x: Number(h.x),
    groundZ: h.ground_z === null ? null : Number(h.ground_z),
    waterDepth: h.water_depth === null ? null : Number(h.water_depth),
    contacts: h.contacts.map((c) => ({ depth: c.depth, material: c.material, rockTop: c.rockTop === true })),
  }));
}

/** "EPSG:code name" of a CRS, as reports print it. */
function crsLabel(code: number): string {
  return `EPSG:${code} ${crsByCode(code).name}`;
}
