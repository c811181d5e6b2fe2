/**
 * Issue 16: the consultancy's name, address and logo come from the organisation setting (admin
 * writes, any signed-in account reads) and print on the report cover and page headers, not the demo's.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { encodeRgbPng } from '../../worker/report/png';
import { pageTexts, pdfImages } from '../unit/report/poppler';
import { binaryBody, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { startWorker, waitFor, type WorkerProcess } from './support/worker';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

/** A 37 × 23 px PNG: an odd size that pdfimages can pick out of the report. */
const LOGO = encodeRgbPng(37, 23, new Uint8Array(37 * 23 * 3).fill(90));

describe('organisation setting', () => {
  let t: TestApp;
  let world: World;
  let worker: WorkerProcess;
  let admin: Agent, geo: Agent, client: Agent;

  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    await dataSource.query('DELETE FROM organisation');
    await t.queue.obliterate({ force: true });
    worker = startWorker();
    [admin, geo, client] = await Promise.all((['admin', 'geophysicist', 'client'] as const).map((r) => signedInAgent(t.app, emailOf(r), PASSWORD)));
  }, 60_000);
  afterAll(async () => {
    await worker?.stop();
    await t?.close();
  });

  const put = (body: unknown) => admin.put('/api/organisation').set('X-CSRF-Token', admin.csrf).send(body as object);
  const putLogo = (bytes: Buffer, name = 'logo.png') => admin.put('/api/organisation/logo').set('X-CSRF-Token', admin.csrf).attach('file', bytes, name);

  it('starts empty, refuses a blank name with its path, and saves name and address', async () => {
    expect((await geo.get('/api/organisation').expect(200)).body).toMatchObject({ name: '', hasLogo: false });
    const blank = await put({ name: '  ', address: 'x' });
    expect(blank.status).toBe(400);
    expect(blank.body.issues[0].path).toBe('name');
    expect((await put({ name: 'Fenmoor Survey Partners (fictional)', address: '12 Marsh Row, Fenmoor (fictional)', colour: 'red' })).status).toBe(400);
    await put({ name: 'Fenmoor Survey Partners (fictional)', address: '12 Marsh Row, Fenmoor (fictional)' }).expect(200);
    expect((await client.get('/api/organisation').expect(200)).body).toMatchObject({ name: 'Fenmoor Survey Partners (fictional)', address: '12 Marsh Row, Fenmoor (fictional)' });
  });

  it('takes a PNG logo checked by its bytes, not its name, and refuses anything else', async () => {
    const fake = await putLogo(Buffer.from('GIF89a not a logo'), 'logo.png');
    expect(fake.status).toBe(422);
    expect(fake.body.issues[0].path).toBe('file');
    // Right signature, broken body: the PDF library could not embed it.
    const broken = await putLogo(Buffer.concat([LOGO.subarray(0, 8), Buffer.from('garbage')]));
    expect(broken.status).toBe(422);
    const huge = await putLogo(Buffer.concat([LOGO, Buffer.alloc(600 * 1024)]));
    expect(huge.status).toBe(413);
    expect((await admin.put('/api/organisation/logo').set('X-CSRF-Token', admin.csrf).send({})).status).toBe(400);
    await putLogo(LOGO, 'anything.bin').expect(200);
    const back = await geo.get('/api/organisation/logo').buffer(true).parse(binaryBody);
    expect(back.headers['content-type']).toBe('image/png');
    expect(Buffer.compare(back.body, LOGO)).toBe(0);
  });

  it('prints the setting, not the demo consultancy, on the report cover and page headers, with the logo', async () => {
    const runId = (await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: world.modelA, pickSetId: world.pickSetA }).expect(202)).body.id;
    await waitFor(async () => ((await dataSource.query('SELECT status FROM runs WHERE id = $1', [runId]))[0].status === 'done' ? true : undefined), 60_000, 'the run');
    const id = (await geo.post(`/api/runs/${runId}/reports`).set('X-CSRF-Token', geo.csrf).send({ shotId: 'F' }).expect(202)).body.id;
    const state = await waitFor(async () => {
      const s = (await dataSource.query('SELECT render_state FROM reports WHERE id = $1', [id]))[0].render_state;
      return s === 'ready' || s === 'failed' ? s : undefined;
    }, 60_000, 'the render');
    expect(state).toBe('ready');
    const pdf = await geo.get(`/api/reports/${id}/pdf`).buffer(true).parse(binaryBody);
    const path = join(mkdtempSync(join(tmpdir(), 'tf-org-')), 'r.pdf');
    writeFileSync(path, pdf.body);
    const pages = pageTexts(path);
    expect(pages[0]).toContain('Fenmoor Survey Partners (fictional)');
    expect(pages[0]).toContain('12 Marsh Row, Fenmoor (fictional)');
    expect(pages[1]).toContain('Fenmoor Survey Partners (fictional)'); // the running header from page 2
    expect(pages.join('\n')).not.toContain('Cobbleford');
    expect(pdfImages(path).some((im) => im.page === 1 && im.width === 37 && im.height === 23)).toBe(true);
  }, 120_000);
});
