/**
 * The demo line's inversion end to end through the real API, queue and a worker process
 * (issue 11 target: POST → done under 15 s on the 2-core machine): the invented line TQ-L1's
 * stations and picks, automatic gradient start, default settings. Median of a few repeats, with the
 * worker's own split (forward solves and rays, matrix build, LSQR). --json prints one JSON object.
 * Run with `npm run bench:invert:queue` (starts the test services, scripts/bench-services.sh).
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { dataSource } from '../server/db/dataSource';
import { importPicks } from '../server/services/importPicks';
import { replaceStations } from '../server/services/stations';
import { SurveyLine } from '../server/entities';
import { parseStationCsv } from '../shared/stations';
import { signedInAgent, startTestApp } from '../tests/api/support/app';
import { startWorker, waitFor } from '../tests/api/support/worker';
import { emailOf, PASSWORD, resetWorld } from '../tests/api/support/world';

const json = process.argv.includes('--json');
const REPEATS = 3;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

const t = await startTestApp();
const world = await resetWorld();
await t.queue.obliterate({ force: true });
const worker = startWorker('bench-invert');
const geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);

const lines = dataSource.getRepository(SurveyLine);
const line = await lines.save(lines.create({ projectId: world.projectA.id, name: 'TQ-L1 (bench)' }));
const stations = parseStationCsv(readFileSync('fixtures/demo/tq-l1.stations.csv', 'utf8'));
if (!stations.ok) throw new Error('the demo stations do not parse');
await replaceStations(world.users.geophysicist.id, world.projectA.id, line.id, stations.stations);
const { id: pickSetId } = await importPicks(world.users.field_tech.id, world.projectA.id, line.id, 'tq-l1.picks.csv', readFileSync('fixtures/demo/tq-l1.picks.csv'));

const seconds: number[] = [];
let last: Record<string, unknown> = {};
for (let i = 0; i < REPEATS; i++) {
  const t0 = performance.now();
  const id = (await geo.post('/api/inversions').set('X-CSRF-Token', geo.csrf).send({ pickSetId, start: { kind: 'gradient' } }).expect(202)).body.id;
  await waitFor(async () => {
    const [r] = await dataSource.query('SELECT status, error FROM inversions WHERE id = $1', [id]);
    if (r.status === 'failed') throw new Error(r.error);
    return r.status === 'done' ? true : undefined;
  }, 300_000, `inversion ${id}`);
  seconds.push((performance.now() - t0) / 1000);
  last = (await geo.get(`/api/inversions/${id}`).expect(200)).body;
}
const stats = last.stats as { chi2: number; iterations: number; stopReason: string; picks: number; shots: number; timings: Record<string, number> };
const grid = last.grid as { nx: number; nz: number };
const out = {
  case: 'demo-line-through-queue', shots: stats.shots, picks: stats.picks, nx: grid.nx, nz: grid.nz,
  iterations: stats.iterations, stop: stats.stopReason, chi2: +stats.chi2.toFixed(3),
  median_seconds: +median(seconds).toFixed(2), runs_seconds: seconds.map((s) => +s.toFixed(2)),
  worker_split_seconds: stats.timings,
};
console.log(json ? JSON.stringify(out) : Object.entries(out).map(([k, v]) => `${k}=${typeof v === 'object' ? JSON.stringify(v) : v}`).join('  '));
await worker.stop();
await t.close();
process.exit(0); // an idle read-pool thread or queue connection must not keep the benchmark alive
