/**
 * The demo's finished work, made by the real worker at first start (issue 17 item 2): a forward run
 * of the demo model against its picks, and a report of it taken through the whole review (made,
 * submitted, approved, shared), so a client who signs in first finds a report and everyone sees the
 * order of the work. Idempotent: each step is skipped when already done; run again, it finishes
 * what an interrupted first start left.
 */
import type { Queue } from 'bullmq';
import type { DataSource } from 'typeorm';
import { demoLine, demoProject } from '../../fixtures/demo/scenario';
import { startReportBody } from '../../shared/schemas/reports';
import { PickSet, Project, Report, Run, SurveyLine, User, VelocityModel } from '../entities';
import type { Mailer } from '../mail/mailer';
import { startReport, stepReport } from './reports';
import { startRun } from './runs';

const ACQUISITION = 'Invented demo survey: 48 geophones at 2.5 m, seven sledgehammer shots, dry weather.';

export interface DemoWorkflowDeps {
  ds: DataSource;
  queue: Queue;
  mailer: Mailer;
  /** Waits between looks at a job's progress (ms) and gives up after `timeoutMs`. */
  pollMs?: number;
  timeoutMs?: number;
  log?: (line: string) => void;
}

export async function finishDemoWorkflow({ ds, queue, mailer, pollMs = 500, timeoutMs = 600_000, log = () => {} }: DemoWorkflowDeps): Promise<{ runId: string; reportId: string }> {
  const project = await ds.getRepository(Project).findOneByOrFail({ name: demoProject.name });
  const line = await ds.getRepository(SurveyLine).findOneByOrFail({ projectId: project.id, name: demoLine.name });
  const users = ds.getRepository(User);
  const geo = await users.findOneByOrFail({ email: 'geo@timefield.test' });
  const lead = await users.findOneByOrFail({ email: 'lead@timefield.test' });
  const until = async (what: string, done: () => Promise<boolean>) => {
    const end = Date.now() + timeoutMs;
    while (!(await done())) {
      if (Date.now() > end) throw new Error(`the demo ${what} was not ready after ${timeoutMs / 1000} s (is the worker running?)`);
      await new Promise((r) => setTimeout(r, pollMs));
    }
  };

  let run = await ds.getRepository(Run).findOne({ where: { lineId: line.id, status: 'done' }, order: { createdAt: 'ASC' } });
  if (!run) {
    const pending = await ds.getRepository(Run).findOne({ where: { lineId: line.id, status: 'queued' } }) ?? (await ds.getRepository(Run).findOne({ where: { lineId: line.id, status: 'running' } }));
    let id = pending?.id;
    if (!id) {
      const model = await ds.getRepository(VelocityModel).findOneOrFail({ where: { lineId: line.id }, order: { createdAt: 'ASC' } });
      const pickSet = await ds.getRepository(PickSet).findOneOrFail({ where: { lineId: line.id }, order: { createdAt: 'ASC' } });
      id = (await startRun(geo.id, project.id, { modelId: model.id, pickSetId: pickSet.id, order: 2 }, queue)).id;
      log('demo run queued');
    }
    await until('run', async () => (await ds.getRepository(Run).findOneByOrFail({ id })).status === 'done');
    run = await ds.getRepository(Run).findOneByOrFail({ id });
    log('demo run done');
  }

  const reports = ds.getRepository(Report);
  let report = await reports.findOne({ where: { runId: run.id }, order: { createdAt: 'ASC' } });
  if (!report) {
    report = await startReport(geo.id, project.id, run.id, startReportBody.parse({ acquisitionNotes: ACQUISITION }), queue);
    log('demo report started');
  }
  const reportId = report.id;
  const rendered = () => until('report PDF', async () => (await reports.findOneByOrFail({ id: reportId })).renderState === 'ready');
  const step = async (name: 'submit' | 'approve' | 'share', by: User) => {
    await stepReport(by as Express.User, project.id, reportId, name, '', queue, mailer);
    log(`demo report ${{ submit: 'submitted', approve: 'approved', share: 'shared' }[name]}`);
  };
  if (report.status === 'draft' || report.status === 'returned') {
    await rendered();
    await step('submit', geo);
    report = await reports.findOneByOrFail({ id: reportId });
  }
  if (report.status === 'submitted') {
    await rendered();
    await step('approve', lead);
    report = await reports.findOneByOrFail({ id: reportId });
  }
  if (report.status === 'approved') {
    await until('approved PDF', async () => {
      const [{ ready }] = await ds.query('SELECT approved_pdf IS NOT NULL AS ready FROM reports WHERE id = $1', [reportId]);
      return ready;
    });
    await step('share', lead);
  }
  return { runId: run.id, reportId };
}
