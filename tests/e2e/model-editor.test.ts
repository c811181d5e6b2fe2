/**
 * The velocity model editor in the browser, end to end on the seeded demo: a geophysicist builds a
 * three-layer model for line TQ-L1 with the mouse and the keyboard, paints a low-velocity pocket,
 * undoes and redoes with Ctrl+Z / Ctrl+Shift+Z, saves it as a new version, reloads it, and shows
 * the live preview for two shots. Bad input is refused with path-named messages. A project lead
 * reads the saved version without tools. Screenshots land in tests/e2e/screenshots/ for a person
 * to look at.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoLine, demoProject } from '../../fixtures/demo/scenario';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';
import { signIn } from './support/page';


/** The line's address, found the way a person would: through the project page. */
async function lineUrl(page: Page): Promise<string> {
  await page.getByRole('link', { name: demoProject.name }).click();
  const href = await page.getByRole('link', { name: demoLine.name }).getAttribute('href');
  expect(href).toMatch(/^\/lines\/[0-9a-f-]+$/);
  return href!;
}

/** Viewport pixel of a model point (x along the line, z elevation), from the layout the canvas publishes. */
async function toPx(canvas: Locator, x: number, z: number) {
  await canvas.scrollIntoViewIfNeeded();
  const L = JSON.parse((await canvas.getAttribute('data-layout'))!);
  const box = (await canvas.boundingBox())!;
  return { px: box.x + L.left + ((x - L.xMin) / (L.xMax - L.xMin)) * L.width, py: box.y + L.top + ((L.zMax - z) / (L.zMax - L.zMin)) * L.height };
}

async function drag(page: Page, from: { px: number; py: number }, to: { px: number; py: number }) {
  await page.mouse.move(from.px, from.py);
  await page.mouse.down();
  await page.mouse.move((from.px + to.px) / 2, (from.py + to.py) / 2, { steps: 4 });
  await page.mouse.move(to.px, to.py, { steps: 4 });
  await page.mouse.up();
}

const paintedCells = async (page: Page) => Number(/(\d+) painted/.exec((await page.getByTestId('edit-count').textContent())!)![1]);
const previewDone = (page: Page) =>
  page.waitForFunction(() => document.querySelector('[data-testid=preview-status]')?.getAttribute('data-status') === 'done', null, { timeout: 90_000 });

async function setNumber(page: Page, label: string, value: string) {
  const input = page.getByLabel(label, { exact: true });
  await input.fill(value);
  await input.press('Enter'); // keyboard commit
}

describe('velocity model editor in the browser', () => {
  let server: E2eServer;
  let browser: Browser;
  let savedUrl = '';
  beforeAll(async () => {
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    server = await startDemoServer();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });
  const shot = (page: Page, name: string, target?: Locator) =>
    (target ?? page).screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), ...(target ? {} : { fullPage: true }) });

  it('geophysicist: builds three layers with a painted pocket, undoes and redoes, saves, reloads, previews two shots', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signIn(page, server.baseUrl, 'geo@timefield.test');
    const line = await lineUrl(page);
    await page.goto(`${server.baseUrl}${line}/models/new`);
    const canvas = page.getByTestId('section-canvas');
    await canvas.waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('editor-subtitle').textContent()).toMatch(/48 stations/);

    // Three layers, named and given velocities by keyboard.
    await page.getByRole('button', { name: 'Add a layer below layer 2' }).click();
    await expect.poll(() => page.locator('[data-testid^=layer-row-]').count()).toBe(3);
    const layers = [
      { name: 'topsoil', top: '350', base: '650' },
      { name: 'weathered sandstone', top: '1300', base: '1900' },
      { name: 'sound sandstone', top: '3300', base: '3900' },
    ];
    for (const [k, l] of layers.entries()) {
      await setNumber(page, `Layer ${k + 1} name`, l.name);
      await setNumber(page, `Layer ${k + 1} velocity at top (m/s)`, l.top);
      await setNumber(page, `Layer ${k + 1} velocity at base (m/s)`, l.base);
    }

    // Drag the third node of the topsoil base down with the mouse, then two cells further with the arrow keys.
    await page.locator('[data-testid=layer-row-0] button[aria-pressed]').click();
    const x0 = Number(await page.getByLabel('Node 3 x (m)').inputValue());
    const z0 = Number(await page.getByLabel('Node 3 z (m)').inputValue());
    await drag(page, await toPx(canvas, x0, z0), await toPx(canvas, x0 + 4, z0 - 1.5));
    const zDragged = Number(await page.getByLabel('Node 3 z (m)').inputValue());
    expect(zDragged).toBeLessThan(z0 - 1);
    expect(Number(await page.getByLabel('Node 3 x (m)').inputValue())).toBeGreaterThan(x0 + 3);
    await canvas.focus();
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('ArrowDown');
    expect(Number(await page.getByLabel('Node 3 z (m)').inputValue())).toBeLessThan(zDragged);

    // A low-velocity pocket with the rectangle tool, a boulder with the brush.
    await page.getByTestId('tool-rect').click();
    await setNumber(page, 'Paint velocity (m/s)', '250');
    await drag(page, await toPx(canvas, 50, 94), await toPx(canvas, 60, 91));
    const pocket = await paintedCells(page);
    expect(pocket).toBeGreaterThan(10);
    await page.getByTestId('tool-brush').click();
    await page.getByLabel('Typical velocity for a painted feature').selectOption({ label: 'Boulder or core stone (4000 m/s)' });
    await drag(page, await toPx(canvas, 80, 87), await toPx(canvas, 84, 87));
    const withBoulder = await paintedCells(page);
    expect(withBoulder).toBeGreaterThan(pocket);

    // Undo and redo from the keyboard: the brush stroke is one step.
    await canvas.focus();
    await page.keyboard.press('Control+z');
    expect(await paintedCells(page)).toBe(pocket);
    await page.keyboard.press('Control+Shift+z');
    expect(await paintedCells(page)).toBe(withBoulder);
    await page.keyboard.press('Control+z'); // keep the pocket only
    expect(await paintedCells(page)).toBe(pocket);

    // The preview for shot S1, picked on the section itself.
    await page.getByTestId('tool-shape').click();
    const shotS1 = await toPx(canvas, -10, 100); // S1 sits at x −10 m on the ground (the first station's elevation, held)
    await page.mouse.click(shotS1.px, shotS1.py - 1);
    expect(await page.getByTestId('preview-shot').inputValue()).toBe('S1');
    await previewDone(page);
    expect(await page.getByTestId('preview-status').textContent()).toMatch(/contours every .* ms · solved in \d+ ms · RMS misfit to 48 picks/);
    expect(await page.getByTestId('preview-panel').textContent()).toMatch(/Forward model only/);
    expect(await page.getByTestId('checks').textContent()).toMatch(/No problems|second look/);
    await shot(page, 'model-editor-built');

    // Save with a comment; the version list shows it with who saved it.
    await page.getByTestId('save-comment').fill('Three layers with a low-velocity pocket under station 121');
    await page.getByTestId('save-model').click();
    await expect.poll(() => page.getByTestId('save-result').textContent(), { timeout: 30_000 }).toMatch(/Saved as “main” version 2/);
    await expect.poll(() => page.getByTestId('version-list').textContent()).toMatch(/Three layers with a low-velocity pocket/);
    expect(await page.getByTestId('version-main-2').textContent()).toMatch(/Ruth Lindqvist/);
    expect(new URL(page.url()).searchParams.get('from')).toBeTruthy();

    // Reload: the saved version comes back as the starting point, layers and paint intact.
    await page.reload();
    await canvas.waitFor({ timeout: 60_000 });
    await expect.poll(() => page.locator('[data-testid^=layer-row-]').count()).toBe(3);
    expect(await page.getByLabel('Layer 2 name', { exact: true }).inputValue()).toBe('weathered sandstone');
    expect(await page.getByLabel('Layer 3 velocity at base (m/s)').inputValue()).toBe('3900');
    expect(await paintedCells(page)).toBe(pocket);
    expect(await page.getByTestId('editor-subtitle').textContent()).toMatch(/Started from “main” version 2/);

    // Two shots in the preview, the second with rays.
    await page.getByTestId('preview-shot').selectOption('S1');
    await previewDone(page);
    await shot(page, 'model-editor-preview-S1', page.getByTestId('section-canvas'));
    await page.getByTestId('preview-shot').selectOption('S5');
    await page.getByTestId('preview-rays').check();
    await previewDone(page);
    expect(await page.getByTestId('preview-status').textContent()).toMatch(/RMS misfit to 48 picks/);
    await shot(page, 'model-editor-preview-S5-rays', page.getByTestId('section-canvas'));
    await shot(page, 'model-editor-reloaded');
    savedUrl = `/models/${new URL(page.url()).searchParams.get('from')}`;
    expect(errors).toEqual([]);
    await page.close();
  }, 300_000);

  it('geophysicist: a negative velocity, an interface above the grid and a huge grid are refused with clear messages', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signIn(page, server.baseUrl, 'geo@timefield.test');
    const line = await lineUrl(page);
    await page.goto(`${server.baseUrl}${line}/models/new`);
    await page.getByTestId('section-canvas').waitFor({ timeout: 60_000 });

    await setNumber(page, 'Layer 2 velocity at top (m/s)', '-300');
    await expect.poll(() => page.getByTestId('check-errors').textContent()).toMatch(/Layer 2 “[^”]+”, velocity at top: must be > 0/); // named as the page labels it, no JSON path (issue 17 item 10)
    expect(await page.getByTestId('save-model').isDisabled()).toBe(true);
    await page.getByTestId('undo').click();

    await page.locator('[data-testid=layer-row-0] button[aria-pressed]').click();
    await setNumber(page, 'Node 2 z (m)', '500');
    await expect.poll(() => page.getByTestId('check-errors').textContent()).toMatch(/Layer 1 “[^”]+”, base node 2: z = 500 m .* is above the grid top/);
    await shot(page, 'model-editor-bad-input');
    await page.getByTestId('undo').click();
    await page.getByTestId('checks-ok').waitFor();

    await page.locator('[data-testid=grid-form] input[name=spacing]').fill('0.01');
    await page.getByRole('button', { name: 'Apply grid' }).click();
    expect(await page.getByTestId('grid-message').textContent()).toMatch(/Refused: the grid has [\d,]+ nodes \(nx × nz = \d+ × \d+\); the limit is 2,000,000/);
    await page.close();
  }, 180_000);

  it('project lead: reads the saved version without tools and can still preview; a client cannot open it', async () => {
    expect(savedUrl).toMatch(/^\/models\//);
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signIn(page, server.baseUrl, 'lead@timefield.test');
    await page.goto(`${server.baseUrl}${savedUrl}`);
    await page.getByTestId('section-canvas').waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('version-facts').textContent()).toMatch(/Saved by Ruth Lindqvist .* read-only/);
    expect(await page.getByTestId('tool-brush').count()).toBe(0);
    expect(await page.getByTestId('save-model').count()).toBe(0);
    expect(await page.getByLabel('Layer 1 velocity at top (m/s)').isDisabled()).toBe(true);
    await page.getByTestId('preview-shot').selectOption('S7');
    await previewDone(page);
    await shot(page, 'model-editor-version-lead');
    await page.close();

    const client = await browser.newPage();
    await signIn(client, server.baseUrl, 'client@timefield.test');
    await client.goto(`${server.baseUrl}${savedUrl}`);
    await client.getByTestId('load-error').waitFor({ timeout: 30_000 });
    expect(await client.getByTestId('section-canvas').count()).toBe(0);
    await client.close();
  }, 180_000);
});
