/**
 * The "report" job: gathers everything the PDF summary shows (worker/report/types.ts) and renders it.
 * The PDF is stored on the report row; a render that fails leaves a message a user understands.
 */
import { inflateRawSync } from 'node:zlib';
import type { Job } from 'bullmq';
import { dataSource } from '../../server/db/dataSource';
import { loadModelVersion } from '../../server/services/models';
import { loadRays, loadResidualRows, loadFieldRow } from '../../server/services/runResults';
import { lineBoreholes, takeReportSnapshot } from '../../server/services/reportSnapshot';
import { renderInversionReportPdf } from '../report/inversion/render';
import { loadLogo } from '../../server/services/organisation';
import type { ReportOptions, ReportSnapshot } from '../../server/entities/Report';
import { renderReportPdf } from '../report/render';
import type { ReportInput, RunStatsJson } from '../report/types';
import { gatherInversionReportInput, inversionRowOf } from './report-inversion';

export async function reportJob(job: Job<{ reportId: string }>): Promise<{ reportId: string; bytes: number }> {
  const { reportId } = job.data;
  await dataSource.query(`UPDATE reports SET render_state = 'rendering', render_error = NULL WHERE id = $1`, [reportId]);
  try {
    const { input, pdf } = await renderAnyReport(reportId);
    // An approved render goes to its own column: the draft file is never what a client receives.
    const approved = input.status === 'approved' || input.status === 'shared';
    const column = approved ? 'approved_pdf' : 'pdf';
    // A draft render that ends after approval must not mark the approved render, still to come, as ready.
    const state = approved ? `'ready'` : `CASE WHEN status IN ('approved', 'shared') THEN render_state ELSE 'ready' END`;
    await dataSource.query(`UPDATE reports SET ${column} = $2, ${column}_rendered_at = now(), render_state = ${state} WHERE id = $1`, [reportId, pdf]);
    return { reportId, bytes: pdf.length };
  } catch (err) {
    await dataSource.query(`UPDATE reports SET render_state = 'failed', render_error = $2 WHERE id = $1`, [reportId, `The PDF could not be made: ${(err as Error).message}`]);
    throw err;
  }
}

/** A report of an inversion or of a forward run, whichever the row names. */
async function renderAnyReport(reportId: string): Promise<{ input: { status: string }; pdf: Buffer }> {
  const inv = await inversionRowOf(reportId);
  if (inv) {
    const [row] = await dataSource.query('SELECT snapshot, created_by FROM reports WHERE id = $1', [reportId]);
    const snap: ReportSnapshot = row.snapshot ?? (await takeReportSnapshot(dataSource.manager, { inversionId: inv.inversion_id }, row.created_by));
    const input = await gatherInversionReportInput(reportId, inv, snap);
    return { input, pdf: await renderInversionReportPdf(input) };
  }
  const input = await gatherReportInput(reportId);
  return { input, pdf: await renderReportPdf(input) };
}

/**
 * The report's frozen snapshot (stations, names, consultancy) plus the run's stored results, which
 * never change once the run is done. A report made before snapshots existed gets one taken now.
 */
export async function gatherReportInput(reportId: string): Promise<ReportInput> {
  const [r] = await dataSource.query(
    `SELECT rep.status, rep.options, rep.snapshot, rep.run_id, rep.created_by, reviewer.name AS reviewed_by,
            run.scheme_order, run.created_at AS run_created_at, run.stats
     FROM reports rep JOIN runs run ON run.id = rep.run_id LEFT JOIN users reviewer ON reviewer.id = rep.reviewed_by
     WHERE rep.id = $1`,
    [reportId],
  );
  if (!r) throw new Error('the report no longer exists');
  const options = r.options as ReportOptions;
  const snap: ReportSnapshot = r.snapshot ?? (await takeReportSnapshot(dataSource.manager, { runId: r.run_id }, r.created_by));
  if (!options.shotId || !snap.modelVersionId) throw new Error('the report names no shot or model version');
  const [model, residuals, field, rays, shots] = await Promise.all([
    loadModelVersion(snap.modelVersionId),
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
    consultancy: snap.consultancy.name,
    consultancyAddress: snap.consultancy.address,
    consultancyLogo: (await loadLogo())?.data ?? null,
    project: snap.project,
    velocityColours: snap.velocityColours ?? null,
    crs: snap.crs ?? null,
    line: { name: snap.line.name, notes: snap.line.notes },
    preparedBy: snap.preparedBy,
    reviewedBy: r.reviewed_by ?? null,
    acquisitionNotes: options.acquisitionNotes || snap.line.notes,
    stations: snap.stations,
    shots: shots.map((s: { shot_id: string; source_x: number; source_z: number }) => ({ shotId: s.shot_id, sourceX: s.source_x, sourceZ: s.source_z })),
    model: { name: model.name, version: model.version, comment: model.comment, file: model.model },
    run: { id: r.run_id, order: r.scheme_order, createdAt: r.run_created_at, pickSetFile: snap.pickSet.file, pickSetRevision: snap.pickSet.revision, stats: r.stats as RunStatsJson },
    residuals: residuals.map((x: { shotId: string; receiverX: number; observedMs: number; computedMs: number; residualMs: number; sigmaMs: number; excluded: boolean }) => ({
      shotId: x.shotId, receiverX: x.receiverX, observedMs: x.observedMs, computedMs: x.computedMs, residualMs: x.residualMs, sigmaMs: x.sigmaMs, excluded: x.excluded,
    })),
    section: { shotId: options.shotId, grid: field.grid, source: field.source, times, rays },
    isoVelocity: options.isoVelocity,
    // A snapshot taken before reports carried the holes: the line's holes now.
    boreholes: snap.boreholes ?? (await lineBoreholes(dataSource.manager, snap.line.id)),
  };
}
