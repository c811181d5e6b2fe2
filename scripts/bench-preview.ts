/**
 * Browser benchmark of the model editor's live preview: a 500 × 100 grid, one shot, the model
 * edited again and again; for each edit the time from the change (a layer velocity committed in
 * the table) to the section redrawn with the new wavefronts. That span includes rasterising the
 * draft, the preview's short debounce, the solve in the Web Worker, contouring and the canvas
 * redraw. It runs the real client in headless Chromium against a running server.
 *
 *   npx tsx scripts/bench-preview.ts [--url http://127.0.0.1:8080] [--runs 21] [--json]
 *
 * Signs in with the demo geophysicist and saves nothing. Prints medians (and p90, min) in ms,
 * the worker's own solve time, and the longest main-thread task seen while editing (the page
 * must never freeze while solving).
 */
import { parseArgs } from 'node:util';
import { chromium, type Page } from 'playwright-core';

const { values } = parseArgs({
  options: {
    url: { type: 'string', default: 'http://127.0.0.1:8080' },
    email: { type: 'string', default: 'geo@timefield.test' },
    password: { type: 'string', default: 'timefield-demo' },
    line: { type: 'string', default: 'TQ-L1' },
    shot: { type: 'string', default: 'S4' },
    runs: { type: 'string', default: '21' },
    json: { type: 'boolean', default: false },
  },
});
const RUNS = Math.max(3, Number(values.runs));
const MEASURE = 'timefield:preview-redraw';

const quantile = (xs: number[], q: number): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * (s.length - 1) + 0.5))];
};

async function lineId(page: Page, name: string): Promise<string> {
  // No named helpers inside: the TypeScript runner would wrap them in a helper the page does not have.
  return page.evaluate(async (lineName) => {
    for (const project of await (await fetch('/api/projects')).json()) {
      const detail = await (await fetch(`/api/projects/${project.id}`)).json();
      const line = (detail.lines ?? []).find((l: { name: string }) => l.name === lineName);
      if (line) return line.id as string;
    }
    throw new Error(`no line named ${lineName} is visible to this account`);
  }, name);
}

let step = 'start';
async function editAndTime(page: Page, v: number): Promise<{ redrawMs: number; solveMs: number; contourMs: number }> {
  step = `edit to ${v}`;
  const before = await page.evaluate((m) => performance.getEntriesByName(m).length, MEASURE);
  const input = page.getByLabel('Layer 1 velocity at top (m/s)');
  await input.fill(String(v));
  await input.press('Enter');
  await page.waitForFunction(([m, n]) => performance.getEntriesByName(m as string).length > (n as number), [MEASURE, before] as const, { timeout: 90_000 });
  await page.waitForFunction(() => document.querySelector('[data-testid=preview-status]')?.getAttribute('data-status') === 'done');
  const redrawMs = await page.evaluate((m) => performance.getEntriesByName(m).at(-1)!.duration, MEASURE);
  const status = page.getByTestId('preview-status');
  return { redrawMs, solveMs: Number(await status.getAttribute('data-solve-ms')), contourMs: Number(await status.getAttribute('data-contour-ms')) };
}

async function dragBurst(page: Page, moves: number) {
  step = 'drag burst';
  await page.locator('[data-testid=layer-row-0] button[aria-pressed]').click();
  const x = Number(await page.getByLabel('Node 3 x (m)').inputValue());
  const z = Number(await page.getByLabel('Node 3 z (m)').inputValue());
  const canvas = page.getByTestId('section-canvas');
  await canvas.scrollIntoViewIfNeeded();
  const L = JSON.parse((await canvas.getAttribute('data-layout'))!);
  const box = (await canvas.boundingBox())!;
  const px = (xm: number) => box.x + L.left + ((xm - L.xMin) / (L.xMax - L.xMin)) * L.width;
  const py = (zm: number) => box.y + L.top + ((L.zMax - zm) / (L.zMax - L.zMin)) * L.height;
  const before = await page.evaluate((m) => {
    const w = window as unknown as { __dragTasks: number[] };
    w.__dragTasks = [];
    new PerformanceObserver((list) => list.getEntries().forEach((e) => w.__dragTasks.push(e.duration))).observe({ type: 'longtask' });
    return performance.getEntriesByName(m).length;
  }, MEASURE);
  await page.mouse.move(px(x), py(z));
  await page.mouse.down();
  for (let k = 1; k <= moves; k++) await page.mouse.move(px(x + (3 * k) / moves), py(z - (2 * Math.sin((Math.PI * k) / moves)) - k / moves));
  await page.mouse.up();
  const upAt = await page.evaluate(() => performance.now());
  await page.waitForFunction(() => document.querySelector('[data-testid=preview-status]')?.getAttribute('data-status') === 'done', null, { timeout: 90_000 });
  await page.waitForTimeout(300);
  const after = await page.evaluate((m) => {
    const all = performance.getEntriesByName(m);
    const last = all.at(-1)!;
    return { count: all.length, end: last.startTime + last.duration, tasks: (window as unknown as { __dragTasks: number[] }).__dragTasks };
  }, MEASURE);
  return { moves, redraws: after.count - before, settleMs: +Math.max(0, after.end - upAt).toFixed(1), longestTask: after.tasks.length ? +Math.max(...after.tasks).toFixed(1) : 0 };
}

async function main(): Promise<void> {
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-background-networking', '--disable-gpu'] });
  try {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await page.goto(`${values.url}/signin`);
    await page.getByLabel('E-mail address').fill(values.email!);
    await page.getByLabel('Password').fill(values.password!);
    await page.getByLabel('Password').press('Enter');
    await page.getByTestId('user-menu').waitFor();
    const id = await lineId(page, values.line!);
    await page.goto(`${values.url}/lines/${id}/models/new`);
    await page.getByTestId('section-canvas').waitFor({ timeout: 90_000 });

    // A 500 × 100 node grid at 0.3 m.
    const grid = { xStart: '-20', xEnd: '129.7', top: '104', depth: '29.7', spacing: '0.3' };
    for (const [k, v] of Object.entries(grid)) await page.locator(`[data-testid=grid-form] input[name=${k}]`).fill(v);
    const size = (await page.getByTestId('grid-size').textContent()) ?? '';
    if (!size.startsWith('500 × 100')) throw new Error(`expected a 500 × 100 grid, the form says: ${size}`);
    await page.getByRole('button', { name: 'Apply grid' }).click();
    await page.getByTestId('grid-message').waitFor();

    const pickSet = page.getByLabel('Pick set');
    if (await pickSet.count()) await pickSet.selectOption({ label: 'tq-l1.picks.csv' }).catch(() => undefined);
    await page.getByTestId('preview-shot').selectOption(values.shot!);
    await page.waitForFunction(() => document.querySelector('[data-testid=preview-status]')?.getAttribute('data-status') === 'done', null, { timeout: 90_000 });

    for (let k = 0; k < 3; k++) await editAndTime(page, 380 + 10 * k); // warm-up (JIT, first worker start)
    await page.evaluate(() => {
      const w = window as unknown as { __longTasks: number[] };
      w.__longTasks = [];
      new PerformanceObserver((list) => list.getEntries().forEach((e) => w.__longTasks.push(e.duration))).observe({ type: 'longtask' });
    });
    const runs: { redrawMs: number; solveMs: number; contourMs: number }[] = [];
    for (let k = 0; k < RUNS; k++) runs.push(await editAndTime(page, k % 2 ? 400 : 420));
    const longTasks = await page.evaluate(() => (window as unknown as { __longTasks: number[] }).__longTasks);
    // Main-thread parts of each edit, as the page measures them (the last RUNS of each).
    const parts = await page.evaluate((n) =>
      Object.fromEntries(['rasterise', 'check', 'heatmap', 'section-draw', 'preview-dispatch', 'preview-worker', 'preview-paint'].map((k) => [k, performance.getEntriesByName(`timefield:${k}`).slice(-n).map((e) => e.duration)])),
    RUNS);

    // A continuous drag of an interface node: 40 pointer moves, each a new model. Solves are not
    // queued one per move: while one runs only the newest model waits, so the page keeps up.
    const drag = await dragBurst(page, 40);

    await page.getByTestId('preview-rays').check();
    await page.waitForFunction(() => document.querySelector('[data-testid=preview-status]')?.getAttribute('data-status') === 'done', null, { timeout: 90_000 });
    const withRays: number[] = [];
    for (let k = 0; k < Math.ceil(RUNS / 2); k++) {
      const before = performance.now();
      await editAndTime(page, k % 2 ? 410 : 430); // never the value already there, or nothing would change
      await page.waitForFunction(() => document.querySelector('[data-testid=preview-status]')?.getAttribute('data-status') === 'done');
      withRays.push(performance.now() - before);
    }

    const redraw = runs.map((r) => r.redrawMs);
    const solve = runs.map((r) => r.solveMs).filter(Number.isFinite);
    const result = {
      case: 'preview-500x100',
      nx: 500,
      nz: 100,
      runs: RUNS,
      median_edit_to_redraw_ms: +quantile(redraw, 0.5).toFixed(1),
      p90_edit_to_redraw_ms: +quantile(redraw, 0.9).toFixed(1),
      min_edit_to_redraw_ms: +Math.min(...redraw).toFixed(1),
      median_worker_solve_ms: solve.length ? quantile(solve, 0.5) : null,
      median_worker_contour_ms: quantile(runs.map((r) => r.contourMs), 0.5),
      median_edit_to_worker_ms: +quantile(parts['preview-dispatch'], 0.5).toFixed(1),
      median_worker_round_trip_ms: +quantile(parts['preview-worker'], 0.5).toFixed(1),
      median_reply_to_drawn_ms: +quantile(parts['preview-paint'], 0.5).toFixed(1),
      median_rasterise_ms: +quantile(parts.rasterise, 0.5).toFixed(1),
      median_check_ms: +quantile(parts.check, 0.5).toFixed(1),
      median_heatmap_ms: +quantile(parts.heatmap, 0.5).toFixed(1),
      median_section_draw_ms: +quantile(parts['section-draw'], 0.5).toFixed(1),
      longest_main_thread_task_ms: longTasks.length ? +Math.max(...longTasks).toFixed(1) : 0,
      long_tasks_over_50ms: longTasks.length,
      drag_moves: drag.moves,
      drag_wavefront_redraws: drag.redraws,
      drag_release_to_final_redraw_ms: drag.settleMs,
      drag_longest_main_thread_task_ms: drag.longestTask,
      median_with_rays_roundtrip_ms: +quantile(withRays, 0.5).toFixed(1),
    };
    if (values.json) console.log(JSON.stringify(result));
    else {
      console.log(`preview on a 500 × 100 grid, ${RUNS} edits (after 3 warm-up edits):`);
      console.log(`  edit → redrawn wavefronts: median ${result.median_edit_to_redraw_ms} ms, p90 ${result.p90_edit_to_redraw_ms} ms, min ${result.min_edit_to_redraw_ms} ms`);
      console.log(`  split (medians): edit → sent to worker ${result.median_edit_to_worker_ms} ms, worker round trip ${result.median_worker_round_trip_ms} ms, reply → drawn ${result.median_reply_to_drawn_ms} ms`);
      console.log(`  in the worker: solve and receiver times median ${result.median_worker_solve_ms} ms, wavefront contours ${result.median_worker_contour_ms} ms`);
      console.log(`  main thread per edit (medians): rasterise ${result.median_rasterise_ms} ms, checks ${result.median_check_ms} ms, heatmap ${result.median_heatmap_ms} ms, section draw ${result.median_section_draw_ms} ms`);
      console.log(`  main thread: ${result.long_tasks_over_50ms} tasks over 50 ms, longest ${result.longest_main_thread_task_ms} ms`);
      console.log(`  drag of a node, ${result.drag_moves} moves: ${result.drag_wavefront_redraws} wavefront redraws, release → final redraw ${result.drag_release_to_final_redraw_ms} ms, longest main-thread task ${result.drag_longest_main_thread_task_ms} ms`);
      console.log(`  with rays (seen from the test driver, including its own round trips): median ${result.median_with_rays_roundtrip_ms} ms`);
    }
  } catch (err) {
    const page = browser.contexts()[0]?.pages()[0];
    if (page) {
      const status = await page.getByTestId('preview-status').evaluate((el) => `${el.getAttribute('data-status')}: ${el.textContent}`).catch(() => null);
      const measures = await page.evaluate((m) => performance.getEntriesByName(m).length, MEASURE).catch(() => null);
      const v = await page.getByLabel('Layer 1 velocity at top (m/s)').inputValue().catch(() => null);
      await page.screenshot({ path: '/tmp/bench-preview-failure.png', fullPage: true }).catch(() => undefined);
      throw new Error(`${(err as Error).message} at ${step}\n(preview status: ${status ?? 'not shown'}; ${measures} redraw measures; layer 1 v_top ${v}; page ${page.url()}; screenshot /tmp/bench-preview-failure.png)`);
    }
    throw err;
  } finally {
    await browser.close();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : String(err));
  process.exit(1);
});
