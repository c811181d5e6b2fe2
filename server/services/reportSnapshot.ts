import type { EntityManager } from 'typeorm';
import type { ReportSnapshot } from '../entities/Report';
import { loadOrganisationText } from './organisation';

/**
 * Copies what a report shows and what could change under it (stations, names, notes, the
 * consultancy's details); the run and model version are immutable and kept by id.
 */
export async function takeReportSnapshot(em: EntityManager, runId: string, preparedById: string | null): Promise<ReportSnapshot> {
  const [r] = await em.query(
    `SELECT p.name AS project, p.site, p.client_organisation, l.id AS line_id, l.name AS line, l.notes AS line_notes,
            run.model_id, run.pick_set_revision, s.file_name, author.name AS prepared_by
     FROM runs run JOIN survey_lines l ON l.id = run.line_id JOIN projects p ON p.id = l.project_id
     JOIN pick_sets s ON s.id = run.pick_set_id LEFT JOIN users author ON author.id = $2
     WHERE run.id = $1`,
    [runId, preparedById],
  );
  if (!r) throw new Error(`run ${runId} no longer exists`);
  const stations: ReportSnapshot['stations'] = await em.query('SELECT station, x, z FROM stations WHERE line_id = $1 ORDER BY x', [r.line_id]);
  return {
    takenAt: new Date().toISOString(),
    project: { name: r.project, site: r.site, clientOrganisation: r.client_organisation },
    line: { id: r.line_id, name: r.line, notes: r.line_notes },
    stations: stations.map(({ station, x, z }) => ({ station: Number(station), x: Number(x), z: Number(z) })),
    runId,
    modelVersionId: r.model_id,
    pickSet: { file: r.file_name, revision: r.pick_set_revision },
    preparedBy: r.prepared_by ?? 'unknown',
    consultancy: await loadOrganisationText(em),
  };
}
