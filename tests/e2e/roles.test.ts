/**
 * Each demo role signs in through the real client and sees only what it may.
 * Screenshots land in tests/e2e/screenshots/ (ignored by git) for a person to look at.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoLine, demoProject } from '../../fixtures/demo/scenario';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';

async function signIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${baseUrl}/signin`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByLabel('Password').press('Enter'); // keyboard only
}

describe('each demo role in the browser', () => {
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

  const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });

  it('refuses a wrong password with a clear message and stays on the sign-in page', async () => {
    const page = await browser.newPage();
    await signIn(page, server.baseUrl, 'geo@timefield.test', 'wrong-password');
    await expect.poll(() => page.getByTestId('signin-error').textContent()).toMatch(/e-mail or password is not right/);
    expect(new URL(page.url()).pathname).toBe('/signin');
    await shot(page, 'signin-wrong-password');
    await page.close();
  });

  const cases = [
    { email: 'admin@timefield.test', name: 'admin', accounts: true, lines: true },
    { email: 'geo@timefield.test', name: 'geophysicist', accounts: false, lines: true },
    { email: 'tech@timefield.test', name: 'field-tech', accounts: false, lines: true },
    { email: 'lead@timefield.test', name: 'lead', accounts: false, lines: true },
    { email: 'client@timefield.test', name: 'client', accounts: false, lines: false },
  ];

  for (const c of cases) {
    it(`${c.name}: sees the demo project${c.lines ? ' with its line' : ' without field data'}${c.accounts ? ' and the accounts page' : ''}`, async () => {
      const page = await browser.newPage({ viewport: { width: 1280, height: 860 } });
      await signIn(page, server.baseUrl, c.email);
      await page.getByTestId('user-menu').waitFor();
      await page.getByRole('link', { name: demoProject.name }).click();
      await page.getByRole('heading', { name: demoProject.name }).waitFor();
      await page.getByTestId('members-table').waitFor();
      expect(await page.getByRole('link', { name: demoLine.name }).count()).toBe(c.lines ? 1 : 0);
      expect(await page.getByRole('link', { name: 'Accounts' }).count()).toBe(c.accounts ? 1 : 0);
      expect(await page.getByTestId('caution-footer').textContent()).toMatch(/borehole/i);
      await shot(page, `project-${c.name}`);

      if (c.accounts) {
        await page.getByRole('link', { name: 'Accounts' }).click();
        await page.getByTestId('accounts-table').waitFor();
        expect(await page.getByTestId('accounts-table').textContent()).toContain('client@timefield.test');
        await shot(page, 'accounts-admin');
      } else {
        // Typing the admin address does not reveal the page either.
        await page.goto(`${server.baseUrl}/admin/accounts`);
        await page.waitForSelector('[data-testid="not-found"], [data-testid="load-error"]');
        expect(await page.getByTestId('accounts-table').count()).toBe(0);
      }

      await page.getByTestId('signout').click();
      await page.waitForURL(/\/signin$/);
      await page.close();
    });
  }
});
