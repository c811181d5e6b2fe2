/**
 * Worker memory on a large run, through the real API, queue and a worker process: 60 shots × 48
 * receivers on a 2 000 × 1 000 grid (2 M nodes, the largest allowed). Prints the run's wall time
 * and the worker's peak resident memory (VmHWM from /proc, Linux only). --json: one JSON object.
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { dataSource } from '../server/db/dataSource';
import { importPicks } from '../server/services/importPicks';
import { saveModelVersion } from '../server/services/models';
import { signedInAgent, startTestApp } from '../tests/api/support/app';
import { startWorker, waitFor } from '../tests/api/support/worker';
import { emailOf, PASSWORD, resetWorld } from '../tests/api/support/world';

const SHOTS = 60;
const t = await startTestApp();
const world = await resetWorld();
await t.queue.obliterate({ force: true });
const worker = startWorker('bench-memory');
const geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);

// Invented two-layer ground, 0.1 m nodes over 200 m × 100 m.
const model = {
  format: 'timefield-model/1',
  grid: { x0: 0, dx: 0.1, nx: 2000, z0: 0, dz: 0.1, nz: 1000 },
  layers: [
    { name: 'overburden', base: [[0, -8], [199.9, -12]], v_top: 600, v_base: 900 },
    { name: 'rock', v_top: 3000, v_base: 3500 },
  ],
};
const { id: modelId } = await saveModelVersion(world.users.geophysicist.id, world.projectA.id, world.lineA.id, model, { name: 'bench-memory', comment: '', basedOn: null });
const rows = ['shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms'];
for (let s = 0; s < SHOTS; s++) for (let r = 0; r < 48; r++) rows.push(`M${s},${(s * 3.3 + 1).toFixed(1)},,${r * 4 + 2},,${(Math.abs(r * 4 + 2 - (s * 3.3 + 1)) / 1.2 + 1).toFixed(2)},0.5`);
const { id: pickSetId } = await importPicks(world.users.field_tech.id, world.projectA.id, world.lineA.id, 'bench-memory.picks.csv', Buffer.from(rows.join('\n')));

const t0 = performance.now();
const id = (await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId, pickSetId, order: 2 }).expect(202)).body.id;
await waitFor(async () => {
  const [r] = await dataSource.query('SELECT status, error FROM runs WHERE id = $1', [id]);
  if (r.status === 'failed') throw new Error(r.error);
  return r.status === 'done' ? true : undefined;
}, 900_000, `run ${id}`);
const seconds = (performance.now() - t0) / 1000;
const status = readFileSync(`/proc/${worker.child.pid}/status`, 'utf8');
const peakMb = Number(/VmHWM:\s+(\d+) kB/.exec(status)?.[1] ?? NaN) / 1024;
const [{ mb }] = await dataSource.query('SELECT round(sum(length(data)) / 1048576.0, 1)::float AS mb FROM run_fields WHERE run_id = $1', [id]);
const out = { case: `run-${SHOTS}x48-2000x1000`, seconds: +seconds.toFixed(1), worker_peak_rss_mb: Math.round(peakMb), stored_fields_mb: mb };
console.log(process.argv.includes('--json') ? JSON.stringify(out) : Object.entries(out).map(([k, v]) => `${k}=${v}`).join('  '));
await worker.stop();
await t.close();
process.exit(0);
