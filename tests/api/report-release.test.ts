/**
 * Issue 16, reports: a client only ever receives the approved render; what a report shows is frozen
 * at submission; a client sees the state and dates of the review, not its comments or staff names.
 * Requirements from the issue text; the PDF is read back with poppler's pdftotext.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { pageTexts } from '../unit/report/poppler';
import { binaryBody, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { startWorker, waitFor, type WorkerProcess } from './support/worker';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

const SIX_STATIONS = [0, 5, 10, 15, 20, 25].map((x, i) => ({ station: i + 1, x, z: 0 }));
const THREE_STATIONS = SIX_STATIONS.slice(0, 3);

describe('reports: release to the client and frozen inputs', () => {
  let t: TestApp;
  let world: World;
  let worker: WorkerProcess | null = null;
  let geo: Agent, lead: Agent, tech: Agent, client: Agent;
  let runId: string;
  const dir = mkdtempSync(join(tmpdir(), 'tf-report-release-'));

  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    await t.queue.obliterate({ force: true });
    worker = startWorker();
    [geo, lead, tech, client] = await Promise.all(
      (['geophysicist', 'lead', 'field_tech', 'client'] as const).map((r) => signedInAgent(t.app, emailOf(r), PASSWORD)),
    );
    await tech.put(`/api/lines/${world.lineA.id}/stations`).set('X-CSRF-Token', tech.csrf).send(SIX_STATIONS).expect(200);
    runId = (await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: world.modelA, pickSetId: world.pickSetA }).expect(202)).body.id;
    await waitFor(async () => ((await dataSource.query('SELECT status FROM runs WHERE id = $1', [runId]))[0].status === 'done' ? true : undefined), 60_000, 'the run');
  }, 120_000);
  afterAll(async () => {
    await worker?.stop();
    await t?.close();
  });

  const step = (agent: Agent, id: string, name: string, comment?: string) =>
    agent.post(`/api/reports/${id}/${name}`).set('X-CSRF-Token', agent.csrf).send(comment === undefined ? {} : { comment });
  const renderState = async (id: string) => (await dataSource.query('SELECT render_state FROM reports WHERE id = $1', [id]))[0].render_state as string;
  const waitRendered = (id: string) =>
    waitFor(async () => {
      const s = await renderState(id);
      return s === 'ready' || s === 'failed' ? s : undefined;
    }, 60_000, 'the render');
  /** The render after approval: done when the approved PDF exists or the render failed. */
  const waitApprovedRender = (id: string) =>
    waitFor(async () => {
      const [r] = await dataSource.query('SELECT render_state, approved_pdf_rendered_at FROM reports WHERE id = $1', [id]);
      return r.approved_pdf_rendered_at ? 'ready' : r.render_state === 'failed' ? 'failed' : undefined;
    }, 60_000, 'the approved render');
  const pdfText = (name: string, bytes: Buffer) => {
    const path = join(dir, `${name}.pdf`);
    writeFileSync(path, bytes);
    return pageTexts(path).join('\n').replace(/\s+/g, ' ');
  };
  /** A submitted report whose draft PDF has been rendered. */
  async function submittedReport(): Promise<string> {
    const id = (await geo.post(`/api/runs/${runId}/reports`).set('X-CSRF-Token', geo.csrf).send({ shotId: 'F' }).expect(202)).body.id;
    expect(await waitRendered(id)).toBe('ready');
    await step(geo, id, 'submit').expect(200);
    expect(await waitRendered(id)).toBe('ready');
    return id;
  }
  /** Shares behind the API's back, to prove the PDF route itself never hands out the draft. */
  const forceShared = (id: string) => dataSource.query(`UPDATE reports SET status = 'shared' WHERE id = $1`, [id]);

  it('(a) refuses to share until the approved render exists and never gives the client the draft meanwhile', async () => {
    const id = await submittedReport();
    await worker!.stop(); // the approved render cannot finish while no worker runs
    worker = null;
    await step(lead, id, 'approve', 'Fine.').expect(200);
    const refused = await step(lead, id, 'share');
    expect(refused.status).toBe(409);
    expect(refused.body.message).toMatch(/approved PDF/);
    await forceShared(id);
    const early = await client.get(`/api/reports/${id}/pdf`);
    expect(early.status).toBe(409);
    expect((await client.get(`/api/reports/${id}`)).body.pdfReady).toBe(false);

    worker = startWorker();
    expect(await waitApprovedRender(id)).toBe('ready');
    const pdf = await client.get(`/api/reports/${id}/pdf`).buffer(true).parse(binaryBody);
    expect(pdf.status).toBe(200);
    // The approved render names its reviewer (worker/report/cover.ts); the draft cannot.
    expect(pdfText('a-approved', pdf.body)).toContain('Test lead');
  }, 120_000);

  it('(b) a failed render after approval leaves the client with nothing rather than the draft', async () => {
    const id = await submittedReport();
    // A shot the run does not have makes the render fail (worker/processors/report.ts).
    await dataSource.query(`UPDATE reports SET options = jsonb_set(options, '{shotId}', '"no-such-shot"') WHERE id = $1`, [id]);
    await step(lead, id, 'approve', 'Fine.').expect(200);
    expect(await waitApprovedRender(id)).toBe('failed');
    expect((await step(lead, id, 'share')).status).toBe(409);
    await forceShared(id);
    expect((await client.get(`/api/reports/${id}/pdf`)).status).toBe(409);
    expect((await geo.get(`/api/reports/${id}/pdf`)).status).toBe(200); // staff keep the draft
  }, 120_000);

  it('(c) the approved PDF shows the stations as submitted, not as edited afterwards', async () => {
    const id = await submittedReport();
    await tech.put(`/api/lines/${world.lineA.id}/stations`).set('X-CSRF-Token', tech.csrf).send(THREE_STATIONS).expect(200);
    await step(lead, id, 'approve', 'Fine.').expect(200);
    expect(await waitApprovedRender(id)).toBe('ready');
    await step(lead, id, 'share').expect(200);
    const pdf = await client.get(`/api/reports/${id}/pdf`).buffer(true).parse(binaryBody);
    expect(pdf.status).toBe(200);
    const text = pdfText('c-approved', pdf.body);
    // worker/report/survey.ts writes "Line <name>: <n> stations from x = …".
    expect(text).toContain('Line A-1: 6 stations');
    expect(text).not.toContain('Line A-1: 3 stations');
    await tech.put(`/api/lines/${world.lineA.id}/stations`).set('X-CSRF-Token', tech.csrf).send(SIX_STATIONS).expect(200);
  }, 120_000);

  it('shows the client the state and dates of the review only; staff see comments and names', async () => {
    const id = await submittedReport();
    await step(lead, id, 'return', 'Internal: redo shot F picks.').expect(200);
    await step(geo, id, 'submit').expect(200);
    await step(lead, id, 'approve', 'Fine.').expect(200);
    expect(await waitApprovedRender(id)).toBe('ready');
    await step(lead, id, 'share').expect(200);

    const seen = (await client.get(`/api/reports/${id}`).expect(200)).body;
    expect(seen.status).toBe('shared');
    expect(seen.history.map((h: { action: string }) => h.action)).toEqual(['create', 'submit', 'return', 'submit', 'approve', 'share']);
    for (const h of seen.history) expect(Object.keys(h).sort()).toEqual(['action', 'at']);
    expect(seen.render).toEqual({ state: 'ready', renderedAt: expect.any(String) });
    const raw = JSON.stringify(seen);
    for (const secret of ['Internal: redo', 'Test lead', 'Test geophysicist']) expect(raw).not.toContain(secret);
    // The client's list of reports names no staff either.
    const list = JSON.stringify((await client.get(`/api/projects/${world.projectA.id}/reports`).expect(200)).body);
    for (const secret of ['Test lead', 'Test geophysicist']) expect(list).not.toContain(secret);

    for (const staff of [geo, lead, tech]) {
      const history = (await staff.get(`/api/reports/${id}`).expect(200)).body.history as { action: string; actor: string; comment: string }[];
      expect(history.find((h) => h.action === 'return')).toMatchObject({ actor: 'Test lead', comment: 'Internal: redo shot F picks.' });
    }
  }, 120_000);
});
