/**
 * Forward runs in the browser, end to end with a real worker process: a geophysicist starts a run of
 * the demo model, watches its progress and walks through every results view (section, travel-time
 * curves, misfit map, residual table with CSV export), then compares an order-1 run with it. Bad
 * input is refused in plain words: a model that does not cover the spread, cancelling a run that has
 * already stopped, a comparison of a run with itself. Other roles see what they may.
 * Screenshots land in tests/e2e/screenshots/ (ignored by git) for a person to look at.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoLine, demoProject } from '../../fixtures/demo/scenario';
import { startWorker, type WorkerProcess } from '../api/support/worker';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';
import { api, signIn } from './support/page';



const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? (s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2) : Number.NaN;
};

describe('forward runs: start, progress, results views, comparison', () => {
  let server: E2eServer;
  let worker: WorkerProcess;
  let browser: Browser;
  /** One signed-in geophysicist for the whole walk-through (fewer sign-ins, as a user would work). */
  let geo: BrowserContext;
  let lineId = '';
  let order2RunId = '';
  let order1RunId = '';

  beforeAll(async () => {
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    server = await startDemoServer();
    worker = startWorker('e2e-run-worker');
    browser = await launchBrowser();
    geo = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
    await signIn(await geo.newPage(), server.baseUrl, 'geo@timefield.test');
  });
  afterAll(async () => {
    await browser?.close();
    await worker?.stop();
    await server?.close();
  });

  const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });

  /** Start a run from the line's runs page and land on the run's page. */
  async function startRun(page: Page, order: 1 | 2, modelLabel = /main · version 1/): Promise<string> {
    await page.goto(`${server.baseUrl}/lines/${lineId}/runs`);
    await page.getByTestId('start-run-form').waitFor();
    const model = page.getByLabel('Model version');
    const value = await model.locator('option', { hasText: modelLabel }).first().getAttribute('value');
    await model.selectOption(value!);
    await page.getByLabel(order === 2 ? /Second order/ : /First order/).check();
    await page.getByTestId('start-run').click();
    await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/);
    return new URL(page.url()).pathname.split('/').at(-1)!;
  }

  /** Wait for the page to show the run finished; on a timeout, say what the worker printed. */
  const waitDone = async (page: Page) => {
    try {
      await page.locator('[data-testid="run-status"][data-status="done"]').waitFor({ timeout: 90_000 });
    } catch (err) {
      throw new Error(`the run did not finish; worker output:\n${worker.output.join('').slice(-3000)}`, { cause: err });
    }
  };

  it('geophysicist: starts a second-order run of the demo model and watches it finish', async () => {
    const page = await geo.newPage();
    await page.goto(server.baseUrl);
    await page.getByRole('link', { name: demoProject.name }).click();
    await page.getByRole('link', { name: demoLine.name }).click();
    await page.waitForURL(/\/lines\/[0-9a-f-]{36}/);
    lineId = new URL(page.url()).pathname.split('/')[2]!;

    await page.goto(`${server.baseUrl}/lines/${lineId}/runs`);
    await page.getByTestId('line-runs-empty').waitFor();
    await shot(page, 'run-line-runs-before');

    order2RunId = await startRun(page, 2);
    await page.getByTestId('run-caution').waitFor();
    expect(await page.getByTestId('run-caution').textContent()).toMatch(/non-unique.*boreholes.*qualified professional.*local codes/s);
    // Queued or running straight after the POST: the progress panel says shots done of total.
    const status = await page.getByTestId('run-status').getAttribute('data-status');
    if (status === 'queued' || status === 'running') {
      expect(await page.getByTestId('run-progress').textContent()).toMatch(/Waiting for a solver|of 7 shots done/);
      await shot(page, 'run-progress');
    }
    await waitDone(page);
    await page.getByTestId('run-summary').waitFor();
    await page.close();
  });

  it('summary: RMS near the demo picks\u2019 own noise and a verdict in plain words', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/runs/${order2RunId}`);
    await page.getByTestId('run-summary').waitFor();
    // The demo picks were computed from this very model with Gaussian noise of σ = 0.5 ms (header of
    // fixtures/demo/tq-l1.picks.csv), so the RMS misfit of the generating model must come out close to
    // 0.5 ms and χ² per datum close to 1 (its spread for 336 picks is √(2/336) ≈ 0.08; Bevington &
    // Robinson 2003 — from memory). The bounds leave room for the solver's own small error.
    const rms = Number((await page.getByTestId('stat-rms').textContent())!.replace(/[^\d.]/g, ''));
    const chi2 = Number((await page.getByTestId('stat-chi2').textContent())!.replace(/[^\d.]/g, ''));
    expect(rms).toBeGreaterThan(0.4);
    expect(rms).toBeLessThan(0.65);
    expect(chi2).toBeGreaterThan(0.6);
    expect(chi2).toBeLessThan(1.6);
    expect(await page.getByTestId('run-verdict').textContent()).toMatch(/uncertainty/);
    expect(await page.getByTestId('worst-shots').locator('li').count()).toBe(3);
    expect(await page.getByTestId('worst-receivers').locator('li').count()).toBe(5);
    await shot(page, 'run-summary');
    await page.close();
  });

  it('section view: wavefronts and rays per shot, interval and exaggeration controls, fields cached per shot', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/runs/${order2RunId}?view=section`);
    await page.getByTestId('section-canvas').waitFor();
    await page.getByTestId('section-caption').filter({ hasText: 'Shot S1 at' }).waitFor();
    expect(await page.getByTestId('section-caption').textContent()).toMatch(/wavefronts every \d+(\.\d+)? ms, labelled in ms; 48 rays/);
    // The demo line's holes against the top of the model's deepest layer: the two boreholes' top of
    // rock, and both contacts of the trial pit, which marks none (fixtures/demo/tq-l1.boreholes.csv).
    await page.getByTestId('borehole-ties').waitFor();
    await expect.poll(() => page.getByTestId('borehole-tie').count()).toBe(4);
    await expect(page.getByTestId('borehole-tie').filter({ hasText: 'BH2' }).textContent()).resolves.toMatch(/sandstone10\.4[\d.]+[+-]\d+\.\d/);
    await page.getByTestId('section-view').screenshot({ path: path.join(SCREENSHOT_DIR, 'run-section-S1.png') });

    const fieldRequests = () =>
      page.evaluate(() =>
        performance.getEntriesByType('resource').filter((e) => e.name.includes('/fields/')).map((e) => ({ name: e.name.split('/fields/')[1]!, ms: e.duration })),
      );
    const s1Requests = (await fieldRequests()).filter((f) => f.name === 'S1').length;
    for (let i = 0; i < 3; i++) await page.getByTestId('section-next').click();
    await page.getByTestId('section-caption').filter({ hasText: 'Shot S4 at' }).waitFor();
    expect(new URL(page.url()).searchParams.get('shot')).toBe('S4');
    await page.getByTestId('contour-interval').selectOption('2');
    // Pointing at the ground reads out velocity and first-arrival time there. The canvas may lie
    // below the fold (a pointer outside the viewport reaches nothing: that made this check come and
    // go), so it is scrolled into view first; React renders a pointer move's read-out a moment
    // later, so each spot waits for it; spots down the middle are tried until one is in the ground.
    const readout = page.getByTestId('section-readout');
    let seen = '';
    await page.getByTestId('section-canvas').scrollIntoViewIfNeeded();
    const box = (await page.getByTestId('section-canvas').boundingBox())!;
    for (const f of [0.5, 0.4, 0.6, 0.3, 0.7]) {
      await page.mouse.move(box.x - 5, box.y - 5);
      await expect.poll(() => readout.textContent()).toMatch(/^Point at the section/);
      await page.mouse.move(box.x + box.width * 0.5, box.y + box.height * f, { steps: 2 });
      await expect.poll(() => readout.textContent()).not.toMatch(/^Point at the section/);
      seen = (await readout.textContent()) ?? '';
      if (/first arrival/.test(seen)) break;
    }
    expect(seen).toMatch(/v \d+ m\/s · first arrival \d+\.\d ms/);
    await page.getByTestId('vertical-exaggeration').selectOption('1');
    await page.getByTestId('section-caption').filter({ hasText: 'every 2 ms' }).waitFor();
    await page.getByTestId('section-view').screenshot({ path: path.join(SCREENSHOT_DIR, 'run-section-S4-true-scale.png') });

    // Back to S1: its field comes from the cache, not a second request.
    await page.getByTestId('section-shot').selectOption('S1');
    await page.getByTestId('section-caption').filter({ hasText: 'Shot S1 at' }).waitFor();
    const fields = await fieldRequests();
    expect(fields.filter((f) => f.name === 'S1')).toHaveLength(s1Requests);
    console.log(`field fetches in the browser: ${fields.length}, median ${median(fields.map((f) => f.ms)).toFixed(0)} ms (machine shared with other work)`);
    await page.close();
  });

  it('travel-time curves, misfit map (keyboard), pick details and the ray of that pick', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/runs/${order2RunId}`);
    await page.getByTestId('run-tab-curves').click();
    await page.locator('.main-svg').first().waitFor({ timeout: 60_000 });
    // One legend entry per shot; each toggles its picks, computed line and residuals together.
    await expect.poll(() => page.locator('.legend .traces').count()).toBe(7);
    await shot(page, 'run-curves');

    await page.getByTestId('run-tab-misfit').click();
    const grid = page.getByTestId('misfit-grid');
    await grid.waitFor();
    expect(await grid.locator('button').count()).toBe(7 * 48);
    await grid.locator('button[tabindex="0"]').focus();
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('Enter');
    const details = page.getByTestId('pick-details');
    await details.waitFor();
    expect(await details.textContent()).toMatch(/Shot S2, receiver at x = 5 m/);
    expect(await page.getByTestId('pick-residual').textContent()).toMatch(/[+−]?\d+\.\d\d ms \([+−]?\d+\.\d σ\)/);
    await shot(page, 'run-misfit-pick');

    await details.getByRole('button', { name: 'Show its ray in the section' }).click();
    await page.getByTestId('section-caption').filter({ hasText: 'Shot S2 at' }).waitFor();
    expect(new URL(page.url()).searchParams.get('pick')).not.toBeNull();
    await page.getByTestId('section-view').screenshot({ path: path.join(SCREENSHOT_DIR, 'run-section-chosen-ray.png') });
    await page.close();
  });

  it('residual table: filters by shot, receiver range and k·σ, sorts, and exports what it shows as CSV', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/runs/${order2RunId}?view=table`);
    const count = page.getByTestId('residual-count');
    await count.waitFor();
    expect(await count.textContent()).toMatch(/All 336 picks/);

    await page.getByTestId('filter-shot').selectOption('S3');
    expect(await count.textContent()).toMatch(/^48 of 336 picks/);
    await page.getByTestId('filter-xmin').fill('20');
    await page.getByTestId('filter-xmax').fill('40');
    expect(await count.textContent()).toMatch(/^9 of 336 picks/); // stations every 2.5 m: 20, 22.5, …, 40
    await page.getByTestId('filter-xmin').fill('abc');
    expect(await page.getByText('Type a number, or leave it empty.').count()).toBe(1);
    await page.getByTestId('filter-xmin').fill('');
    await page.getByTestId('filter-xmax').fill('');
    await page.getByTestId('filter-shot').selectOption('');
    await page.getByTestId('filter-k').fill('1');
    const shown = Number((await count.textContent())!.match(/^(\d+) of/)![1]);
    // With σ honest, about a third of the picks lie beyond 1σ (normal distribution: 31.7 %; any table of the normal integral).
    expect(shown).toBeGreaterThan(336 * 0.15);
    expect(shown).toBeLessThan(336 * 0.5);

    await page.getByRole('button', { name: /^Residual \(ms\)/ }).click();
    await page.getByRole('button', { name: /^Residual \(ms\)/ }).click(); // descending
    const firstResidual = await page.getByTestId('residual-table').locator('tbody tr').first().locator('td').nth(4).textContent();
    expect(firstResidual!.startsWith('+')).toBe(true);

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-csv').click()]);
    expect(download.suggestedFilename()).toMatch(/^tq-l1-residuals-run-[0-9a-f]{8}\.csv$/);
    const csv = readFileSync((await download.path())!, 'utf8');
    const lines = csv.trimEnd().split('\r\n');
    expect(lines[0]).toBe('shot_id,receiver_x,receiver_z,observed_ms,computed_ms,residual_ms,sigma_ms,normalised,excluded,flags');
    expect(lines).toHaveLength(shown + 1);
    for (const line of lines.slice(1)) {
      const [, , , observed, computed, residual, sigma] = line.split(',').map(Number);
      expect(Math.abs(residual!)).toBeGreaterThan(sigma!); // the k = 1 filter holds in the file too
      expect(observed! - computed!).toBeCloseTo(residual!, 3);
    }
    await shot(page, 'run-table-filtered');
    await page.close();
  });

  it('comparison: a first-order run against the second-order one, side by side and as a difference map', async () => {
    const page = await geo.newPage();
    order1RunId = await startRun(page, 1);
    await waitDone(page);
    await page.getByTestId('compare-with').selectOption(order2RunId);
    await page.getByTestId('compare-link').click();
    await page.getByTestId('compare-stats').waitFor();
    expect(page.url()).toContain(`/runs/${order1RunId}/compare/${order2RunId}`);
    expect(await page.getByTestId('compare-order-note').textContent()).toMatch(/different solver orders/);
    // Same picks on both sides: the page names the better run (or a tie) by RMS.
    const sentence = (await page.getByTestId('compare-sentence').textContent())!;
    expect(sentence).toMatch(/^(Run [AB] fits the picks better: its RMS misfit is \d+\.\d\d ms lower|Both runs fit the picks equally well)/);
    console.log(`order 1 (A) against order 2 (B): ${sentence}`);
    const diff = page.getByTestId('difference-grid');
    await diff.waitFor();
    await diff.locator('button').nth(30).click();
    await page.getByTestId('difference-details').waitFor();
    await shot(page, 'run-compare');

    // The line's list offers the same comparison from two ticks.
    await page.goto(`${server.baseUrl}/lines/${lineId}/runs`);
    await expect.poll(() => page.getByTestId('line-run-row').count()).toBe(2);
    for (const box of await page.getByTestId('line-runs').getByRole('checkbox').all()) await box.check();
    await page.getByTestId('compare-selected').click();
    await page.getByTestId('compare-stats').waitFor();

    // Bad input: a run against itself.
    await page.goto(`${server.baseUrl}/runs/${order2RunId}/compare/${order2RunId}`);
    expect(await page.getByTestId('compare-refused').textContent()).toMatch(/same run twice/);
    await page.close();
  });

  it('refusals in plain words: a model that does not cover the spread, and cancelling a run that has stopped', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/lines/${lineId}/runs`);
    // A copy of the demo model cut off at x ≈ 40 m: most geophones lie outside it.
    const demo = JSON.parse(readFileSync(path.resolve('fixtures/demo/tq-l1.model.json'), 'utf8'));
    const short = { ...demo, grid: { ...demo.grid, nx: 200 } };
    const saved = await api(page, 'POST', `/api/lines/${lineId}/models?name=short`, short);
    expect(saved.status).toBe(201);
    await page.goto(`${server.baseUrl}/lines/${lineId}/runs`);
    const model = page.getByLabel('Model version');
    await model.selectOption((await model.locator('option', { hasText: /^short/ }).getAttribute('value'))!);
    await page.getByTestId('start-run').click();
    const problem = page.getByTestId('run-start-problem');
    await problem.waitFor();
    expect(await problem.textContent()).toMatch(/does not cover every shot and geophone/);
    expect(await problem.locator('li').first().textContent()).toMatch(/^Pick file line \d+/);
    expect(new URL(page.url()).pathname).toBe(`/lines/${lineId}/runs`); // still on the form, nothing queued
    await shot(page, 'run-refused-outside-model');

    // Cancel while queued: stop the worker so the run waits, then cancel it from its page.
    await worker.stop();
    await startRun(page, 2);
    await page.getByTestId('run-progress').waitFor();
    expect(await page.getByTestId('run-progress').textContent()).toMatch(/Waiting for a solver/);
    // Two clicks: the first says what is lost, the second cancels.
    await page.getByTestId('cancel-run').click();
    expect(await page.getByTestId('cancel-run-warning').textContent()).toMatch(/not kept/);
    await page.getByTestId('cancel-run-confirm').click();
    await page.getByTestId('run-outcome').waitFor();
    expect(await page.getByTestId('run-outcome').textContent()).toMatch(/This run was cancelled/);
    expect(await page.getByTestId('run-status').getAttribute('data-status')).toBe('cancelled');
    await shot(page, 'run-cancelled');

    // Cancelling a finished run is refused with the reason.
    const again = await api(page, 'POST', `/api/runs/${order2RunId}/cancel`);
    expect(again.status).toBe(409);
    expect(String(again.body.message)).toMatch(/already done/);
    worker = startWorker('e2e-run-worker-2');
    await page.close();
  });

  it('field technician reads runs but cannot start or cancel them; a client has no access', async () => {
    const tech = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(tech, server.baseUrl, 'tech@timefield.test');
    await tech.goto(`${server.baseUrl}/lines/${lineId}/runs`);
    await tech.getByTestId('line-runs').waitFor();
    expect(await tech.getByTestId('start-run-form').count()).toBe(0);
    await tech.goto(`${server.baseUrl}/runs/${order2RunId}`);
    await tech.getByTestId('run-summary').waitFor();
    expect(await tech.getByTestId('cancel-run').count()).toBe(0);
    await tech.close();

    const client = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(client, server.baseUrl, 'client@timefield.test');
    await client.goto(`${server.baseUrl}/runs/${order2RunId}`);
    await client.getByTestId('load-error').waitFor();
    expect(await client.getByTestId('load-error').textContent()).toMatch(/do not have access/);
    await client.close();
  });
});
