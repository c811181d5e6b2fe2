import type { Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../../fixtures/demo/scenario';

/** Signs a demo account in through the sign-in page, by keyboard, and waits for the app shell. */
export async function signIn(page: Page, baseUrl: string, email: string): Promise<void> {
  await page.goto(`${baseUrl}/signin`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByLabel('Password').press('Enter');
  await page.getByTestId('user-menu').waitFor();
}

/** A JSON call from inside the signed-in page (same cookies, the session's CSRF token). */
export async function api(page: Page, method: string, url: string, body?: unknown): Promise<{ status: number; body: Record<string, unknown> }> {
  return page.evaluate(
    async ({ method, url, body }) => {
      const token = ((await (await fetch('/api/auth/csrf')).json()) as { token: string }).token;
      const res = await fetch(url, {
        method,
        headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      return { status: res.status, body: (await res.json().catch(() => ({}))) as Record<string, unknown> };
    },
    { method, url, body },
  );
}
