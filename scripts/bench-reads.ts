/**
 * Read benchmark (issue 16, expensive reads): the median time of GET /api/picksets/:id on a
 * 200 000-pick set, GET /api/models/:id and GET /api/models/:id/grid on a 2 000 000-node model,
 * and the health latency while three of each heavy read run at once. Invented data.
 * `npm run bench:reads` (`--json` for one object per line).
 */
import { performance } from 'node:perf_hooks';
import { signedInAgent, startTestApp, binaryBody } from '../tests/api/support/app';
import { emailOf, PASSWORD, resetWorld } from '../tests/api/support/world';

const SHOTS = 200;
const RECEIVERS = 1000;
const RUNS = 5;
const json = process.argv.includes('--json');

function pickFile(): Buffer {
  const rows = ['shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms'];
  for (let s = 0; s < SHOTS; s++) {
    const sx = s * 5 + 0.5;
    for (let r = 0; r < RECEIVERS; r++) rows.push(`S${s},${sx},,${r},,${((Math.abs(r - sx) / 1500) * 1000 + 0.5).toFixed(3)},0.5`);
  }
  return Buffer.from(rows.join('\n') + '\n');
}
// 2000 × 1000 = 2 000 000 nodes at 0.5 m.
const bigModel = {
  format: 'timefield-model/1',
  grid: { x0: 0, dx: 0.5, nx: 2000, z0: 100, dz: 0.5, nz: 1000 },
  layers: [{ base: [[0, 90], [999.5, 80]], v_top: 400, v_base: 800 }, { v_top: 2500, v_base: 4000 }],
};

const t = await startTestApp();
const world = await resetWorld();
const tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
const geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
const stations = Array.from({ length: RECEIVERS }, (_, i) => ({ station: i + 1, x: i, z: 100 }));
await tech.put(`/api/lines/${world.lineA.id}/stations`).set('X-CSRF-Token', tech.csrf).send(stations).expect(200);
const up = await tech.post(`/api/lines/${world.lineA.id}/picksets`).set('X-CSRF-Token', tech.csrf).attach('file', pickFile(), 'bench.picks.csv');
if (up.status !== 201) throw new Error(`upload failed: ${up.status}`);
const saved = await geo.post(`/api/lines/${world.lineA.id}/models`).set('X-CSRF-Token', geo.csrf).send(bigModel);
if (saved.status !== 201) throw new Error(`model save failed: ${saved.status} ${JSON.stringify(saved.body).slice(0, 300)}`);

// The client runs in this process too: responses are collected as bytes, never parsed, so the
// timings and the health latency measure the server's work, not the test client's JSON.parse.
const raw = (url: string) => geo.get(url).buffer(true).parse(binaryBody).expect(200);
const reads = {
  pickset: () => raw(`/api/picksets/${up.body.id}`),
  model: () => raw(`/api/models/${saved.body.id}`),
  grid: () => raw(`/api/models/${saved.body.id}/grid`),
};
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const timed = async (f: () => PromiseLike<unknown>) => {
  const s = performance.now();
  await f();
  return performance.now() - s;
};

const results: Record<string, unknown>[] = [];
for (const [name, f] of Object.entries(reads)) {
  const ms: number[] = [];
  for (let i = 0; i < RUNS; i++) ms.push(await timed(f));
  results.push({ case: `read-${name}`, runs: RUNS, first_ms: Math.round(ms[0]), median_ms: Math.round(median(ms)), max_ms: Math.round(Math.max(...ms)) });
}
// Health while three of each heavy read are in flight: sample health every 50 ms until they finish.
const health: number[] = [];
let busy = true;
const heavy = Promise.all([...Array(3)].flatMap(() => [reads.pickset(), reads.model(), reads.grid()])).finally(() => (busy = false));
while (busy) {
  health.push(await timed(() => geo.get('/api/health')));
  await new Promise((r) => setTimeout(r, 50));
}
await heavy;
results.push({ case: 'health-during-9-heavy-reads', samples: health.length, median_ms: Math.round(median(health)), max_ms: Math.round(Math.max(...health)) });
for (const r of results) console.log(json ? JSON.stringify(r) : Object.entries(r).map(([k, v]) => `${k}=${v}`).join(' '));
await t.close();
