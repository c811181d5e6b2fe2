import { Router, type Request } from 'express';
import type { Queue } from 'bullmq';
import { reportStepBody, startInversionReportBody, startReportBody } from '../../shared/schemas/reports';
import { HttpError } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { idempotent } from '../http/idempotency';
import { parse } from '../http/parse';
import { allows, authorize } from '../policies/authorize';
import type { Action } from '../policies/table';
import { projectFromParam, projectOfInversion, projectOfReport, projectOfRun } from '../policies/scopes';
import { presentReport } from '../presenters/report';
import { getReport, listProjectReports, loadPdf, reportHistory } from '../services/reportQueries';
import { startInversionReport, startReport, stepReport, type ReportStep } from '../services/reports';
import { inversionSection, runSection, writeExport, type ExportFile } from '../services/exports';

/** What a report hands on besides its PDF (the gridded section stays with the project team). */
const REPORT_EXPORTS = ['section.dxf', 'depth-to-rock.csv', 'depth-to-rock.geojson'] as const;

/** Clients (members without report.read_unshared) see only approved renders and a redacted history. */
const isClientView = (req: Request) => !allows('report.read_unshared', req.access!.role, req.user!.globalRole === 'admin');

/** A report that is not yet shared exists, for a client, only as "not for you yet". */
async function readableReport(req: Request) {
  const report = await getReport(req.params.reportId as string);
  if (report.status !== 'shared' && isClientView(req)) {
    throw new HttpError(403, 'forbidden', 'This report has not been shared with you yet.');
  }
  return report;
}

const STEP_ACTIONS: Record<ReportStep, Action> = { submit: 'report.submit', approve: 'report.review', return: 'report.review', share: 'report.share' };

export function reportsRouter(queue: Queue, mailer: Mailer): Router {
  const r = Router();

  r.post('/runs/:runId/reports', authorize('reports.create', projectOfRun), idempotent(), async (req, res) => {
    const report = await startReport(req.user!.id, req.access!.projectId, req.params.runId as string, parse(startReportBody, req.body), queue);
    res.status(202).json({ id: report.id });
  });

  r.post('/inversions/:inversionId/reports', authorize('reports.create', projectOfInversion), idempotent(), async (req, res) => {
    const body = parse(startInversionReportBody, req.body);
    const report = await startInversionReport(req.user!.id, req.access!.projectId, req.params.inversionId as string, body, queue);
    res.status(202).json({ id: report.id });
  });

  r.get('/reports/:reportId', authorize('report.read', projectOfReport), async (req, res) => {
    const report = await readableReport(req);
    res.json(presentReport(report, await reportHistory(report.id), isClientView(req)));
  });

  r.get('/reports/:reportId/pdf', authorize('report.read', projectOfReport), async (req, res) => {
    const report = await readableReport(req);
    const pdf = await loadPdf(report.id, isClientView(req));
    if (!pdf) throw new HttpError(409, 'pdf_not_ready', 'The PDF is still being prepared. Try again in a few seconds.');
    res.type('application/pdf').attachment(`timefield-report-${report.id.slice(0, 8)}.pdf`).send(pdf);
  });

  // The report's section for CAD and GIS (issue 19 item 4): whoever may read the report, a client once it is shared.
  // Rock surface: the report's iso-velocity; the files are written from the run or inversion the report was made from.
  r.get('/reports/:reportId/export/:file', authorize('report.read', projectOfReport), async (req, res) => {
    const report = await readableReport(req);
    const file = req.params.file as string;
    if (!(REPORT_EXPORTS as readonly string[]).includes(file)) throw new HttpError(404, 'unknown_export', `No export called "${file}": a report offers ${REPORT_EXPORTS.join(', ')}.`);
    const options = report.options as { isoVelocity: number; coverageThreshold?: number };
    const loaded = report.runId ? await runSection(report.runId) : await inversionSection(report.inversionId!, options.coverageThreshold ?? 1);
    const out = writeExport(loaded, file as ExportFile, { rock: String(options.isoVelocity) });
    res.type(out.type).attachment(`report-${report.id.slice(0, 8)}-${out.name}`).send(out.body);
  });

  for (const step of Object.keys(STEP_ACTIONS) as ReportStep[]) {
    r.post(`/reports/:reportId/${step}`, authorize(STEP_ACTIONS[step], projectOfReport), async (req, res) => {
      const { comment } = parse(reportStepBody, req.body);
      const result = await stepReport(req.user!, req.access!.projectId, req.params.reportId as string, step, comment, queue, mailer);
      res.json({ ...presentReport(result.report, await reportHistory(result.report.id), false), mailed: result.mailed, mailError: result.mailError });
    });
  }

  r.get('/projects/:projectId/reports', authorize('project.reports.list', projectFromParam), async (req, res) => {
    res.json(await listProjectReports(req.access!.projectId, !allows('report.read_unshared', req.access!.role)));
  });

  return r;
}
