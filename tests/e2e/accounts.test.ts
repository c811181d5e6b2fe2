/**
 * Issue 16 item 12 in the browser: one's own password change (weak one refused with the server's
 * reason, a good one accepted) and an administrator's new-password form. Screenshots in
 * tests/e2e/screenshots/ for a person to look at.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoProject } from '../../fixtures/demo/scenario';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';

async function signIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${baseUrl}/signin`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByLabel('Password').press('Enter');
  await page.getByTestId('user-name').waitFor();
}

describe('passwords in the browser', () => {
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

  it('changes one’s own password from the page under one’s name, refusing a weak one with the reason', async () => {
    const page = await browser.newPage();
    await signIn(page, server.baseUrl, 'tech@timefield.test');
    await page.getByTestId('user-name').getByRole('link').click();
    await page.getByRole('heading', { name: 'Your account' }).waitFor();
    const form = page.getByTestId('change-password-form');
    await form.getByLabel('Current password').fill(DEMO_PASSWORD);
    await form.getByLabel('New password', { exact: true }).fill('1234567890');
    await form.getByLabel('New password again').fill('1234567890');
    await form.getByRole('button', { name: 'Change password' }).click();
    await expect.poll(() => form.textContent()).toMatch(/too easy to guess/);
    await shot(page, 'account-weak-password');

    await form.getByLabel('New password', { exact: true }).fill('copper kettle wanders north');
    await form.getByLabel('New password again').fill('copper kettle wanders north');
    await form.getByRole('button', { name: 'Change password' }).click();
    await page.getByTestId('password-changed').waitFor();
    await shot(page, 'account-password-changed');
    await page.close();
  });

  it('lets the administrator set a new password for an account', async () => {
    const page = await browser.newPage();
    await signIn(page, server.baseUrl, 'admin@timefield.test');
    await page.goto(`${server.baseUrl}/admin/accounts`);
    await page.getByTestId('account-geo@timefield.test').getByRole('button', { name: 'New password' }).click();
    const form = page.getByTestId('reset-password-geo@timefield.test');
    await form.getByRole('textbox').or(form.locator('input[type=password]')).first().fill('geo@timefield.test');
    await form.getByRole('button', { name: 'Set password' }).click();
    await expect.poll(() => form.textContent()).toMatch(/too easy to guess/);
    await shot(page, 'accounts-reset-weak');
    await form.locator('input[type=password]').fill('gravel kestrel lantern seven');
    await form.getByRole('button', { name: 'Set password' }).click();
    await expect.poll(() => page.getByRole('status').first().textContent()).toMatch(/New password set for/);
    await shot(page, 'accounts-reset-done');
    await page.close();
  });

  it('e-mails a one-time link that lets the owner choose a new password; the link works once (issue 17 item 3)', async () => {
    const page = await browser.newPage();
    await signIn(page, server.baseUrl, 'admin@timefield.test');
    await page.goto(`${server.baseUrl}/admin/accounts`);
    await page.getByTestId('account-client@timefield.test').getByRole('button', { name: 'New password' }).click();
    const row = page.getByTestId('reset-link-client@timefield.test');
    await row.getByRole('button', { name: /E-mail .* a link/ }).click();
    await expect.poll(() => row.textContent()).toMatch(/Sent to client@timefield\.test\. The link works once/);
    await shot(page, 'accounts-reset-link-sent');
    // The local mail sink keeps the message; the administrator's outbox shows it.
    const mails = (await page.evaluate(async () => (await fetch('/api/outbox')).json())) as { to: string[]; subject: string; body: string }[];
    const mail = mails.filter((m) => m.to.includes('client@timefield.test') && m.subject === 'Set a new Timefield password').at(-1)!;
    const link = /(http\S+#token=[\w-]+)/.exec(mail.body)![1];
    await page.close();

    const owner = await (await browser.newContext()).newPage();
    await owner.goto(link.replace(/^http:\/\/[^/]+/, server.baseUrl));
    await owner.getByLabel('New password', { exact: true }).fill('harbour lichen spindle nine');
    await owner.getByLabel('New password again').fill('harbour lichen spindle nine');
    await owner.getByTestId('reset-submit').click();
    await owner.getByTestId('reset-done').waitFor();
    await shot(owner, 'reset-password-done');
    await signIn(owner, server.baseUrl, 'client@timefield.test', 'harbour lichen spindle nine');

    // The same link a second time: refused in plain words.
    const again = await (await browser.newContext()).newPage();
    await again.goto(link.replace(/^http:\/\/[^/]+/, server.baseUrl));
    await again.getByLabel('New password', { exact: true }).fill('another quiet meadow four');
    await again.getByLabel('New password again').fill('another quiet meadow four');
    await again.getByTestId('reset-submit').click();
    await expect.poll(() => again.getByTestId('reset-error').textContent()).toMatch(/does not work any more/);
  });

  it('asks before making an administrator or deactivating, says what follows, and "Keep" changes nothing (issue 17 item 4)', async () => {
    const page = await browser.newPage();
    await signIn(page, server.baseUrl, 'admin@timefield.test');
    await page.goto(`${server.baseUrl}/admin/accounts`);
    const row = page.getByTestId('account-client@timefield.test');
    await row.getByTestId('account-role-client@timefield.test').click();
    expect(await row.getByTestId('account-role-client@timefield.test-warning').textContent()).toMatch(/will be able to create, change and deactivate every account/);
    await row.getByRole('button', { name: 'Keep' }).click();
    expect(await row.textContent()).toMatch(/Standard/);

    await row.getByTestId('account-active-client@timefield.test').click();
    expect(await row.getByTestId('account-active-client@timefield.test-warning').textContent()).toMatch(/signed out everywhere and cannot sign in/);
    await shot(page, 'accounts-confirm-deactivate');
    await row.getByTestId('account-active-client@timefield.test-confirm').click();
    await expect.poll(() => row.textContent()).toMatch(/Deactivated/);
    await row.getByRole('button', { name: 'Reactivate' }).click();
    await expect.poll(() => row.textContent()).toMatch(/Active/);
    await page.close();
  });

  it('lets a project lead change a member\'s role in place, saying what the role may do (issue 17 item 5)', async () => {
    const page = await browser.newPage();
    await signIn(page, server.baseUrl, 'lead@timefield.test');
    await page.getByRole('link', { name: demoProject.name }).click();
    const row = page.getByTestId('member-tech@timefield.test');
    await row.getByTestId('member-role-tech@timefield.test').click();
    await row.getByTestId('member-role-select-tech@timefield.test').selectOption('geophysicist');
    expect(await row.textContent()).toMatch(/interprets, edits models/);
    await row.getByTestId('member-role-save-tech@timefield.test').click();
    await expect.poll(() => row.textContent()).toMatch(/^.*Geophysicist/);
    await shot(page, 'members-role-changed');
    await row.getByTestId('member-role-tech@timefield.test').click();
    await row.getByTestId('member-role-select-tech@timefield.test').selectOption('field_tech');
    await row.getByTestId('member-role-save-tech@timefield.test').click();
    await expect.poll(() => row.textContent()).toMatch(/Field technician/);
    await page.close();
  });
});
