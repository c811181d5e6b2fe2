/**
 * A report made from an inversion (issue 11 item 6): a real worker inverts a small invented
 * gradient survey and renders the PDF, read back with Debian's pdftotext like a reader's tools
 * would. The report carries the tomography limitations next to the usual cautions, the
 * convergence table and the depth table of the chosen iso-velocity; it follows the same review
 * workflow as a run report.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { pageTexts } from '../unit/report/poppler';
import { binaryBody, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { flatStations, gradientPicks, range } from './support/inversion-data';
import { startWorker, waitFor, type WorkerProcess } from './support/worker';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

const RECEIVERS = range(0, 48, 2);

describe('reports of inversions', () => {
  let t: TestApp;
  let world: World;
  let worker: WorkerProcess;
  let geo: Agent, lead: Agent, client: Agent;
  let inversionId: string;
  let reportId: string;

  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    await t.queue.obliterate({ force: true });
    worker = startWorker();
    [geo, lead, client] = await Promise.all((['geophysicist', 'lead', 'client'] as const).map((r) => signedInAgent(t.app, emailOf(r), PASSWORD)));
    const lineId = (await geo.post(`/api/projects/${world.projectA.id}/lines`).set('X-CSRF-Token', geo.csrf).send({ name: 'report line' }).expect(201)).body.id;
    await geo.put(`/api/lines/${lineId}/stations`).set('X-CSRF-Token', geo.csrf).send(flatStations(RECEIVERS)).expect(200);
    const survey = gradientPicks({ v0: 500, k: 20, shotXs: [0, 16, 32, 48], receiverXs: RECEIVERS, sigmaMs: 0.5 });
    const pickSetId = (await geo.post(`/api/lines/${lineId}/picksets`).set('X-CSRF-Token', geo.csrf).attach('file', Buffer.from(survey.csv), 'gradient.picks.csv').expect(201)).body.id;
    inversionId = (await geo.post('/api/inversions').set('X-CSRF-Token', geo.csrf).send({ pickSetId, start: { kind: 'gradient' }, label: 'for the report' }).expect(202)).body.id;
    const done = await waitFor(async () => {
      const v = (await geo.get(`/api/inversions/${inversionId}`)).body;
      return ['done', 'failed', 'cancelled'].includes(v.status) ? v : undefined;
    }, 120_000, 'the inversion');
    expect(done.status, worker.output.join('')).toBe('done');
  }, 180_000);
  afterAll(async () => {
    await worker?.stop();
    await t?.close();
  });

  it('refuses a bad iso-velocity (400) and a report of an unfinished inversion (409)', async () => {
    const bad = await lead.post(`/api/inversions/${inversionId}/reports`).set('X-CSRF-Token', lead.csrf).send({ isoVelocity: 20_000 });
    expect(bad.status).toBe(400);
    // A second row, as a queued inversion would be (inserted directly: no worker must take it).
    const [{ id: queued }] = await dataSource.query(
      `INSERT INTO inversions (line_id, pick_set_id, pick_set_revision, start_kind, start_spacing, grid, surface, settings, shots, picks, status, created_by)
       SELECT line_id, pick_set_id, pick_set_revision, start_kind, start_spacing, grid, surface, settings, shots, picks, 'queued', created_by FROM inversions WHERE id = $1 RETURNING id`,
      [inversionId],
    );
    const early = await lead.post(`/api/inversions/${queued}/reports`).set('X-CSRF-Token', lead.csrf).send({});
    expect(early.status).toBe(409);
    await dataSource.query('DELETE FROM inversions WHERE id = $1', [queued]);
  });

  it('renders a PDF with the section, convergence, depth table and the limitations of tomography', async () => {
    const res = await lead.post(`/api/inversions/${inversionId}/reports`).set('X-CSRF-Token', lead.csrf).send({ isoVelocity: 700, coverageThreshold: 2 });
    expect(res.status).toBe(202);
    reportId = res.body.id;
    const ready = await waitFor(async () => {
      const r = (await lead.get(`/api/reports/${reportId}`)).body;
      return r.render.state === 'ready' || r.render.state === 'failed' ? r : undefined;
    }, 90_000, 'the PDF');
    expect(ready.render.state, `${ready.render.error} ${worker.output.join('')}`).toBe('ready');
    expect(ready).toMatchObject({ inversionId, runId: null, status: 'draft', options: { isoVelocity: 700, coverageThreshold: 2 } });
    expect(ready.lineId).toMatch(/^[0-9a-f-]{36}$/); // staff link back to the inversion's page
    const pdf = await lead.get(`/api/reports/${reportId}/pdf`).buffer(true).parse(binaryBody);
    expect(pdf.status).toBe(200);
    const file = join(mkdtempSync(join(tmpdir(), 'tf-invreport-')), 'report.pdf');
    writeFileSync(file, pdf.body);
    const text = pageTexts(file).join('\n').replace(/\s+/g, ' ');
    for (const heading of ['Velocity section from the inversion', 'Depth to the 700 m/s surface', 'Convergence', 'Misfit of the final model', 'Method statement and settings', 'Limitations and cautions']) {
      expect(text).toContain(heading);
    }
    expect(text).toMatch(/borehole/i);
    expect(text).toMatch(/non-unique|not unique/i);
    expect(text).toContain('gradient.picks.csv');
  }, 120_000);

  it('appears in the project’s report list, hidden from the client until shared', async () => {
    const list = (await lead.get(`/api/projects/${world.projectA.id}/reports`).expect(200)).body as { id: string; inversionId: string | null; line: string }[];
    expect(list.find((r) => r.id === reportId)).toMatchObject({ inversionId, line: 'report line' });
    expect((await client.get(`/api/reports/${reportId}`)).status).toBe(403);
  });
});
