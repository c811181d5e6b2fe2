import type { Queue } from 'bullmq';
import { dataSource } from '../db/dataSource';
import { Report } from '../entities';
import type { ReportStatus } from '../entities/Report';
import { HttpError } from '../http/errors';
import { addJob } from '../queue/queue';
import type { Mailer } from '../mail/mailer';
import type { StartInversionReportBody, StartReportBody } from '../../shared/schemas/reports';
import { audit } from './audit';
import { mailForStep } from './reportMail';
import { sourceOf, takeReportSnapshot, type ReportSource } from './reportSnapshot';

export type ReportStep = 'submit' | 'approve' | 'return' | 'share';

/** Which status each step leaves from, and where it goes. */
const STEPS: Record<ReportStep, { from: ReportStatus[]; to: ReportStatus }> = {
  submit: { from: ['draft', 'returned'], to: 'submitted' },
  approve: { from: ['submitted'], to: 'approved' },
  return: { from: ['submitted'], to: 'returned' },
  share: { from: ['approved'], to: 'shared' },
};

/** Starts a report of a finished run: a draft row, and a job that renders its PDF. */
export async function startReport(actorId: string, projectId: string, runId: string, body: StartReportBody, queue: Queue): Promise<Report> {
  const [run] = await dataSource.query('SELECT status FROM runs WHERE id = $1', [runId]);
  if (run?.status !== 'done') throw new HttpError(409, 'run_not_done', `Only a finished run can be reported; this one is ${run?.status ?? 'missing'}.`);
  const shots: { shot_id: string }[] = await dataSource.query('SELECT shot_id FROM run_fields WHERE run_id = $1 ORDER BY shot_id', [runId]);
  const shotId = body.shotId ?? shots[0]?.shot_id;
  if (!shotId || !shots.some((s) => s.shot_id === shotId)) {
    throw new HttpError(422, 'validation_failed', `shotId: this run has shots ${shots.map((s) => s.shot_id).join(', ')}`, [{ path: 'shotId', message: 'not a shot of this run' }]);
  }
  return createDraft(actorId, projectId, { runId }, { shotId, isoVelocity: body.isoVelocity, acquisitionNotes: body.acquisitionNotes }, queue);
}

/** Starts a report of a finished inversion: a draft row, and a job that renders its PDF. */
export async function startInversionReport(actorId: string, projectId: string, inversionId: string, body: StartInversionReportBody, queue: Queue): Promise<Report> {
  const [inv] = await dataSource.query('SELECT status FROM inversions WHERE id = $1', [inversionId]);
  if (inv?.status !== 'done') throw new HttpError(409, 'inversion_not_done', `Only a finished inversion can be reported; this one is ${inv?.status ?? 'missing'}.`);
  return createDraft(actorId, projectId, { inversionId }, { isoVelocity: body.isoVelocity, acquisitionNotes: body.acquisitionNotes, coverageThreshold: body.coverageThreshold }, queue);
}

async function createDraft(actorId: string, projectId: string, source: ReportSource, options: Report['options'], queue: Queue): Promise<Report> {
  const runId = 'runId' in source ? source.runId : null;
  const inversionId = 'inversionId' in source ? source.inversionId : null;
  const report = await dataSource.transaction(async (em) => {
    const snapshot = await takeReportSnapshot(em, source, actorId);
    const saved = await em.save(em.create(Report, { runId, inversionId, projectId, status: 'draft', renderState: 'queued', options, snapshot, createdBy: actorId }));
    await audit(em, { actorId, action: 'report.create', objectType: 'report', objectId: saved.id, projectId, detail: runId ? { runId } : { inversionId } });
    return saved;
  });
  try {
    await queueRender(queue, report.id);
  } catch (err) {
    await dataSource.getRepository(Report).delete({ id: report.id }); // nothing was started
    throw err;
  }
  return report;
}

/** Renders (again) the report's PDF; a render already waiting for the same report is not duplicated. */
async function queueRender(queue: Queue, reportId: string): Promise<void> {
  try {
    await addJob(queue, 'report', { reportId }, `report-${reportId}-${Date.now()}`);
  } catch (err) {
    await dataSource.query(`UPDATE reports SET render_state = 'failed', render_error = $2 WHERE id = $1`, [reportId, 'The PDF could not be queued: the job queue was unreachable.']);
    throw err;
  }
}

/** One workflow step: checks the status, records it in the audit trail, e-mails the people concerned. */
export async function stepReport(actor: Express.User, projectId: string, reportId: string, step: ReportStep, comment: string, queue: Queue, mailer: Mailer) {
  if (step === 'return' && !comment) {
    throw new HttpError(400, 'validation_failed', 'comment: say what needs changing when returning a report', [{ path: 'comment', message: 'say what needs changing when returning a report' }]);
  }
  const report = await dataSource.transaction(async (em) => {
    const found = await em.findOne(Report, { where: { id: reportId }, lock: { mode: 'pessimistic_write' } });
    if (!found) throw new HttpError(404, 'not_found', 'Not found.');
    const { from, to } = STEPS[step];
    if (!from.includes(found.status)) {
      throw new HttpError(409, 'invalid_step', `A ${found.status} report cannot be ${PAST[step]}; it must be ${from.join(' or ')} first.`);
    }
    // A client may only ever receive the approved render; it must exist before sharing.
    if (step === 'share') {
      const [{ ready }] = await em.query('SELECT approved_pdf IS NOT NULL AS ready FROM reports WHERE id = $1', [reportId]);
      if (!ready) throw new HttpError(409, 'approved_pdf_not_ready', 'The approved PDF has not been made yet (or its render failed); share the report once it is ready.');
    }
    found.status = to;
    // What the reviewer approves is what was submitted: freeze the inputs now.
    if (step === 'submit') found.snapshot = await takeReportSnapshot(em, sourceOf(found), found.createdBy);
    if (step === 'approve') found.reviewedBy = actor.id;
    if (step === 'submit' || step === 'approve') found.renderState = 'queued';
    await em.save(found);
    await audit(em, { actorId: actor.id, action: `report.${step}`, objectType: 'report', objectId: reportId, projectId, detail: { comment, status: to } });
    return found;
  });
  // The submitted draft shows the frozen inputs; the approved PDF names its reviewer and status.
  if (step === 'submit' || step === 'approve') await queueRender(queue, reportId);
  const mail = await mailForStep(step, report, actor, comment);
  try {
    await mailer.send(mail);
    return { report, mailed: mail.to };
  } catch (err) {
    console.error(`[mail] ${step} of report ${reportId}: ${(err as Error).message}`);
    return { report, mailed: [], mailError: 'The step is recorded, but the e-mail could not be sent.' };
  }
}

const PAST: Record<ReportStep, string> = { submit: 'submitted', approve: 'approved', return: 'returned', share: 'shared' };
