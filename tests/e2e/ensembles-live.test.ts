/**
 * The ensemble pages against the real routes and two real worker processes (issue 20): a geophysicist
 * starts an ensemble from a finished inversion of the demo picks (bad input refused on its field
 * first), follows the members per worker, and reads the combined result — the accuracy sentence, the
 * sections, the depth band per station (with its CSV) and every member; a field technician reads but
 * cannot start one; a client cannot reach it. Screenshots at 1440×900 and 390×844 land in
 * tests/e2e/screenshots/ (ignored by git).
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoLine, demoProject } from '../../fixtures/demo/scenario';
import type { EnsembleSectionView, EnsembleView } from '../../shared/schemas/ensembles';
import { startWorker, waitFor, type WorkerProcess } from '../api/support/worker';
import { api, signIn } from './support/page';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';

describe('ensemble pages on the real routes and workers', () => {
  let server: E2eServer;
  let workers: WorkerProcess[] = [];
  let browser: Browser;
  let geo: BrowserContext;
  let lineId = '';
  let inversionId = '';
  let ensembleId = '';

  beforeAll(async () => {
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    server = await startDemoServer();
    browser = await launchBrowser();
    workers = ['e2e-ensemble-1', 'e2e-ensemble-2'].map((name) => startWorker(name, { WORKER_THREADS: '1' }));
    geo = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await geo.newPage();
    await signIn(page, server.baseUrl, 'geo@timefield.test');
    await page.getByRole('link', { name: demoProject.name }).click();
    await page.getByRole('link', { name: demoLine.name }).click();
    await page.waitForURL(/\/lines\/[0-9a-f-]{36}/);
    lineId = new URL(page.url()).pathname.split('/')[2]!;
    const line = await api(page, 'GET', `/api/lines/${lineId}`);
    const pickSetId = (line.body.pickSets as { id: string }[])[0]!.id;
    inversionId = (await api(page, 'POST', '/api/inversions', { pickSetId, start: { kind: 'gradient' } })).body.id as string;
    await waitFor(async () => ((await api(page, 'GET', `/api/inversions/${inversionId}`)).body.status === 'done' ? true : undefined), 180_000, 'the base inversion');
    await page.close();
  }, 240_000);
  afterAll(async () => {
    await browser?.close();
    await Promise.all(workers.map((w) => w.stop()));
    await server?.close();
  });

  it('starts from the inversion page, follows the members per worker, and shows the combined band', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${inversionId}`);
    await page.getByTestId('start-ensemble-toggle').click();
    // Refused on the field, before anything is sent: one member makes no spread.
    await page.getByTestId('ensemble-members').fill('1');
    await page.getByTestId('start-ensemble').click();
    await page.getByText('must be at least 2').waitFor();
    expect(page.url()).toContain(`/inversions/${inversionId}`);

    await page.getByTestId('ensemble-members').fill('8');
    await page.getByTestId('ensemble-rock').fill('1800');
    await page.getByTestId('ensemble-rock-max').fill('3000');
    await page.getByLabel('Seed (optional)').fill('20261205');
    await page.getByTestId('start-ensemble').click();
    await page.waitForURL(/\/ensembles\/[0-9a-f-]{36}$/);
    ensembleId = new URL(page.url()).pathname.split('/').at(-1)!;
    await page.getByTestId('ensemble-caution').waitFor();
    await page.getByTestId('ensemble-progress').waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'ensemble-running.png'), fullPage: true });

    try {
      await page.locator('[data-testid="ensemble-status"][data-status="done"]').waitFor({ timeout: 240_000 });
    } catch (err) {
      throw new Error(`the ensemble did not finish; workers:\n${workers.map((w) => w.output.join('').slice(-1500)).join('\n')}`, { cause: err });
    }
    const view = (await api(page, 'GET', `/api/ensembles/${ensembleId}`)).body as unknown as EnsembleView;
    const section = (await api(page, 'GET', `/api/ensembles/${ensembleId}/section`)).body as unknown as EnsembleSectionView;
    expect(view.progress.done).toBe(8);
    // Both worker processes took members.
    expect(view.workers.map((w) => w.worker).sort()).toEqual(['e2e-ensemble-1', 'e2e-ensemble-2']);
    await page.getByTestId('ensemble-accuracy').filter({ hasText: /5–95 % band of \d+ ensemble members/ }).waitFor();
    expect(await page.getByTestId('ensemble-fit').textContent()).toContain(`${view.stats!.used} of 8 members used`);
    for (const id of ['ensemble-mean', 'ensemble-spread', 'ensemble-probability']) await page.getByTestId(id).locator('.main-svg').first().waitFor();
    // One row per station, the table's numbers those of the API (one decimal).
    const rows = page.getByTestId('depth-band-table').locator('tbody tr');
    expect(await rows.count()).toBe(section.bands.length);
    const firstBanded = section.bands.findIndex((b) => b.median !== null);
    expect(await rows.nth(firstBanded).locator('td').nth(4).textContent()).toBe(section.bands[firstBanded].median!.toFixed(1));
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-depth-band').click()]);
    const csv = await (await download.createReadStream()).toArray();
    const text = Buffer.concat(csv).toString('utf8');
    expect(text).toMatch(/^# Timefield depth band/);
    expect(text).toContain('station,x_m,ground_z_m,members_resolving,depth_p5_m,depth_median_m,depth_p95_m,elevation_median_m');
    expect(text.trim().split('\n').filter((l) => !l.startsWith('#'))).toHaveLength(section.bands.length + 1);
    expect(await page.getByTestId('ensemble-members').locator('tbody tr').count()).toBe(8);
    // Read once more when the ensemble settled: no member is left showing as running.
    await page.waitForFunction(() => [...document.querySelectorAll('[data-testid="ensemble-members"] tbody tr')].every((r) => r.textContent?.includes('done')));
    // The demo's two boreholes log a top of rock (the trial pit does not): each is set against the band.
    expect(await page.getByTestId('band-ties-table').locator('tbody tr').count()).toBe(2);
    await page.getByTestId('band-ties').getByText(/The logged top of rock lies inside the band of 1800–3000 m\/s at \d of \d holes/).waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'ensemble-done.png'), fullPage: true });

    // The inversion page lists it; the line's depth-to-rock table carries its band beside the inversion's depth.
    await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${inversionId}`);
    await page.getByTestId('ensembles-table').getByRole('link').first().waitFor();
    await page.goto(`${server.baseUrl}/lines/${lineId}?tab=rock`);
    await page.getByTestId('depth-to-rock-table').getByText('Ensemble band, 1800–3000 m/s (m)').waitFor();
    const banded = section.bands[firstBanded];
    await page.getByTestId('depth-to-rock-table').getByText(`${banded.p5!.toFixed(1)}–${banded.p95!.toFixed(1)}`).first().waitFor();
    await page.close();
  }, 360_000);

  it('reads on a phone without sideways scrolling of the page', async () => {
    const phone = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await phone.newPage();
    await signIn(page, server.baseUrl, 'geo@timefield.test');
    await page.goto(`${server.baseUrl}/lines/${lineId}/ensembles/${ensembleId}`);
    await page.getByTestId('depth-band-table').waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'ensemble-phone.png'), fullPage: false });
    await phone.close();
  });

  it('a field technician reads it but cannot start one; a client cannot reach it', async () => {
    const tech = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await tech.newPage();
    await signIn(page, server.baseUrl, 'tech@timefield.test');
    await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${inversionId}`);
    await page.getByTestId('ensembles-table').waitFor();
    expect(await page.getByTestId('start-ensemble-toggle').count()).toBe(0);
    await page.goto(`${server.baseUrl}/lines/${lineId}/ensembles/${ensembleId}`);
    await page.getByTestId('depth-band-table').waitFor();
    expect(await page.getByTestId('cancel-ensemble').count()).toBe(0);
    await tech.close();
    const client = await browser.newContext();
    const cpage = await client.newPage();
    await signIn(cpage, server.baseUrl, 'client@timefield.test');
    expect([403, 404]).toContain((await api(cpage, 'GET', `/api/ensembles/${ensembleId}`)).status);
    await client.close();
  });
});
