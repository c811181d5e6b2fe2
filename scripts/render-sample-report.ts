/**
 * `npx tsx scripts/render-sample-report.ts OUT.pdf [--demo] [--repeat N]`
 * Writes a sample PDF summary from the invented report fixture (small, or the demo-sized line
 * TQ-L1 with --demo) for looking at, and prints how long rendering took (median of N renders;
 * the fixture's solves are not counted).
 */
import { writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { demoReportInput } from '../fixtures/report/demo';
import { smallReportInput } from '../fixtures/report/small';
import { renderReportPdf } from '../worker/report/render';

const { values, positionals } = parseArgs({ allowPositionals: true, options: { demo: { type: 'boolean', default: false }, repeat: { type: 'string', default: '1' } } });
const out = positionals[0];
const repeat = Number(values.repeat);
if (!out || !Number.isInteger(repeat) || repeat < 1) {
  console.error('usage: npx tsx scripts/render-sample-report.ts OUT.pdf [--demo] [--repeat N]');
  process.exit(2);
}
const input = values.demo ? demoReportInput() : smallReportInput();
const times: number[] = [];
let pdf: Buffer = Buffer.alloc(0);
for (let i = 0; i < repeat; i++) {
  const t0 = performance.now();
  pdf = await renderReportPdf(input);
  times.push(performance.now() - t0);
}
writeFileSync(out, pdf);
times.sort((a, b) => a - b);
const median = times[times.length >> 1];
console.log(`${out}: ${(pdf.length / 1024).toFixed(0)} KiB; render median ${median.toFixed(0)} ms over ${repeat} (min ${times[0].toFixed(0)}, max ${times[times.length - 1].toFixed(0)})`);
