/**
 * Every role walks its pages on the demo, at desktop (1440×900) and phone (390×844) size, with the
 * demo's finished run and shared report made by a real worker as at first start (issue 17 items 2,
 * 12 and 14): no page may scroll sideways, log an error or warning in the console, throw, or get an
 * error answer from the API. Screenshots of each page land in tests/e2e/screenshots/walk/ (ignored
 * by git) for a person to look at.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { createMailer } from '../../server/mail/mailer';
import { createJobQueue } from '../../server/queue/queue';
import { finishDemoWorkflow } from '../../server/services/demoWorkflow';
import { startWorker, type WorkerProcess } from '../api/support/worker';
import { signIn } from './support/page';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';

const SIZES = [
  { width: 1440, height: 900 },
  { width: 390, height: 844 },
];
const WALK_DIR = path.join(SCREENSHOT_DIR, 'walk');

describe('every role, every page, desktop and phone: no sideways scroll, a clean console', () => {
  let server: E2eServer;
  let browser: Browser;
  let worker: WorkerProcess;
  let ids: { projectId: string; lineId: string; modelId: string; runId: string; reportId: string };

  beforeAll(async () => {
    mkdirSync(WALK_DIR, { recursive: true });
    server = await startDemoServer();
    worker = startWorker('e2e-walk');
    const queue = createJobQueue();
    const mailer = createMailer(1); // no mail server: the steps are recorded, the e-mails fail quietly
    const { runId, reportId } = await finishDemoWorkflow({ ds: dataSource, queue, mailer, timeoutMs: 240_000 });
    mailer.close();
    await queue.close();
    const [row] = await dataSource.query(
      `SELECT r.line_id, l.project_id, r.model_id FROM runs r JOIN survey_lines l ON l.id = r.line_id WHERE r.id = $1`,
      [runId],
    );
    ids = { projectId: row.project_id, lineId: row.line_id, modelId: row.model_id, runId, reportId };
    browser = await launchBrowser();
  }, 300_000);
  afterAll(async () => {
    await browser?.close();
    await worker?.stop();
    await server?.close();
  });

  const pagesOf = (role: string): string[] => {
    const { projectId, lineId, modelId, runId, reportId } = ids;
    const common = ['/', '/account', `/projects/${projectId}`, `/reports/${reportId}`];
    if (role === 'client') return common;
    const tabs = ['stations', 'records', 'boreholes', 'picks', 'checks', 'layers', 'models', 'runs', 'inversions', 'rock'].map((t) => `/lines/${lineId}?tab=${t}`);
    return [...common, ...tabs, `/lines/${lineId}/picking`, `/models/${modelId}`, `/runs/${runId}`, `/runs/${runId}?view=curves`, `/runs/${runId}?view=misfit`, `/runs/${runId}?view=table`, `/runs/${runId}?view=exports`, `/projects/${projectId}/plan`];
  };

  async function walk(page: Page, role: string, size: { width: number }): Promise<string[]> {
    const problems: string[] = [];
    let at = '';
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') problems.push(`${at}: console ${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`${at}: uncaught ${e.message}`));
    page.on('response', (r) => {
      if (r.status() >= 400) problems.push(`${at}: ${r.status()} from ${new URL(r.url()).pathname}`);
    });
    for (const url of pagesOf(role)) {
      at = url;
      await page.goto(`${server.baseUrl}${url}`);
      await page.waitForLoadState('networkidle');
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      if (overflow > 1) problems.push(`${url}: the page scrolls sideways by ${overflow} px at ${size.width} px wide`);
      const name = `${role}-${size.width}-${url.replace(/[^a-z0-9]+/gi, '_').replace(/_[0-9a-f]{8}_[0-9a-f_]{27}/g, '')}`.slice(0, 80);
      await page.screenshot({ path: path.join(WALK_DIR, `${name}.png`), fullPage: true });
    }
    return problems;
  }

  it('a signed-out visitor: the sign-in page and a guarded address', async () => {
    for (const size of SIZES) {
      const context = await browser.newContext({ viewport: size });
      const page = await context.newPage();
      const problems: string[] = [];
      page.on('console', (m) => (m.type() === 'error' || m.type() === 'warning') && problems.push(`console ${m.type()}: ${m.text()}`));
      page.on('response', (r) => r.status() >= 400 && problems.push(`${r.status()} from ${new URL(r.url()).pathname}`));
      for (const url of ['/signin', `/projects/${ids.projectId}`]) {
        await page.goto(`${server.baseUrl}${url}`);
        await page.getByLabel('E-mail address').waitFor();
        const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
        if (overflow > 1) problems.push(`${url}: the page scrolls sideways by ${overflow} px`);
      }
      await context.close();
      expect(problems, problems.join('\n')).toEqual([]);
    }
  });

  for (const role of ['geo', 'tech', 'lead', 'client']) {
    it(`${role}@timefield.test`, async () => {
      for (const size of SIZES) {
        const context = await browser.newContext({ viewport: size });
        const page = await context.newPage();
        await signIn(page, server.baseUrl, `${role}@timefield.test`);
        const problems = await walk(page, role, size);
        await context.close();
        expect(problems, problems.join('\n')).toEqual([]);
      }
    }, 300_000);
  }
});
