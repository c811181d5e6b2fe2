/**
 * Upload benchmark: a 100 000-pick file (100 shots × 1000 receivers, invented) posted to
 * POST /api/lines/:lineId/picksets through the real app, parsed, checked and stored.
 * Prints the median of 5 runs; with --json one JSON object per line.
 */
import { performance } from 'node:perf_hooks';
import { signedInAgent, startTestApp } from '../tests/api/support/app';
import { emailOf, PASSWORD, resetWorld } from '../tests/api/support/world';

const SHOTS = 100;
const RECEIVERS = 1000;
const RUNS = 5;
const json = process.argv.includes('--json');

function makeFile(): Buffer {
  const rows = ['shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms'];
  for (let s = 0; s < SHOTS; s++) {
    const sx = s * 10 + 1.25;
    for (let r = 0; r < RECEIVERS; r++) {
      const rx = r * 1;
      rows.push(`S${s},${sx},,${rx},,${((Math.abs(rx - sx) / 1500) * 1000 + 0.5).toFixed(3)},0.5`);
    }
  }
  return Buffer.from(rows.join('\n') + '\n');
}

const t = await startTestApp();
const world = await resetWorld();
const tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
const file = makeFile();
const seconds: number[] = [];
for (let i = 0; i < RUNS; i++) {
  const start = performance.now();
  const res = await tech.post(`/api/lines/${world.lineA.id}/picksets`).set('X-CSRF-Token', tech.csrf).attach('file', file, 'bench.picks.csv');
  seconds.push((performance.now() - start) / 1000);
  if (res.status !== 201 || res.body.picks !== SHOTS * RECEIVERS) throw new Error(`upload failed: ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`);
}
seconds.sort((a, b) => a - b);
const median = seconds[Math.floor(RUNS / 2)];
const result = { case: 'upload-100000-picks', picks: SHOTS * RECEIVERS, bytes: file.length, runs: RUNS, median_seconds: Number(median.toFixed(3)), max_seconds: Number(seconds.at(-1)!.toFixed(3)) };
console.log(json ? JSON.stringify(result) : `100 000-pick upload (${(file.length / 1048576).toFixed(1)} MB): median ${result.median_seconds} s, slowest ${result.max_seconds} s over ${RUNS} runs`);
await t.close();
