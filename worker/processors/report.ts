/**
 * The "report" job: gathers everything the PDF summary shows (worker/report/types.ts) and renders it.
 * The PDF is stored on the report row; a render that fails leaves a message a user understands.
 */
import { inflateRawSync } from 'node:zlib';
import type { Job } from 'bullmq';
import { dataSource } from '../../server/db/dataSource';
import { demoConsultancy } from '../../fixtures/demo/scenario';
import { loadModelVersion } from '../../server/services/models';
import { loadRays, loadResidualRows, loadFieldRow } from '../../server/services/runResults';
import { listStations } from '../../server/services/stations';
import type { ReportOptions } from '../../server/entities/Report';
import { renderReportPdf } from '../report/render';
import type { ReportInput, RunStatsJson } from '../report/types';

export async function reportJob(job: Job<{ reportId: string }>): Promise<{ reportId: string; bytes: number }> {
  const { reportId } = job.data;
  await dataSource.query(`UPDATE reports SET render_state = 'rendering', render_error = NULL WHERE id = $1`, [reportId]);
  try {
    const input = await gatherReportInput(reportId);
    const pdf = await renderReportPdf(input);
    await dataSource.query(`UPDATE reports SET pdf = $2, render_state = 'ready', pdf_rendered_at = now() WHERE id = $1`, [reportId, pdf]);
    return { reportId, bytes: pdf.length };
  } catch (err) {
    await dataSource.query(`UPDATE reports SET render_state = 'failed', render_error = $2 WHERE id = $1`, [reportId, `The PDF could not be made: ${(err as Error).message}`]);
    throw err;
  }
}

export async function gatherReportInput(reportId: string): Promise<ReportInput> {
  const [r] = await dataSource.query(
    `SELECT rep.status, rep.options, rep.run_id, author.name AS prepared_by, reviewer.name AS reviewed_by,
            p.name AS project, p.site, p.client_organisation, l.id AS line_id, l.name AS line, l.notes AS line_notes,
            run.model_id, run.scheme_order, run.created_at AS run_created_at, run.stats, run.pick_set_revision, s.file_name
     FROM reports rep JOIN runs run ON run.id = rep.run_id JOIN survey_lines l ON l.id = run.line_id JOIN projects p ON p.id = l.project_id
     JOIN pick_sets s ON s.id = run.pick_set_id
     LEFT JOIN users author ON author.id = rep.created_by LEFT JOIN users reviewer ON reviewer.id = rep.reviewed_by
     WHERE rep.id = $1`,
    [reportId],
  );
  if (!r) throw new Error('the report no longer exists');
  const options = r.options as ReportOptions;
  const [model, stations, residuals, field, rays, shots] = await Promise.all([
    loadModelVersion(r.model_id),
    listStations(r.line_id),
    loadResidualRows(r.run_id),
    loadFieldRow(r.run_id, options.shotId),
    loadRays(r.run_id, options.shotId),
    dataSource.query('SELECT shot_id, source_x, source_z FROM run_fields WHERE run_id = $1 ORDER BY shot_id', [r.run_id]),
  ]);
  if (!field) throw new Error(`the run has no travel-time field for shot ${options.shotId}`);
  const times = new Float32Array(new Uint8Array(inflateRawSync(field.data)).buffer);
  return {
    reportId,
    status: r.status,
    date: new Date(),
    consultancy: demoConsultancy,
    project: { name: r.project, site: r.site, clientOrganisation: r.client_organisation },
    line: { name: r.line, notes: r.line_notes },
    preparedBy: r.prepared_by ?? 'unknown',
    reviewedBy: r.reviewed_by ?? null,
    acquisitionNotes: options.acquisitionNotes || r.line_notes,
    stations,
    shots: shots.map((s: { shot_id: string; source_x: number; source_z: number }) => ({ shotId: s.shot_id, sourceX: s.source_x, sourceZ: s.source_z })),
    model: { name: model.name, version: model.version, comment: model.comment, file: model.model },
    run: { id: r.run_id, order: r.scheme_order, createdAt: r.run_created_at, pickSetFile: r.file_name, pickSetRevision: r.pick_set_revision, stats: r.stats as RunStatsJson },
    residuals: residuals.map((x: { shotId: string; receiverX: number; observedMs: number; computedMs: number; residualMs: number; sigmaMs: number; excluded: boolean }) => ({
      shotId: x.shotId, receiverX: x.receiverX, observedMs: x.observedMs, computedMs: x.computedMs, residualMs: x.residualMs, sigmaMs: x.sigmaMs, excluded: x.excluded,
    })),
    section: { shotId: options.shotId, grid: field.grid, source: field.source, times, rays },
    isoVelocity: options.isoVelocity,
  };
}
