/**
 * Inversion pages in the browser (issue 11, item 5), against the real app for everything but the
 * inversion routes themselves: those are answered by a stub in the browser context
 * (support/inversion-stub.ts) that follows the view types and checks the start body with the server's
 * own schema, until the server side of issue 11 is merged. A geophysicist fills the start form (bad
 * input refused on the field, a server refusal shown on its field), watches an inversion converge,
 * moves the coverage threshold, looks at the checkerboard and residuals, saves the model and compares;
 * a field technician and a lead only read. Screenshots at 1440×900 and 390×844 land in
 * tests/e2e/screenshots/ (ignored by git) for a person to look at.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoLine, demoProject } from '../../fixtures/demo/scenario';
import { api, signIn } from './support/page';
import { stubInversions, type InversionStub } from './support/inversion-stub';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';

describe('inversion pages: start form, progress, section checks, save, compare, roles', () => {
  let server: E2eServer;
  let browser: Browser;
  let geo: BrowserContext;
  let stub: InversionStub;
  let lineId = '';
  let modelId = '';
  let pickSetId = '';
  let inversionId = '';

  const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });

  /** A signed-in context with the inversion routes stubbed, at the given window size. */
  async function contextFor(email: string, viewport = { width: 1440, height: 900 }): Promise<{ context: BrowserContext; stub: InversionStub }> {
    const context = await browser.newContext({ viewport });
    const page = await context.newPage();
    await signIn(page, server.baseUrl, email);
    if (!lineId) {
      await page.getByRole('link', { name: demoProject.name }).click();
      await page.getByRole('link', { name: demoLine.name }).click();
      await page.waitForURL(/\/lines\/[0-9a-f-]{36}/);
      lineId = new URL(page.url()).pathname.split('/')[2]!;
      const line = await api(page, 'GET', `/api/lines/${lineId}`);
      modelId = (line.body.models as { id: string }[])[0]!.id;
      pickSetId = (line.body.pickSets as { id: string }[])[0]!.id;
    }
    await page.close();
    return { context, stub: await stubInversions(context, lineId, modelId) };
  }

  beforeAll(async () => {
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    server = await startDemoServer();
    browser = await launchBrowser();
    ({ context: geo, stub } = await contextFor('geo@timefield.test'));
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('start form: default grid shown, bad input refused on its field before sending, a server refusal shown on its field', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/lines/${lineId}?tab=inversions`);
    await page.getByTestId('start-inversion-form').waitFor();
    await page.getByTestId('line-inversions-empty').waitFor();
    // Demo geophones are 2.5 m apart (fixtures/demo/tq-l1.stations.csv): half is 1.25 m, down to the round 1 m.
    await expect.poll(() => page.getByTestId('inversion-grid-size').textContent()).toMatch(/Default 1 m, from half the median station spacing\. Grid \d+ × \d+ nodes/);
    await page.getByTestId('inversion-spacing').fill('0.5');
    await expect.poll(() => page.getByTestId('inversion-grid-size').textContent()).toMatch(/^Grid \d+ × \d+ nodes/);
    await page.getByTestId('inversion-spacing').fill('');
    await shot(page, 'inversion-start-form');

    // Reversed bounds: refused on the upper bound, the advanced settings open by themselves, nothing sent.
    const advanced = page.getByTestId('inversion-advanced');
    await advanced.locator('summary').click();
    await page.getByTestId('inversion-vmin').fill('3000');
    await page.getByTestId('inversion-vmax').fill('2000');
    await advanced.locator('summary').click(); // fold it away again
    await page.getByTestId('start-inversion').click();
    await page.getByText('must be greater than vMin (3000 m/s); the bounds are reversed or equal').waitFor();
    expect(await advanced.getAttribute('open')).not.toBeNull();
    expect(await page.getByTestId('inversion-vmax').getAttribute('aria-invalid')).toBe('true');
    expect(stub.posts).toHaveLength(0);
    await page.getByTestId('inversion-iterations').fill('ten');
    await page.getByText('"ten" is not a number').waitFor();
    await shot(page, 'inversion-start-refused');
    await page.getByTestId('inversion-iterations').fill('15');
    await page.getByTestId('inversion-vmin').fill('100');
    await page.getByTestId('inversion-vmax').fill('5000');

    // A refusal only the server can make lands on the field it names (settings.damping).
    await page.getByTestId('inversion-damping').fill('80');
    await page.getByTestId('start-inversion').click();
    await page.getByText('damping this strong would keep the starting model unchanged').waitFor();
    expect(await page.getByTestId('inversion-damping').getAttribute('aria-invalid')).toBe('true');
    expect(await page.getByTestId('start-inversion-problem').textContent()).toMatch(/cannot be used with this pick set/);
    expect(stub.posts).toHaveLength(1);

    // Corrected: started with a label and the checkerboard test, then on to the inversion's own page.
    await page.getByTestId('inversion-damping').fill('0.05');
    await page.getByTestId('inversion-label').fill('First look');
    await page.getByTestId('inversion-checkerboard').check();
    await page.getByTestId('start-inversion').click();
    await page.waitForURL(/\/lines\/[^/]+\/inversions\/[^/]+$/);
    inversionId = new URL(page.url()).pathname.split('/').at(-1)!;
    const body = stub.posts.at(-1)!;
    expect(body).toMatchObject({ pickSetId, start: { kind: 'gradient' }, label: 'First look' });
    expect(body.settings).toMatchObject({ vMin: 100, vMax: 5000, damping: 0.05, maxIterations: 15, checkerboard: true, checkerSize: null, smoothing: null });
    await page.close();
  });

  it('inversion page: live progress and convergence, then the fit, the stop reason and the limits of tomography', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${inversionId}`);
    await page.getByTestId('tomography-caution').waitFor();
    expect(await page.getByTestId('tomography-caution').textContent()).toMatch(/Sharp contacts.*Resolution falls with depth.*can be missed.*non-unique.*boreholes.*qualified professional.*local codes/s);
    // The stub moves on one iteration per poll: the chart grows while it runs.
    await page.locator('[data-testid="inversion-status"][data-status="running"]').waitFor();
    await page.locator('[data-testid="convergence-chart"][data-points="3"]').waitFor({ timeout: 30_000 });
    await page.getByTestId('convergence-chart').scrollIntoViewIfNeeded(); // charts load when they come near the screen
    await page.locator('#root .main-svg, .main-svg').first().waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('inversion-progress').textContent()).toMatch(/Iteration \d of at most 15 done/);
    await shot(page, 'inversion-running');
    await page.locator('[data-testid="inversion-status"][data-status="done"]').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('inversion-chi2').textContent()).toBe('1.04');
    expect(await page.getByTestId('inversion-rms').textContent()).toBe('0.51 ms');
    expect(await page.getByTestId('inversion-stop-reason').textContent()).toMatch(/reached the target fit .* after 5 iterations/);
    expect(await page.getByTestId('convergence-words').first().textContent()).toMatch(/38\.20 to 1\.04.*within the target band/);
    expect(await page.getByTestId('inversion-settings').textContent()).toMatch(/Velocity bounds100 – 5000 m\/s/);
    expect(await page.getByTestId('caution-footer').textContent()).toMatch(/non-unique/);
    await page.getByTestId('inversion-section-canvas').waitFor();
    await shot(page, 'inversion-done');
    await page.close();
  });

  it('section: coverage mask follows the threshold slider, contours switch, read-out names the ray coverage', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${inversionId}`);
    const caption = page.getByTestId('inversion-section-caption');
    await caption.waitFor();
    await page.getByTestId('inversion-section-canvas').waitFor();
    const masked = async () => Number(await caption.getAttribute('data-masked'));
    const atDefault = await masked();
    expect(atDefault).toBeGreaterThan(0); // the canned section has no rays below its DOI line
    expect(await caption.textContent()).toMatch(/fewer than 1\.0 m of ray/);
    await page.getByTestId('inversion-section').screenshot({ path: path.join(SCREENSHOT_DIR, 'inversion-section-1m.png') });
    // A higher threshold greys more ground, 0 m greys only ground no ray crossed.
    await page.getByTestId('coverage-threshold').fill('4');
    await expect.poll(masked).toBeGreaterThan(atDefault);
    expect(await page.getByTestId('coverage-threshold-value').textContent()).toBe('4.0');
    await page.getByTestId('coverage-threshold').fill('0');
    await expect.poll(masked).toBe(0);
    await page.getByTestId('coverage-threshold').fill('1');
    await page.getByTestId('inversion-exaggeration').selectOption('1');
    await page.getByTestId('show-contours').uncheck();
    await page.getByTestId('show-contours').check();
    const box = (await page.getByTestId('inversion-section-canvas').boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.5, box.y + box.height * 0.35);
    expect(await page.getByTestId('inversion-section-canvas-readout').textContent()).toMatch(/v \d+ m\/s · \d+\.\d m of ray|air/);
    await page.getByTestId('inversion-section').screenshot({ path: path.join(SCREENSHOT_DIR, 'inversion-section-true-scale.png') });
    await page.close();
  });

  it('checkerboard, misfit map and residual table', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${inversionId}?view=checkerboard`);
    await page.getByTestId('checkerboard').waitFor();
    expect(await page.getByTestId('checkerboard-correlation').textContent()).toBe('0.71');
    expect(await page.getByTestId('checkerboard').textContent()).toMatch(/Squares of 10 m, ±7%.*partly recovered/s);
    await page.getByTestId('checkerboard-recovered').scrollIntoViewIfNeeded(); // charts load when they come near the screen
    await page.getByTestId('checkerboard-recovered').locator('.main-svg').first().waitFor({ timeout: 60_000 });
    await page.getByTestId('checkerboard').screenshot({ path: path.join(SCREENSHOT_DIR, 'inversion-checkerboard.png') });

    await page.getByTestId('run-tab-misfit').click();
    const grid = page.getByTestId('misfit-grid');
    await grid.waitFor();
    expect(await grid.locator('button').count()).toBe(7 * 48); // the demo picks: 7 shots × 48 geophones
    await grid.locator('button').nth(50).click();
    const details = page.getByTestId('pick-details');
    await details.waitFor();
    // No rays are stored for an inversion, so the pick offers none.
    expect(await details.getByRole('button', { name: 'Show its ray in the section' }).count()).toBe(0);
    await details.getByRole('button', { name: 'Show the shot in the table' }).click();
    await page.getByTestId('residual-count').waitFor();
    expect(await page.getByTestId('residual-count').textContent()).toMatch(/^48 of 336 picks/);
    await page.close();
  });

  it('save as model version links to the new model; comparison with another inversion and with a forward run', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${inversionId}`);
    await page.getByTestId('save-inversion-model').click();
    await page.getByTestId('inversion-model-link').waitFor();
    expect(await page.getByTestId('inversion-model-link').getAttribute('href')).toBe(`/models/${modelId}`);

    const other = stub.addDone('Coarser grid', 450, 70);
    await page.reload();
    await page.getByTestId('inversion-compare-chooser').waitFor();
    await page.getByTestId('inversion-compare-with').selectOption(`inv:${other}`);
    await page.getByTestId('inversion-compare-link').click();
    await page.getByTestId('compare-canvas-A').waitFor();
    await page.getByTestId('compare-canvas-B').waitFor();
    // One colour scale over both: the project's by default (issue 17 item 6), or on request the lowest and
    // highest velocity of the ray-covered ground of either section.
    expect(await page.getByTestId('compare-range').textContent()).toContain('one colour scale, 200 to 5000 m/s');
    await page.getByTestId('section-colours-source').selectOption('section');
    let lo = Infinity;
    let hi = -Infinity;
    for (const id of [inversionId, other]) {
      const { velocity, coverage } = stub.inversions.get(id)!.section;
      velocity.forEach((v, i) => {
        if (v !== null && (coverage[i] ?? 0) > 0) [lo, hi] = [Math.min(lo, v), Math.max(hi, v)];
      });
    }
    expect(await page.getByTestId('compare-range').textContent()).toContain(`one colour scale, ${lo} to ${hi} m/s`);
    await page.getByTestId('difference-grid').waitFor();
    await shot(page, 'inversion-compare-inversions');

    // Beside a forward run (canned run record; its model grid is the real demo model's, from the real app).
    const runId = stub.addRun(modelId, pickSetId);
    await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${inversionId}/compare?with=run:${runId}`);
    await page.getByTestId('compare-canvas-B').waitFor();
    expect(await page.getByTestId('compare-range').textContent()).toMatch(/no coverage mask or depth of investigation/);
    expect(await page.getByTestId('compare-side-B').textContent()).toMatch(/χ² per datum 1\.50 · RMS 0\.62 ms/);
    // The two grids differ (inversion 1.25 m cells from x −12.5 m, demo model 0.3 m from −20 m), yet the
    // sections cover the same stretch: the same point of either drawing reads the same x.
    const xAt = async (letter: 'A' | 'B') => {
      const box = (await page.getByTestId(`compare-canvas-${letter}`).boundingBox())!;
      await page.mouse.move(box.x + box.width * 0.3, box.y + box.height * 0.5);
      const text = (await page.getByTestId(`compare-canvas-${letter}-readout`).textContent()) ?? '';
      return Number(/x (-?\d+\.\d) m/.exec(text)?.[1]);
    };
    const [xA, xB] = [await xAt('A'), await xAt('B')];
    expect(Math.abs(xA - xB)).toBeLessThan(1.5);
    await page.getByTestId('difference-grid').waitFor();
    await shot(page, 'inversion-compare-run');

    // The same inversion twice is refused in words.
    await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${inversionId}/compare?with=inv:${inversionId}`);
    expect(await page.getByTestId('compare-refused').textContent()).toMatch(/same inversion twice/);
    await page.close();
  });

  it('cancel: a running inversion stops on request and says so', async () => {
    const page = await geo.newPage();
    await page.goto(`${server.baseUrl}/lines/${lineId}?tab=inversions`);
    await page.getByTestId('inversion-label').fill('hold for cancel');
    await page.getByTestId('start-inversion').click();
    await page.waitForURL(/\/inversions\/[^/]+$/);
    await page.locator('[data-testid="inversion-status"][data-status="running"]').waitFor();
    await page.getByTestId('cancel-inversion').click(); // the first click only says what happens
    expect(await page.getByTestId('cancel-inversion-warning').textContent()).toMatch(/cannot be resumed/);
    await page.getByTestId('cancel-inversion-confirm').click();
    await page.locator('[data-testid="inversion-status"][data-status="cancelled"]').waitFor();
    expect(await page.getByTestId('inversion-outcome').textContent()).toMatch(/was cancelled.*Start a new one/s);
    await page.close();
  });

  it('narrow screen (390 × 844): line tab, inversion page and section stay usable', async () => {
    const { context, stub: narrow } = await contextFor('geo@timefield.test', { width: 390, height: 844 });
    const id = narrow.addDone('Phone check', 380, 95);
    const page = await context.newPage();
    await page.goto(`${server.baseUrl}/lines/${lineId}?tab=inversions`);
    await page.getByTestId('line-inversions').waitFor();
    // Six tabs do not fit a phone's width: the row scrolls so that the open tab is in sight.
    const row = (await page.getByRole('tablist', { name: 'Line data' }).boundingBox())!;
    const tab = (await page.getByTestId('tab-inversions').boundingBox())!;
    expect(tab.x).toBeGreaterThanOrEqual(row.x - 1);
    expect(tab.x + tab.width).toBeLessThanOrEqual(row.x + row.width + 1);
    await shot(page, 'inversion-line-tab-390');
    await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${id}`);
    await page.getByTestId('inversion-section-canvas').waitFor();
    // The page itself does not scroll sideways; wide parts scroll inside their own frames.
    expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1)).toBe(true);
    await shot(page, 'inversion-page-390');
    // Parts at phone width, for a person to look at closely.
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'inversion-page-390-top.png') });
    await page.getByTestId('convergence-chart').screenshot({ path: path.join(SCREENSHOT_DIR, 'inversion-convergence-390.png') });
    await page.getByTestId('inversion-section').screenshot({ path: path.join(SCREENSHOT_DIR, 'inversion-section-390.png') });
    await context.close();
  });

  it('field technician and lead read inversions but cannot start or save them; a lead may cancel, as for runs', async () => {
    for (const [email, mayCancel] of [['tech@timefield.test', false], ['lead@timefield.test', true]] as const) {
      const { context, stub: own } = await contextFor(email);
      const id = own.addDone('Read only', 380, 95);
      const running = own.addRunning('Still going');
      const page = await context.newPage();
      await page.goto(`${server.baseUrl}/lines/${lineId}?tab=inversions`);
      await page.getByTestId('line-inversions').waitFor();
      expect(await page.getByTestId('start-inversion-form').count()).toBe(0);
      await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${id}`);
      await page.getByTestId('inversion-section-canvas').waitFor();
      expect(await page.getByTestId('save-inversion-model').count()).toBe(0);
      expect(await page.getByText('A geophysicist can save this section').count()).toBe(1);
      // The button depends on the caller's role, which arrives with the line: wait for that answer.
      const lineRead = page.waitForResponse((r) => new URL(r.url()).pathname === `/api/lines/${lineId}`);
      await page.goto(`${server.baseUrl}/lines/${lineId}/inversions/${running}`);
      await page.getByTestId('inversion-progress').waitFor();
      await lineRead;
      if (mayCancel) await page.getByTestId('cancel-inversion').waitFor();
      else await page.waitForTimeout(300); // one render after the line arrived
      expect(await page.getByTestId('cancel-inversion').count()).toBe(mayCancel ? 1 : 0);
      await context.close();
    }
  });
});
