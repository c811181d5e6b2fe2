/**
 * `npm run bench:draw [-- --json]`: drawing a record of 48 traces × 4000 samples in headless
 * Chromium (Debian's /usr/bin/chromium), median of 15 draws per display mode, and the trace
 * processing (plain; AGC + band-pass) before it. Issue 12's target: a draw under 100 ms.
 */
import { build } from 'esbuild';
import { chromium } from 'playwright-core';

const ROUNDS = 15;
const TARGET_MS = 100;

const bundle = await build({ entryPoints: ['scripts/bench/record-draw-entry.ts'], bundle: true, write: false, format: 'iife', globalName: 'drawBench', platform: 'browser', target: 'es2022' });
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-background-networking'] });
try {
  const page = await browser.newPage();
  await page.setContent('<!doctype html><html><body></body></html>');
  await page.addScriptTag({ content: bundle.outputFiles[0].text });
  const result = (await page.evaluate(`drawBench.run(${ROUNDS})`)) as Record<string, number>;
  const worst = Math.max(result.draw_wiggle_ms, result.draw_density_ms, result.draw_both_ms);
  if (process.argv.includes('--json')) console.log(JSON.stringify({ ...result, target_ms: TARGET_MS, met: worst < TARGET_MS }));
  else {
    console.log(`48 traces × 4000 samples on 1200 × 700 px, median of ${ROUNDS}:`);
    for (const [k, v] of Object.entries(result)) console.log(`  ${k.padEnd(24)} ${v.toFixed(1)} ms`);
    console.log(`  slowest draw ${worst.toFixed(1)} ms — target < ${TARGET_MS} ms ${worst < TARGET_MS ? 'met' : 'NOT met'}`);
  }
} finally {
  await browser.close();
}
