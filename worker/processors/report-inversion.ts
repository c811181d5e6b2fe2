/**
 * The inputs of an inversion report (worker/report/inversion/): the report's frozen snapshot
 * (stations, names, consultancy) and the inversion's stored result, which never changes once done.
 */
import { dataSource } from '../../server/db/dataSource';
import type { ReportOptions, ReportSnapshot } from '../../server/entities/Report';
import { loadInversionResiduals, loadInversionSection, loadInversionView } from '../../server/services/inversionReads';
import { loadModelVersion } from '../../server/services/models';
import { loadLogo } from '../../server/services/organisation';
import { lineBoreholes } from '../../server/services/reportSnapshot';
import { inversionReportInput } from '../report/inversion/from-views';
import type { InversionReportInput, ReportEnsemble } from '../report/inversion/types';
import { loadEnsembleSection, loadEnsembleView } from '../../server/services/ensembleReads';

export interface InversionReportRow {
  status: string;
  options: ReportOptions;
  inversion_id: string;
  reviewed_by: string | null;
}

export async function gatherInversionReportInput(reportId: string, r: InversionReportRow, snap: ReportSnapshot): Promise<InversionReportInput> {
  const [view, section, residuals, logo] = await Promise.all([
    loadInversionView(r.inversion_id),
    loadInversionSection(r.inversion_id),
    loadInversionResiduals(r.inversion_id),
    loadLogo(),
  ]);
  const startModel = snap.modelVersionId ? await loadModelVersion(snap.modelVersionId) : null;
  const input = inversionReportInput({
    meta: {
      reportId,
      status: r.status,
      date: new Date(),
      consultancy: snap.consultancy.name,
      consultancyAddress: snap.consultancy.address,
      consultancyLogo: logo?.data ?? null,
      project: snap.project,
      velocityColours: snap.velocityColours ?? null,
      crs: snap.crs ?? null,
      line: { name: snap.line.name, notes: r.options.acquisitionNotes || snap.line.notes },
      preparedBy: snap.preparedBy,
      reviewedBy: r.reviewed_by ?? null,
    },
    view,
    section,
    pickSetFile: snap.pickSet.file,
    startModelName: startModel?.name,
    residuals: residuals.map((x: { shotId: string; receiverX: number; observedMs: number; computedMs: number; residualMs: number; sigmaMs: number; excluded: boolean }) => ({
      shotId: x.shotId, receiverX: x.receiverX, observedMs: x.observedMs, computedMs: x.computedMs, residualMs: x.residualMs, sigmaMs: x.sigmaMs, excluded: x.excluded,
    })),
    isoVelocity: r.options.isoVelocity,
    coverageThreshold: r.options.coverageThreshold,
  });
  // The stations and holes as they were when the report was made or submitted, not as edited since
  // (a snapshot taken before reports carried the holes: the line's holes now).
  const boreholes = snap.boreholes ?? (await lineBoreholes(dataSource.manager, snap.line.id));
  return { ...input, stations: snap.stations, boreholes, ensemble: snap.ensembleId ? await reportEnsemble(snap.ensembleId) : null };
}

/** The ensemble the snapshot names, as the report states it (null when it was deleted since). */
async function reportEnsemble(id: string): Promise<ReportEnsemble | null> {
  const view = await loadEnsembleView(id).catch(() => null);
  if (!view?.stats || view.status !== 'done') return null;
  const section = await loadEnsembleSection(id);
  return {
    members: view.members, used: view.stats.used, excluded: view.stats.excluded, maxChi2: view.stats.maxChi2, seed: view.seed,
    vary: view.vary, rock: view.rockVelocity, bands: section.bands,
  };
}

export const inversionRowOf = async (reportId: string): Promise<InversionReportRow | undefined> =>
  (
    await dataSource.query(
      `SELECT rep.status, rep.options, rep.inversion_id, reviewer.name AS reviewed_by
       FROM reports rep LEFT JOIN users reviewer ON reviewer.id = rep.reviewed_by WHERE rep.id = $1 AND rep.inversion_id IS NOT NULL`,
      [reportId],
    )
  )[0];
