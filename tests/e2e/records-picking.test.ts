/**
 * Field records in the browser (issue 12, items 4 and 6), on the demo line: the demo's shot records
 * are listed; a field technician uploads two files at once (one refused whole, with the byte offset
 * where reading stopped), sets the shot position the new file lacks, auto-picks it, moves a pick by
 * keyboard, undoes a deletion, is held by the leave guard, and saves the picks as a pick set linked
 * to the record. The new record is made by our SEG-2 writer with a causal wavelet starting exactly at
 * a chosen time (the outside truth for the picks); the writer itself is checked against the
 * published layout in tests/unit/records. A lead reads without picking controls.
 * Screenshots at 1440×900 and 390×844 land in tests/e2e/screenshots/ (ignored by git).
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoLine, demoProject } from '../../fixtures/demo/scenario';
import { writeSeg2 } from '../../shared/records';
import { wavelet } from '../../shared/records/synthetic-trace';
import { api, signIn } from './support/page';
import { launchBrowser, SCREENSHOT_DIR, startDemoServer, type E2eServer } from './support/server';

const DT = 0.00025;
/** Receivers every 2 m from x = 0; the shot at x = −4 m (not written into the file); arrivals at 800 m/s, exact. */
const truthMs = (k: number) => ((4 + 2 * k) / 800) * 1000;

function newRecordFile(): Buffer {
  const traces = Array.from({ length: 12 }, (_, k) => ({
    samples: Array.from({ length: 400 }, (_, i) => Math.round(20000 * wavelet(i * DT - truthMs(k) / 1000) + 40 * Math.sin(i * 1.7 + k))),
    channel: k + 1,
    sampleInterval: DT,
    receiver: { x: 2 * k, y: null, z: null },
  }));
  return Buffer.from(writeSeg2(traces, { format: 2 }));
}

describe('records tab and first-break picking', () => {
  let server: E2eServer;
  let browser: Browser;
  let lineId = '';

  const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });

  async function open(email: string, viewport = { width: 1440, height: 900 }): Promise<Page> {
    const page = await (await browser.newContext({ viewport })).newPage();
    await signIn(page, server.baseUrl, email);
    if (!lineId) {
      await page.getByRole('link', { name: demoProject.name }).click();
      await page.getByRole('link', { name: demoLine.name }).click();
      await page.waitForURL(/\/lines\/[0-9a-f-]{36}/);
      lineId = new URL(page.url()).pathname.split('/')[2]!;
    }
    return page;
  }

  beforeAll(async () => {
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    server = await startDemoServer();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('a field technician uploads, sets the shot, picks automatically and by hand, and saves a linked pick set', async () => {
    const page = await open('tech@timefield.test');
    await page.goto(`${server.baseUrl}/lines/${lineId}?tab=records`);
    // The demo line comes with one record per shot of its stored picks.
    await expect.poll(() => page.getByTestId('record-row').count()).toBe(7);

    await page.getByTestId('record-file-input').setInputFiles([
      { name: 'X1.sg2', mimeType: 'application/octet-stream', buffer: newRecordFile() },
      { name: 'notes.sg2', mimeType: 'application/octet-stream', buffer: Buffer.from('field notes, not a record'.repeat(10)) },
    ]);
    await page.locator('[data-testid=record-upload-row][data-state=stored]').waitFor();
    await page.locator('[data-testid=record-upload-row][data-state=refused]').waitFor();
    await expect(page.locator('[data-testid=record-upload-row][data-state=refused]').textContent()).resolves.toMatch(/Refused, nothing stored: notes\.sg2: byte \d+: expected/);
    await expect.poll(() => page.getByTestId('record-row').count()).toBe(8);

    const row = page.getByTestId('record-row').filter({ hasText: 'X1.sg2' });
    await expect(row.textContent()).resolves.toContain('not set');
    await row.getByTestId('record-edit-shot').click();
    await page.getByTestId('record-shot-x').fill('-4');
    await page.getByTestId('record-shot-save').click();
    await expect.poll(() => row.textContent()).not.toContain('not set');
    await shot(page, 'records-tab-1440');

    const list = await api(page, 'GET', `/api/lines/${lineId}/records`);
    const record = (list.body as unknown as { id: string; fileName: string }[]).find((r) => r.fileName === 'X1.sg2')!;
    await page.goto(`${server.baseUrl}/lines/${lineId}/picking?record=${record.id}`);
    await page.getByTestId('record-canvas').waitFor();
    await page.getByTestId('autopick-record').click();
    await expect.poll(() => page.getByTestId('record-select').locator('option:checked').textContent()).toMatch(/12 picks/);

    // Keyboard: third trace, read its automatic pick, move it 4 samples (1 ms) later.
    await page.getByTestId('record-canvas').focus();
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('ArrowRight');
    const readout = () => page.getByTestId('trace-readout').textContent();
    const autoMs = Number(/first break ([\d.]+) ms \(automatic/.exec((await readout())!)![1]);
    expect(Math.abs(autoMs - truthMs(2))).toBeLessThanOrEqual(0.25);
    for (let i = 0; i < 4; i++) await page.keyboard.press('ArrowDown');
    await expect.poll(readout).toContain(`first break ${+(autoMs + 1).toFixed(3)} ms (by hand`);
    // Delete the next trace's pick, then undo it.
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('Delete');
    await expect.poll(readout).toContain('not picked');
    await page.keyboard.press('Control+z');
    await expect.poll(readout).toMatch(/first break [\d.]+ ms \(automatic/);
    await shot(page, 'picking-1440');

    // Leaving with unsaved picks asks first.
    await page.getByRole('link', { name: demoLine.name }).click();
    await page.getByTestId('leave-guard').waitFor();
    await page.getByRole('button', { name: 'Stay and keep editing' }).click();

    await page.getByTestId('save-picks-name').fill('Picked on X1');
    await page.getByTestId('save-picks-button').click();
    await page.getByTestId('save-picks-done').waitFor();
    const href = await page.getByTestId('save-picks-done').getByRole('link').getAttribute('href');
    const pickSetId = new URLSearchParams(href!.split('?')[1]).get('pickset')!;
    const saved = await api(page, 'GET', `/api/picksets/${pickSetId}`);
    const picks = saved.body.picks as { shotId: string; sourceX: number; receiverX: number; timeMs: number }[];
    expect(picks).toHaveLength(12);
    expect(picks.every((p) => p.shotId === 'X1' && p.sourceX === -4)).toBe(true);
    const moved = picks.find((p) => p.receiverX === 4)!;
    expect(moved.timeMs).toBeCloseTo(autoMs + 1, 3);
    // Every other pick within one sample of the exact arrival.
    for (const p of picks.filter((q) => q.receiverX !== 4)) expect(Math.abs(p.timeMs - truthMs(p.receiverX / 2))).toBeLessThanOrEqual(0.25);
    const after = await api(page, 'GET', `/api/lines/${lineId}/records`);
    expect((after.body as unknown as { id: string; pickSetIds: string[] }[]).find((r) => r.id === record.id)!.pickSetIds).toEqual([pickSetId]);

    // A correction saved as the next version of that set: the first one is retired, kept readable.
    await page.getByTestId('record-canvas').click();
    await page.keyboard.press('ArrowUp');
    await page.getByTestId('save-picks-as').selectOption({ label: 'A new version of Picked on X1.picks.csv' });
    await expect.poll(() => page.getByTestId('save-picks-replaces').textContent()).toMatch(/Picked on X1\.picks\.csv will be retired/);
    await page.getByTestId('save-picks-name').fill('Picked on X1 v2');
    await page.getByTestId('save-picks-button').click();
    await expect.poll(async () => (await page.getByTestId('save-picks-done').getByRole('link').getAttribute('href')) ?? '').not.toContain(pickSetId);
    const line = await api(page, 'GET', `/api/lines/${lineId}`);
    const sets = line.body.pickSets as unknown as { id: string; fileName: string; retired: { reason: string } | null }[];
    expect(sets.find((p) => p.id === pickSetId)!.retired!.reason).toBe('replaced by Picked on X1 v2.picks.csv, picked on the records');
    expect(sets.find((p) => p.fileName === 'Picked on X1 v2.picks.csv')!.retired).toBeNull();

    // Saved: leaving is free now.
    await page.getByRole('link', { name: demoLine.name }).click();
    await page.waitForURL(/tab=records/);
  });

  it('a lead sees the records and traces but no picking controls; the page fits a phone', async () => {
    const page = await open('lead@timefield.test', { width: 390, height: 844 });
    await page.goto(`${server.baseUrl}/lines/${lineId}/picking`);
    await page.getByTestId('record-canvas').waitFor();
    await expect(page.getByTestId('autopick-record').count()).resolves.toBe(0);
    await expect(page.getByTestId('save-picks').count()).resolves.toBe(0);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await shot(page, 'picking-390-lead');
  });
});
