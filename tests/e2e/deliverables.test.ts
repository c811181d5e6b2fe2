/**
 * Deliverables in the browser (issue 19): the lead sees the project's coordinate system and the
 * plan of the demo line (drawn from its eastings and northings, with north arrow and scale bar);
 * a geophysicist reads the depth-to-rock table on the demo model's page, downloads the DXF and the
 * GeoJSON, and writes the layer interpretation's DXF in the browser; nothing overflows at 390 px.
 * The files' contents are checked against independent readers in tests/api/exports.test.ts.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoLine, demoProject } from '../../fixtures/demo/scenario';
import { api, signIn } from './support/page';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';

describe('deliverables: coordinates, plan, depth to rock and exports', () => {
  let server: E2eServer;
  let browser: Browser;
  beforeAll(async () => {
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    server = await startDemoServer();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('the lead finds the coordinate system and the plan of the lines', async () => {
    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
    await signIn(page, server.baseUrl, 'lead@timefield.test');
    await page.getByRole('link', { name: demoProject.name }).click();
    await expect.poll(() => page.getByTestId('project-crs-current').textContent()).toMatch(/EPSG:32630 WGS 84 \/ UTM zone 30N/);
    await page.getByTestId('plan-link').click();
    await page.getByTestId('plan-drawing').waitFor();
    expect(await page.getByTestId('plan-line').count()).toBe(1);
    expect(await page.getByLabel('North arrow').count()).toBe(1);
    await expect(page.getByLabel(/^Scale bar \d+ m$/).count()).resolves.toBe(1);
    const [dxf] = await Promise.all([page.waitForEvent('download'), page.getByTestId('plan-dxf').click()]);
    expect(dxf.suggestedFilename()).toMatch(/-plan\.dxf$/);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'deliverables-plan.png') });
  });

  it('a geophysicist reads depth to rock on the model page and takes the files', async () => {
    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
    await signIn(page, server.baseUrl, 'geo@timefield.test');
    await page.getByRole('link', { name: demoProject.name }).click();
    await page.getByRole('link', { name: demoLine.name }).click();
    await page.waitForURL(/\/lines\/[0-9a-f-]{36}/);
    const lineId = new URL(page.url()).pathname.split('/')[2]!;
    const line = (await api(page, 'GET', `/api/lines/${lineId}`)).body as { models: { id: string }[]; stations: unknown[] };
    await page.goto(`${server.baseUrl}/models/${line.models[0].id}`);
    await page.getByTestId('depth-to-rock-table').waitFor();
    await expect.poll(() => page.getByTestId('depth-to-rock-row').count()).toBe(line.stations.length);
    // The demo line has coordinates: the GeoJSON is offered, and the table shows eastings.
    await page.getByTestId('export-depth-to-rock.geojson').waitFor();
    expect(await page.getByTestId('depth-to-rock-table').textContent()).toMatch(/Easting.*498200\.00/s);
    const [dxf] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-section.dxf').click()]);
    expect(dxf.suggestedFilename()).toMatch(/\.dxf$/);
    // An iso-velocity instead of the interface: the table follows.
    await page.getByTestId('export-rock').selectOption('iso');
    await page.getByTestId('export-iso').fill('1500');
    await expect.poll(() => page.getByTestId('section-exports').textContent()).toMatch(/the 1500 m\/s iso-velocity/);

    await page.goto(`${server.baseUrl}/lines/${lineId}?tab=layers`);
    await page.getByTestId('layers-exports').waitFor({ timeout: 30_000 });
    const [layersDxf] = await Promise.all([page.waitForEvent('download'), page.getByTestId('layers-export-dxf').click()]);
    expect(layersDxf.suggestedFilename()).toMatch(/layers.*\.dxf$/);

    const phone = await (await browser.newContext({ viewport: { width: 390, height: 844 } })).newPage();
    await signIn(phone, server.baseUrl, 'geo@timefield.test');
    for (const url of [`/models/${line.models[0].id}`, `/projects/${(await api(page, 'GET', `/api/lines/${lineId}`)).body.projectId}/plan`]) {
      await phone.goto(`${server.baseUrl}${url}`);
      await phone.waitForLoadState('networkidle');
      expect(await phone.evaluate(() => document.documentElement.scrollWidth), url).toBeLessThanOrEqual(390);
    }
  });
});
