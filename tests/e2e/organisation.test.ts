/**
 * The administrator's Organisation page (issue 16): reached from the admin navigation, it saves the
 * consultancy's name and address and takes a PNG logo, refusing a file that is not an image in words.
 * The demo seed fills in its invented consultancy. Screenshots land in tests/e2e/screenshots/ (ignored by git).
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoConsultancy } from '../../fixtures/demo/scenario';
import { encodeRgbPng } from '../../worker/report/png';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';
import { signIn } from './support/page';

describe('organisation page', () => {
  let server: E2eServer;
  let browser: Browser;

  beforeAll(async () => {
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    server = await startDemoServer();
    browser = await launchBrowser();
  }, 120_000);
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('admin: finds the page in the navigation, sees the seeded consultancy, saves changes and a logo, and is told when a file is not an image', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(page, server.baseUrl, 'admin@timefield.test');
    await page.getByRole('link', { name: 'Organisation' }).click();
    const name = page.getByLabel('Consultancy name');
    await name.waitFor();
    expect(await name.inputValue()).toBe(demoConsultancy);

    await name.fill('');
    await page.getByTestId('organisation-save').click();
    expect(await page.getByText('Enter the name printed on reports.').count()).toBe(1);
    await name.fill(`${demoConsultancy} — field office`);
    await page.getByTestId('organisation-save').click();
    await page.getByTestId('organisation-saved').waitFor();

    await page.getByTestId('logo-file').setInputFiles({ name: 'logo.png', mimeType: 'image/png', buffer: Buffer.from('this is not a picture') });
    await page.getByTestId('logo-upload').click();
    await page.getByText(/must be a PNG or JPEG/).first().waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'organisation-bad-logo.png'), fullPage: true });

    const png = encodeRgbPng(90, 30, new Uint8Array(90 * 30 * 3).fill(120));
    await page.getByTestId('logo-file').setInputFiles({ name: 'logo.png', mimeType: 'image/png', buffer: png });
    await page.getByTestId('logo-upload').click();
    await page.getByTestId('logo-preview').waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'organisation.png'), fullPage: true });
    await page.close();
  }, 60_000);

  it('is not offered to, nor shown for, a project lead', async () => {
    const page = await browser.newPage();
    await signIn(page, server.baseUrl, 'lead@timefield.test');
    expect(await page.getByRole('link', { name: 'Organisation' }).count()).toBe(0);
    await page.goto(`${server.baseUrl}/admin/organisation`);
    expect(await page.getByLabel('Consultancy name').count()).toBe(0);
    await page.close();
  }, 60_000);
});
