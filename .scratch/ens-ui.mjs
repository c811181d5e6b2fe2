import { chromium } from 'playwright-core';
const base = 'http://127.0.0.1:8091';
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-background-networking'] });
const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
const errors = [];
page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
page.on('pageerror', (e) => errors.push(String(e)));
await page.goto(`${base}/signin`);
await page.fill('input[name=email]', 'geo@timefield.test');
await page.fill('input[name=password]', 'timefield-demo');
await page.click('button[type=submit]');
await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
// The demo line's finished inversion.
const inv = await page.evaluate(async () => {
  const projects = await (await fetch('/api/projects')).json();
  for (const p of projects) {
    const proj = await (await fetch(`/api/projects/${p.id}`)).json();
    for (const l of proj.lines ?? []) {
      const list = await (await fetch(`/api/lines/${l.id}/inversions`)).json();
      const done = list.find((i) => i.status === 'done');
      if (done) return { lineId: l.id, id: done.id };
    }
  }
  return null;
});
console.log('inversion', inv);
await page.goto(`${base}/lines/${inv.lineId}/inversions/${inv.id}`);
await page.getByTestId('start-ensemble-toggle').click();
// Bad input first: one member, reversed v* range.
await page.getByTestId('ensemble-members').fill('1');
await page.getByTestId('ensemble-rock-max').fill('1000');
await page.getByTestId('start-ensemble').click();
await page.waitForTimeout(300);
await page.getByTestId('start-ensemble-form').screenshot({ path: '.scratch/ens-form-errors.png' });
await page.getByTestId('ensemble-members').fill(process.env.MEMBERS ?? '12');
await page.getByTestId('ensemble-rock').fill('1800');
await page.getByTestId('ensemble-rock-max').fill('3000');
await page.getByTestId('start-ensemble').click();
await page.waitForURL(/ensembles\//);
await page.waitForTimeout(5000);
await page.screenshot({ path: '.scratch/ens-progress.png', fullPage: true });
await page.getByTestId('ensemble-status').and(page.locator('[data-status=done],[data-status=failed]')).waitFor({ timeout: 300_000 });
await page.waitForTimeout(2500);
await page.screenshot({ path: '.scratch/ens-done.png', fullPage: true });
await page.setViewportSize({ width: 390, height: 900 });
await page.waitForTimeout(800);
await page.screenshot({ path: '.scratch/ens-phone.png', fullPage: false });
const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
console.log('phone overflow px', overflow);
console.log('errors', errors);
await browser.close();
