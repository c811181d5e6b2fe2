/**
 * The inversion pages against the real inversion routes and a real worker (issue 11): a geophysicist
 * starts an inversion of the demo picks from the automatic gradient, watches it converge, checks the
 * section's coverage mask and the residuals, and saves the result as a model version that opens in the
 * model editor. Needs the server side of issue 11; on a branch without it (GET /api/lines/:id/inversions
 * answers 404) the test says so and is skipped — tests/e2e/inversions.test.ts covers the pages with the
 * routes stubbed. Screenshots land in tests/e2e/screenshots/ (ignored by git).
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoLine, demoProject } from '../../fixtures/demo/scenario';
import { startWorker, type WorkerProcess } from '../api/support/worker';
import { api, signIn } from './support/page';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';

describe('inversion pages on the real inversion routes', () => {
  let server: E2eServer;
  let worker: WorkerProcess | undefined;
  let browser: Browser;
  let geo: BrowserContext;
  let lineId = '';
  let routesPresent = false;

  beforeAll(async () => {
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    server = await startDemoServer();
    browser = await launchBrowser();
    geo = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await geo.newPage();
    await signIn(page, server.baseUrl, 'geo@timefield.test');
    await page.getByRole('link', { name: demoProject.name }).click();
    await page.getByRole('link', { name: demoLine.name }).click();
    await page.waitForURL(/\/lines\/[0-9a-f-]{36}/);
    lineId = new URL(page.url()).pathname.split('/')[2]!;
    routesPresent = (await api(page, 'GET', `/api/lines/${lineId}/inversions`)).status === 200;
    await page.close();
    if (routesPresent) worker = startWorker('e2e-inversion-worker');
    else console.log('inversions-live: this branch has no inversion routes yet (404); skipped — the stubbed test covers the pages');
  });
  afterAll(async () => {
    await browser?.close();
    await worker?.stop();
    await server?.close();
  });

  it('start from the automatic gradient, converge, read the section and residuals, save as a model version', async (ctx) => {
    if (!routesPresent) return ctx.skip();
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/lines/${lineId}?tab=inversions`);
    await page.getByTestId('start-inversion-form').waitFor();
    await page.getByTestId('inversion-grid-size').filter({ hasText: /Grid \d+ × \d+ nodes/ }).waitFor();
    const gridWords = await page.getByTestId('inversion-grid-size').textContent();
    await page.getByTestId('inversion-label').fill('Live check');
    await page.getByTestId('start-inversion').click();
    await page.waitForURL(/\/inversions\/[0-9a-f-]{36}$/);
    const inversionId = new URL(page.url()).pathname.split('/').at(-1)!;

    // The grid the form announced is the grid the server recorded.
    const view = (await api(page, 'GET', `/api/inversions/${inversionId}`)).body as { grid: { nx: number; nz: number } };
    expect(gridWords).toContain(`${view.grid.nx} × ${view.grid.nz} nodes`);

    try {
      await page.locator('[data-testid="inversion-status"][data-status="done"]').waitFor({ timeout: 240_000 });
    } catch (err) {
      throw new Error(`the inversion did not finish; worker output:\n${worker!.output.join('').slice(-3000)}`, { cause: err });
    }
    await page.getByTestId('inversion-summary').waitFor();
    // The page shows the stored statistics and history (how good the fit is, is the engine's own tests' business).
    const done = (await api(page, 'GET', `/api/inversions/${inversionId}`)).body as { stats: { chi2: number; rms_ms: number; stopReason: string; iterations: number }; history: unknown[] };
    console.log(`inversions-live: demo line from the automatic start: ${JSON.stringify(done.stats)}`);
    expect(await page.getByTestId('inversion-chi2').textContent()).toBe(done.stats.chi2.toFixed(2));
    expect(await page.getByTestId('inversion-rms').textContent()).toBe(`${done.stats.rms_ms.toFixed(2)} ms`);
    expect(await page.getByTestId('inversion-stop-reason').getAttribute('data-reason')).toBe(done.stats.stopReason);
    expect(await page.getByTestId('convergence-chart').first().getAttribute('data-points')).toBe(String(done.history.length));

    const caption = page.getByTestId('inversion-section-caption');
    await caption.waitFor();
    const masked = async () => Number(await caption.getAttribute('data-masked'));
    await page.getByTestId('coverage-threshold').fill('0');
    await expect.poll(masked).toBe(0);
    await page.getByTestId('coverage-threshold').fill('1');
    const atOne = await masked();
    await page.getByTestId('coverage-threshold').fill('5');
    await expect.poll(masked).toBeGreaterThanOrEqual(atOne);
    await page.getByTestId('coverage-threshold').fill('1');
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'inversion-live-done.png'), fullPage: true });

    await page.getByTestId('run-tab-table').click();
    expect(await page.getByTestId('residual-count').textContent()).toMatch(/All 336 picks/);

    await page.getByTestId('save-inversion-model').click();
    const link = page.getByTestId('inversion-model-link');
    await link.waitFor();
    await link.click();
    await page.waitForURL(/\/models\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.close();
  });
});
