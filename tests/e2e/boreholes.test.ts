/**
 * Boreholes in the browser (issue 13 item 3), on the demo line: a geophysicist adds a hole by the
 * form (a bad entry is refused with the field named, nothing stored), sees it in the list with its
 * ground taken from the stations, and finds it tied to the model on the model page — difference =
 * interpreted − logged, as the ties helper computes (tests/unit/boreholes/ties.test.ts checks the
 * numbers by hand). A file with a mistake is refused with its line and column.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoLine, demoProject } from '../../fixtures/demo/scenario';
import { signIn } from './support/page';
import { launchBrowser, startDemoServer, type E2eServer } from './support/server';

describe('boreholes tab and ties on the sections', () => {
  let server: E2eServer;
  let browser: Browser;
  beforeAll(async () => {
    server = await startDemoServer();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('a geophysicist adds a hole by form, uploads a bad file, and sees the holes tied to the model', async () => {
    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
    await signIn(page, server.baseUrl, 'geo@timefield.test');
    await page.getByRole('link', { name: demoProject.name }).click();
    await page.getByRole('link', { name: demoLine.name }).click();
    await page.waitForURL(/\/lines\/[0-9a-f-]{36}/);
    const lineUrl = page.url().split('?')[0]!;
    await page.goto(`${lineUrl}?tab=boreholes`);
    // The demo line comes with two boreholes and a trial pit.
    await expect.poll(() => page.getByTestId('borehole-row').count()).toBe(3);

    await page.getByTestId('borehole-add').click();
    await page.getByTestId('borehole-name').fill('BH9');
    await page.getByTestId('borehole-x').fill('not a number');
    await page.getByRole('textbox', { name: 'Material of contact 1' }).fill('topsoil');
    await page.getByTestId('borehole-save').click();
    await page.getByText('x must be a finite number').first().waitFor();
    await page.getByTestId('borehole-x').fill('60');
    await page.getByTestId('borehole-add-contact').click();
    await page.getByRole('textbox', { name: 'Depth of contact 2 (m)' }).fill('8.5');
    await page.getByRole('textbox', { name: 'Material of contact 2' }).fill('sandstone');
    await page.getByRole('checkbox', { name: 'top of rock' }).nth(1).check();
    await page.getByTestId('borehole-save').click();
    await expect.poll(() => page.getByTestId('borehole-row').count()).toBe(4);
    await expect(page.getByTestId('borehole-row').filter({ hasText: 'BH9' }).textContent()).resolves.toMatch(/from stations/);

    await page.getByTestId('borehole-file-input').setInputFiles({ name: 'logs.csv', mimeType: 'text/csv', buffer: Buffer.from('hole,x,depth,material\nBH10,70,0,clay\nBH10,70,deep,rock\n') });
    await expect.poll(() => page.getByTestId('borehole-problems').textContent()).toMatch(/line 3, depth: "deep" is not a number/);
    await expect.poll(() => page.getByTestId('borehole-row').count()).toBe(4);

    // On the model page: each hole tied to the top of the deepest layer.
    await page.goto(`${lineUrl}?tab=models`);
    await page.getByRole('link', { name: /main/ }).first().click();
    await page.getByTestId('borehole-ties').waitFor();
    const bh9 = page.getByTestId('borehole-tie').filter({ hasText: 'BH9' });
    await expect(bh9.textContent()).resolves.toMatch(/sandstone8\.5[\d.]+[+-][\d.]+/);
  });
});
