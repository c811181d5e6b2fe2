/**
 * Run benchmark through the real API, queue and a worker process:
 *  - demo-sized run: the demo line TQ-L1 (7 shots × 48 receivers, 526 × 101 grid), POST → done;
 *  - large run: 48 shots × 96 receivers on a 1000 × 200 grid (invented three-layer ground), POST → done;
 *  - fetching one shot's travel-time field for display.
 * Medians over a few repeats; --json prints one JSON object per case.
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { dataSource } from '../server/db/dataSource';
import { importPicks } from '../server/services/importPicks';
import { saveModelVersion } from '../server/services/models';
import { signedInAgent, startTestApp, type Agent } from '../tests/api/support/app';
import { startWorker, waitFor } from '../tests/api/support/worker';
import { emailOf, PASSWORD, resetWorld } from '../tests/api/support/world';

const json = process.argv.includes('--json');
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const report = (o: Record<string, unknown>) => console.log(json ? JSON.stringify(o) : Object.entries(o).map(([k, v]) => `${k}=${v}`).join('  '));

const t = await startTestApp();
const world = await resetWorld();
await t.queue.obliterate({ force: true });
const worker = startWorker('bench');
const geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);

async function timeRun(agent: Agent, modelId: string, pickSetId: string): Promise<{ seconds: number; id: string }> {
  const t0 = performance.now();
  const id = (await agent.post('/api/runs').set('X-CSRF-Token', agent.csrf).send({ modelId, pickSetId, order: 2 }).expect(202)).body.id;
  await waitFor(async () => {
    const [r] = await dataSource.query('SELECT status, error FROM runs WHERE id = $1', [id]);
    if (r.status === 'failed') throw new Error(r.error);
    return r.status === 'done' ? true : undefined;
  }, 300_000, `run ${id}`);
  return { seconds: (performance.now() - t0) / 1000, id };
}

// Demo-sized: the invented demo line's own files.
const demoModel = JSON.parse(readFileSync('fixtures/demo/tq-l1.model.json', 'utf8'));
const { id: demoModelId } = await saveModelVersion(world.users.geophysicist.id, world.projectA.id, world.lineA.id, demoModel, { name: 'demo', comment: '', basedOn: null });
const { id: demoPicks } = await importPicks(world.users.field_tech.id, world.projectA.id, world.lineA.id, 'tq-l1.picks.csv', readFileSync('fixtures/demo/tq-l1.picks.csv'));
await timeRun(geo, demoModelId, demoPicks); // warm-up: threads start, modules load
const demo: number[] = [];
let lastDemoRun = '';
for (let i = 0; i < 5; i++) {
  const r = await timeRun(geo, demoModelId, demoPicks);
  demo.push(r.seconds);
  lastDemoRun = r.id;
}
report({ case: 'run-demo-7x48-526x101', median_seconds: +median(demo).toFixed(3), runs: demo.length });

// One field fetch for display, as the results page does it.
const fetches: number[] = [];
for (let i = 0; i < 10; i++) {
  const t0 = performance.now();
  await geo.get(`/api/runs/${lastDemoRun}/fields/S${(i % 7) + 1}`).buffer(true).expect(200);
  fetches.push((performance.now() - t0) / 1000);
}
report({ case: 'field-fetch-526x101', median_seconds: +median(fetches).toFixed(4), runs: fetches.length });

// Large: 48 shots × 96 receivers at 2 m over 190 m, 1000 × 200 grid at 0.2 m (invented three-layer ground).
const big = {
  format: 'timefield-model/1',
  grid: { x0: -4.8, dx: 0.2, nx: 1000, z0: 0, dz: 0.2, nz: 200 },
  layers: [
    { name: 'soil', base: [[-4.8, -3], [195, -4]], v_top: 400, v_base: 700 },
    { name: 'weathered', base: [[-4.8, -12], [195, -16]], v_top: 1400, v_base: 2000 },
    { name: 'rock', v_top: 3500, v_base: 4000 },
  ],
};
const { id: bigModel } = await saveModelVersion(world.users.geophysicist.id, world.projectA.id, world.lineA.id, big, { name: 'bench-large', comment: '', basedOn: null });
const rows = ['shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms'];
for (let s = 0; s < 48; s++) for (let r = 0; r < 96; r++) rows.push(`B${s},${s * 4 + 1},,${r * 2},,${(Math.abs(r * 2 - (s * 4 + 1)) / 1.5 + 1).toFixed(2)},0.5`);
const { id: bigPicks } = await importPicks(world.users.field_tech.id, world.projectA.id, world.lineA.id, 'bench-large.picks.csv', Buffer.from(rows.join('\n')));
const large: number[] = [];
for (let i = 0; i < 3; i++) large.push((await timeRun(geo, bigModel, bigPicks)).seconds);
report({ case: 'run-48x96-1000x200', median_seconds: +median(large).toFixed(3), runs: large.length });

await worker.stop();
await t.close();
process.exit(0);
