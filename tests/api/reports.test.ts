/**
 * Reports end to end: a real worker renders the PDF; the workflow draft → submitted → returned →
 * submitted → approved → shared is walked by the roles allowed to, each step mailed to the local sink.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { binaryBody, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { startWorker, waitFor, type WorkerProcess } from './support/worker';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

describe('reports: PDF, review workflow, client access and mail', () => {
  let t: TestApp;
  let world: World;
  let worker: WorkerProcess;
  let geo: Agent, lead: Agent, tech: Agent, client: Agent, admin: Agent;
  let runId: string;
  let reportId: string;

  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    await t.queue.obliterate({ force: true });
    worker = startWorker();
    [geo, lead, tech, client, admin] = await Promise.all(
      (['geophysicist', 'lead', 'field_tech', 'client', 'admin'] as const).map((r) => signedInAgent(t.app, emailOf(r), PASSWORD)),
    );
    runId = (await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: world.modelA, pickSetId: world.pickSetA }).expect(202)).body.id;
    await waitFor(async () => ((await dataSource.query('SELECT status FROM runs WHERE id = $1', [runId]))[0].status === 'done' ? true : undefined), 60_000, 'the run');
  }, 120_000);
  afterAll(async () => {
    await worker?.stop();
    await t?.close();
  });

  const step = (agent: Agent, name: string, comment?: string) =>
    agent.post(`/api/reports/${reportId}/${name}`).set('X-CSRF-Token', agent.csrf).send(comment === undefined ? {} : { comment });
  const outbox = async () => (await admin.get('/api/outbox').expect(200)).body as { to: string[]; subject: string; body: string }[];

  it('renders a draft PDF of a finished run', async () => {
    const res = await geo.post(`/api/runs/${runId}/reports`).set('X-CSRF-Token', geo.csrf).send({ shotId: 'F', isoVelocity: 500, acquisitionNotes: 'Dry, calm; hammer and plate.' });
    expect(res.status).toBe(202);
    reportId = res.body.id;
    const ready = await waitFor(async () => {
      const r = (await geo.get(`/api/reports/${reportId}`)).body;
      return r.render.state === 'ready' || r.render.state === 'failed' ? r : undefined;
    }, 60_000, 'the PDF');
    expect(ready.render.state, `${ready.render.error} ${worker.output.join('')}`).toBe('ready');
    expect(ready.status).toBe('draft');
    const pdf = await geo.get(`/api/reports/${reportId}/pdf`).buffer(true).parse(binaryBody);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(pdf.body.subarray(0, 5).toString()).toBe('%PDF-');
  }, 90_000);

  it('keeps drafts from the client (403) and other projects from everyone outside (404)', async () => {
    expect((await client.get(`/api/reports/${reportId}`)).status).toBe(403);
    expect((await client.get(`/api/reports/${reportId}/pdf`)).status).toBe(403);
    expect((await client.get(`/api/projects/${world.projectA.id}/reports`)).body).toEqual([]);
    const outsider = await signedInAgent(t.app, emailOf('outsider'), PASSWORD);
    const hidden = await outsider.get(`/api/reports/${reportId}`);
    expect(hidden.status).toBe(404);
    expect(hidden.body).toEqual((await outsider.get('/api/reports/00000000-0000-4000-8000-000000000000')).body);
  });

  it('walks the workflow by role, refusing steps out of order, and mails each step', async () => {
    expect((await step(lead, 'approve')).status).toBe(409); // a draft must be submitted first
    expect((await step(tech, 'submit')).status).toBe(403);
    const submitted = await step(geo, 'submit');
    expect(submitted.status).toBe(200);
    expect(submitted.body).toMatchObject({ status: 'submitted', mailed: ['lead@world.test'] });

    expect((await step(lead, 'return')).status).toBe(400); // a return needs a comment
    const returned = await step(lead, 'return', 'Use the second-order run and say which shot the section shows.');
    expect(returned.body).toMatchObject({ status: 'returned', mailed: ['geophysicist@world.test'] });
    expect((await step(geo, 'approve')).status).toBe(403);
    await step(geo, 'submit', 'Section shows shot F.').expect(200);
    const approved = await step(lead, 'approve', 'Fine.');
    expect(approved.body).toMatchObject({ status: 'approved', mailed: ['geophysicist@world.test'] });
    // Sharing waits for the approved render (tests/api/report-release.test.ts).
    await waitFor(async () => ((await geo.get(`/api/reports/${reportId}`)).body.render.approvedRenderedAt ? true : undefined), 60_000, 'the approved PDF');
    const shared = await step(lead, 'share');
    expect(shared.body).toMatchObject({ status: 'shared', mailed: ['client@world.test'] });
    expect((await step(lead, 'share')).status).toBe(409);

    const mail = await outbox();
    const about = 'Project A, line A-1';
    expect(mail.map((m) => [m.subject, m.to]).reverse()).toEqual([
      [`Report for review: ${about}`, ['lead@world.test']],
      [`Report returned: ${about}`, ['geophysicist@world.test']],
      [`Report for review: ${about}`, ['lead@world.test']],
      [`Report approved: ${about}`, ['geophysicist@world.test']],
      [`Report available: ${about}`, ['client@world.test']],
    ]);
    expect(mail.find((m) => m.subject.startsWith('Report returned'))!.body).toContain('Use the second-order run');
    expect(mail[0].body).toContain(`/reports/${reportId}`);
  });

  it('gives the client the shared report and its PDF, and nothing else of the run', async () => {
    const r = await client.get(`/api/reports/${reportId}`);
    expect(r.status).toBe(200);
    expect(r.body.history.map((h: { action: string }) => h.action)).toEqual(['create', 'submit', 'return', 'submit', 'approve', 'share']);
    const pdf = await waitFor(async () => {
      const res = await client.get(`/api/reports/${reportId}/pdf`).buffer(true).parse(binaryBody);
      return res.status === 200 ? res : undefined;
    }, 30_000, 'the approved PDF');
    expect(pdf.body.subarray(0, 5).toString()).toBe('%PDF-');
    expect((await client.get(`/api/projects/${world.projectA.id}/reports`)).body.map((x: { id: string }) => x.id)).toEqual([reportId]);
    expect((await client.get(`/api/runs/${runId}`)).status).toBe(403);
    expect((await client.get(`/api/picksets/${world.pickSetA}`)).status).toBe(403);
  });

  it('records every step in the project audit trail for the lead', async () => {
    const trail = (await lead.get(`/api/projects/${world.projectA.id}/audit`).expect(200)).body as { action: string; actor: string; detail: { comment?: string } }[];
    const reportSteps = trail.filter((a) => a.action.startsWith('report.')).reverse();
    expect(reportSteps.map((a) => [a.action, a.actor])).toEqual([
      ['report.create', 'Test geophysicist'],
      ['report.submit', 'Test geophysicist'],
      ['report.return', 'Test lead'],
      ['report.submit', 'Test geophysicist'],
      ['report.approve', 'Test lead'],
      ['report.share', 'Test lead'],
    ]);
    expect(reportSteps[2].detail.comment).toMatch(/second-order/);
    expect((await client.get(`/api/projects/${world.projectA.id}/audit`)).status).toBe(403);
  });
});
