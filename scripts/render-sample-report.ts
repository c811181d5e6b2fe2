/**
 * `npx tsx scripts/render-sample-report.ts OUT.pdf [--demo | --inversion] [--repeat N]`
 * Writes a sample PDF summary from the invented report fixture (small, or the demo-sized line
 * TQ-L1 with --demo, or the inversion report of an invented survey with --inversion) for looking
 * at, and prints how long rendering took (median of N renders; the fixture's solves are not counted).
 */
import { writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { demoReportInput } from '../fixtures/report/demo';
import { smallInversionReportInput } from '../fixtures/report/inversion';
import { smallReportInput } from '../fixtures/report/small';
import { renderInversionReportPdf } from '../worker/report/inversion/render';
import { renderReportPdf } from '../worker/report/render';

const { values, positionals } = parseArgs({ allowPositionals: true, options: { demo: { type: 'boolean', default: false }, inversion: { type: 'boolean', default: false }, repeat: { type: 'string', default: '1' } } });
const out = positionals[0];
const repeat = Number(values.repeat);
if (!out || !Number.isInteger(repeat) || repeat < 1 || (values.demo && values.inversion)) {
  console.error('usage: npx tsx scripts/render-sample-report.ts OUT.pdf [--demo | --inversion] [--repeat N]');
  process.exit(2);
}
const render: () => Promise<Buffer> = values.inversion
  ? ((input) => () => renderInversionReportPdf(input))(smallInversionReportInput())
  : ((input) => () => renderReportPdf(input))(values.demo ? demoReportInput() : smallReportInput());
const wall: number[] = [];
const cpu: number[] = [];
let pdf: Buffer = Buffer.alloc(0);
for (let i = 0; i < repeat; i++) {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  pdf = await render();
  wall.push(performance.now() - t0);
  const c = process.cpuUsage(c0);
  cpu.push((c.user + c.system) / 1000);
}
writeFileSync(out, pdf);
// CPU time is reported beside wall time: on a shared machine the wall clock mostly measures the neighbours.
const summary = (v: number[]) => {
  const s = [...v].sort((a, b) => a - b);
  return `median ${s[s.length >> 1].toFixed(0)} ms (min ${s[0].toFixed(0)}, max ${s[s.length - 1].toFixed(0)})`;
};
console.log(`${out}: ${(pdf.length / 1024).toFixed(0)} KiB, ${repeat} render(s); first ${wall[0].toFixed(0)} ms wall / ${cpu[0].toFixed(0)} ms CPU`);
console.log(`  wall ${summary(wall)}`);
console.log(`  CPU  ${summary(cpu)}`);
