/**
 * Reports in the browser, end to end with a real worker process: a report of a finished demo run is
 * walked through draft → submitted → returned → submitted → approved → shared by the geophysicist and
 * the lead, each step telling who was e-mailed; the client then finds only the shared report and
 * downloads its PDF, and is refused a draft; the admin reads each step's e-mail in the outbox; the lead
 * reads the project's audit trail. Bad input is refused in plain words (a return without a comment,
 * steps out of order). The workflow and who is mailed at each step are the contract of issue 7 and
 * ../shared/API.md. Screenshots land in tests/e2e/screenshots/ (ignored by git) for a person to look at.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoLine, demoProject } from '../../fixtures/demo/scenario';
import { startWorker, waitFor, type WorkerProcess } from '../api/support/worker';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';
import { api, signIn } from './support/page';



describe('reports: review workflow, client delivery, outbox and audit trail in the browser', () => {
  let server: E2eServer;
  let worker: WorkerProcess;
  let browser: Browser;
  let projectId = '';
  let runId = '';
  let reportId = '';
  let draftId = '';

  beforeAll(async () => {
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    server = await startDemoServer();
    worker = startWorker('e2e-report-worker');
    browser = await launchBrowser();

    // A finished second-order run of the demo model and picks, started through the API as the geophysicist.
    const page = await browser.newPage();
    await signIn(page, server.baseUrl, 'geo@timefield.test');
    const projects = (await api(page, 'GET', '/api/projects')).body as unknown as { id: string; name: string }[];
    projectId = projects.find((p) => p.name === demoProject.name)!.id;
    const project = (await api(page, 'GET', `/api/projects/${projectId}`)).body as { lines: { id: string; name: string }[] };
    const lineId = project.lines.find((l) => l.name === demoLine.name)!.id;
    const line = (await api(page, 'GET', `/api/lines/${lineId}`)).body as { models: { id: string }[]; pickSets: { id: string }[] };
    const started = await api(page, 'POST', '/api/runs', { modelId: line.models[0]!.id, pickSetId: line.pickSets[0]!.id, order: 2 });
    expect(started.status).toBe(202);
    runId = started.body.id as string;
    await waitFor(
      async () => {
        const status = (await api(page, 'GET', `/api/runs/${runId}`)).body.status;
        if (status === 'failed' || status === 'cancelled') throw new Error(`the demo run ${status}: ${worker.output.join('')}`);
        return status === 'done' ? true : undefined;
      },
      90_000,
      'the demo run',
    );
    await page.close();
  }, 150_000);
  afterAll(async () => {
    await browser?.close();
    await worker?.stop();
    await server?.close();
  });

  const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
  const openPage = async (email: string) => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
    await signIn(page, server.baseUrl, email);
    return page;
  };
  const status = (page: Page) => page.getByTestId('report-facts').getByTestId('report-status');

  /** Open the step (unless open), write the comment, confirm; resolves with the "e-mail sent to" sentence. */
  async function takeStep(page: Page, step: string, comment: string, next: string): Promise<string> {
    const form = page.getByTestId(`step-form-${step}`);
    if (!(await form.isVisible())) await page.getByTestId(`step-${step}`).click(); // the button toggles an open form shut
    await form.waitFor();
    if (comment) await form.getByRole('textbox').fill(comment);
    await page.getByTestId(`confirm-${step}`).click();
    await page.locator(`[data-testid="report-facts"] [data-status="${next}"]`).waitFor();
    return (await page.getByTestId('step-outcome').textContent()) ?? '';
  }

  it('geophysicist: the new report is listed on the project page, its PDF becomes downloadable, and submitting mails the lead', async () => {
    const page = await openPage('geo@timefield.test');
    const started = await api(page, 'POST', `/api/runs/${runId}/reports`, { shotId: 'S4', isoVelocity: 2400, acquisitionNotes: 'Dry and calm; sledgehammer on a steel plate.' });
    expect(started.status).toBe(202);
    reportId = started.body.id as string;

    await page.getByRole('link', { name: demoProject.name }).click();
    const table = page.getByTestId('reports-table');
    await table.waitFor();
    expect(await table.getByTestId('report-row').count()).toBe(1);
    expect(await table.textContent()).toMatch(/TQ-L1.*Draft.*Ruth Lindqvist/s);
    await table.getByRole('link', { name: /Report on line TQ-L1/ }).click();
    await page.waitForURL(new RegExp(`/reports/${reportId}$`));
    await page.getByRole('heading', { name: 'Report on line TQ-L1' }).waitFor();

    // The page polls while the worker draws the PDF; the download link appears when it is ready.
    await page.getByTestId('pdf-download').waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('pdf-download').getAttribute('href')).toBe(`/api/reports/${reportId}/pdf`);
    expect(await page.getByTestId('report-caution').textContent()).toMatch(/non-unique.*boreholes.*qualified professional.*Local codes govern/s);
    expect(await page.getByTestId('report-facts').textContent()).toMatch(/S4.*2,400 m\/s/s);
    expect(await page.getByTestId('report-next').textContent()).toMatch(/submits it for review/);
    expect(await page.getByTestId('history-entry').count()).toBe(1);
    // Only the geophysicist's step is offered on a draft.
    expect(await page.getByTestId('step-approve').count()).toBe(0);
    await shot(page, 'report-draft-geophysicist');

    const outcome = await takeStep(page, 'submit', 'Section drawn for the middle shot, S4.', 'submitted');
    expect(outcome).toMatch(/Submitted for review\. E-mail sent to lead@timefield\.test\./);
    expect(await page.getByTestId('no-steps').textContent()).toMatch(/no step for you/);
    await shot(page, 'report-submitted-geophysicist');
    await page.close();
  }, 90_000);

  it('lead: a return without a comment is refused before anything is sent; with a comment it goes back to the author', async () => {
    const page = await openPage('lead@timefield.test');
    await page.goto(`${server.baseUrl}/reports/${reportId}`);
    await status(page).and(page.locator('[data-status="submitted"]')).waitFor();
    const posted: string[] = [];
    page.on('request', (r) => {
      if (r.method() === 'POST' && r.url().includes('/api/reports/')) posted.push(r.url());
    });

    await page.getByTestId('step-return').click();
    await page.getByTestId('confirm-return').click();
    const form = page.getByTestId('step-form-return');
    expect(await form.textContent()).toMatch(/Say what needs changing/);
    expect(await form.getByRole('textbox').getAttribute('aria-invalid')).toBe('true');
    expect(posted).toEqual([]);
    await shot(page, 'report-return-needs-comment');
    // The server refuses it too, with the same reason in words.
    const bare = await api(page, 'POST', `/api/reports/${reportId}/return`, {});
    expect(bare.status).toBe(400);
    expect(String(bare.body.message)).toMatch(/say what needs changing/);

    const outcome = await takeStep(page, 'return', 'Say in the notes which geophones were re-seated after the rain.', 'returned');
    expect(outcome).toMatch(/Returned to the author\. E-mail sent to geo@timefield\.test\./);
    await page.close();
  }, 60_000);

  it('geophysicist answers and resubmits; lead approves and shares, each step mailing the right people', async () => {
    const geo = await openPage('geo@timefield.test');
    await geo.goto(`${server.baseUrl}/reports/${reportId}`);
    await status(geo).and(geo.locator('[data-status="returned"]')).waitFor();
    expect(await geo.getByTestId('report-history').textContent()).toMatch(/Helen Marsh.*returned it for changes.*re-seated after the rain/s);
    expect(await takeStep(geo, 'submit', 'Geophones 12–14 re-seated; noted.', 'submitted')).toMatch(/E-mail sent to lead@timefield\.test\./);
    await geo.close();

    const lead = await openPage('lead@timefield.test');
    await lead.goto(`${server.baseUrl}/reports/${reportId}`);
    await status(lead).and(lead.locator('[data-status="submitted"]')).waitFor();
    expect(await takeStep(lead, 'approve', 'Checked against the run; fine.', 'approved')).toMatch(/Approved\. E-mail sent to geo@timefield\.test\./);
    expect(await lead.getByTestId('report-next').textContent()).toMatch(/shares it with the client/);
    // Issue 16: sharing waits for the approved render, so the client can never be handed the draft.
    await lead.locator('[data-testid="step-share"]:not([disabled])').waitFor({ timeout: 60_000 });
    expect(await takeStep(lead, 'share', 'The depth table is on page 4.', 'shared')).toMatch(/Shared with the client\. E-mail sent to client@timefield\.test\./);
    const actions = await lead.getByTestId('history-entry').evaluateAll((els) => els.map((e) => e.getAttribute('data-action')));
    expect(actions).toEqual(['create', 'submit', 'return', 'submit', 'approve', 'share']);
    // The approved PDF is drawn again (reviewer on its cover); wait for it so the client can download it.
    await lead.getByTestId('pdf-download').waitFor({ timeout: 60_000 });
    await shot(lead, 'report-shared-lead');
    await lead.close();
  }, 120_000);

  it('steps out of order are refused: no buttons for them, and the API answers 409 in words', async () => {
    const geo = await openPage('geo@timefield.test');
    const draft = await api(geo, 'POST', `/api/runs/${runId}/reports`, {});
    expect(draft.status).toBe(202);
    draftId = draft.body.id as string;
    expect((await api(geo, 'POST', `/api/reports/${reportId}/submit`, {})).status).toBe(409); // already shared
    await geo.close();

    const lead = await openPage('lead@timefield.test');
    await lead.goto(`${server.baseUrl}/reports/${draftId}`);
    await status(lead).and(lead.locator('[data-status="draft"]')).waitFor();
    expect(await lead.getByTestId('step-approve').count()).toBe(0);
    expect(await lead.getByTestId('no-steps').textContent()).toMatch(/no step for you/);
    const approveDraft = await api(lead, 'POST', `/api/reports/${draftId}/approve`, {});
    expect(approveDraft.status).toBe(409);
    expect(approveDraft.body.error).toBe('invalid_step');
    expect(String(approveDraft.body.message)).toMatch(/draft report cannot be approved/);
    // The team's list shows both, newest first.
    await lead.goto(`${server.baseUrl}/projects/${projectId}`);
    await lead.getByTestId('reports-table').waitFor();
    const states = await lead.getByTestId('report-row').evaluateAll((rows) => rows.map((r) => r.querySelector('[data-status]')?.getAttribute('data-status')));
    expect(states).toEqual(['draft', 'shared']);
    await shot(lead, 'project-lead-reports');
    await lead.close();
  }, 60_000);

  it('client: sees only the shared report, downloads its PDF, and is refused the draft; nothing leads to lines or runs', async () => {
    const page = await openPage('client@timefield.test');
    await page.getByRole('link', { name: demoProject.name }).click();
    const table = page.getByTestId('reports-table');
    await table.waitFor();
    expect(await table.getByTestId('report-row').count()).toBe(1);
    expect(await page.getByRole('heading', { name: 'Reports shared with you' }).count()).toBe(1);
    expect(await page.locator('a[href^="/lines/"], a[href^="/runs/"], a[href$="/audit"]').count()).toBe(0);
    await shot(page, 'project-client-reports');

    const [download] = await Promise.all([page.waitForEvent('download'), table.getByTestId('pdf-download').click()]);
    const pdf = readFileSync((await download.path())!);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(download.suggestedFilename()).toMatch(/^timefield-report-[0-9a-f]{8}\.pdf$/);

    await table.getByRole('link', { name: /Report on line TQ-L1/ }).click();
    await page.getByTestId('pdf-panel').waitFor();
    // Issue 16: a client sees when, not who (nor the team's comments).
    expect(await page.getByTestId('shared-by').textContent()).toMatch(/Shared with you on/);
    expect(await page.locator('main').textContent()).not.toMatch(/Helen Marsh|depth table is on page 4/);
    expect(await page.getByTestId('report-caution').textContent()).toMatch(/non-unique/);
    // The team's review notes and the run behind the report stay internal.
    expect(await page.getByTestId('report-history').count()).toBe(0);
    expect(await page.getByTestId('report-run-link').count()).toBe(0);
    expect(await page.locator('main').textContent()).not.toMatch(/re-seated/);
    await shot(page, 'report-client');

    await page.goto(`${server.baseUrl}/reports/${draftId}`);
    await page.getByTestId('report-not-shared').waitFor();
    expect(await page.getByTestId('report-not-shared').textContent()).toMatch(/not been shared with you/);
    await shot(page, 'report-client-draft-refused');
    for (const url of [`/projects/${projectId}/audit`, '/admin/outbox']) {
      await page.goto(`${server.baseUrl}${url}`);
      await page.getByTestId('not-found').waitFor();
    }
    await page.close();
  }, 60_000);

  it('admin: the outbox holds each step\u2019s e-mail with its recipients, and a row opens to its body from the keyboard', async () => {
    const page = await openPage('admin@timefield.test');
    await page.getByRole('link', { name: 'Mail outbox' }).click();
    const table = page.getByTestId('outbox-table');
    await table.waitFor();
    const rows = await page.getByTestId('outbox-row').evaluateAll((els) =>
      els.map((r) => {
        const cells = r.querySelectorAll('td');
        return { to: cells[2]!.textContent, subject: r.querySelector('[data-testid="outbox-subject"]')?.textContent };
      }),
    );
    // Newest first: share → client; approve → author; submit → lead; return → author; submit → lead.
    expect(rows.map((r) => r.to)).toEqual(['client@timefield.test', 'geo@timefield.test', 'lead@timefield.test', 'geo@timefield.test', 'lead@timefield.test']);
    expect(rows.map((r) => r.subject?.split(':')[0]?.trim())).toEqual(['Report available', 'Report approved', 'Report for review', 'Report returned', 'Report for review']);

    const first = page.getByTestId('outbox-row').first().getByRole('button');
    expect(await first.getAttribute('aria-expanded')).toBe('false');
    await first.focus();
    await page.keyboard.press('Enter');
    expect(await first.getAttribute('aria-expanded')).toBe('true');
    const body = page.getByTestId('outbox-body').first();
    await body.waitFor();
    expect(await body.textContent()).toMatch(new RegExp(`/reports/${reportId}[\\s\\S]*boreholes`));
    await shot(page, 'outbox-admin');
    await page.close();
  }, 60_000);

  it('lead: the audit trail records every step, who took it and the comment, and filters by action', async () => {
    const page = await openPage('lead@timefield.test');
    await page.goto(`${server.baseUrl}/projects/${projectId}`);
    await page.getByTestId('audit-link').click();
    const table = page.getByTestId('audit-table');
    await table.waitFor();
    await page.getByTestId('audit-filter').fill('report.');
    await expect.poll(() => page.getByTestId('audit-row').count()).toBe(7); // two creates, submit, return, submit, approve, share
    await page.getByTestId('audit-filter').fill('return');
    await expect.poll(() => page.getByTestId('audit-row').count()).toBe(1);
    expect(await table.textContent()).toMatch(/Helen Marsh.*Returned a report.*report\.return.*re-seated after the rain/s);
    await shot(page, 'audit-lead');
    await page.getByTestId('audit-filter').fill('no such action');
    await page.getByTestId('audit-no-match').waitFor();
    await page.close();

    // A geophysicist has no audit trail to read.
    const geo = await openPage('geo@timefield.test');
    await geo.goto(`${server.baseUrl}/projects/${projectId}/audit`);
    await geo.getByTestId('not-found').waitFor();
    await geo.close();
  }, 60_000);
});
