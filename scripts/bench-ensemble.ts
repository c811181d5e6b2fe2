/**
 * Ensembles over the queue (issue 20), through the real API, queue and worker processes:
 *  1. the demo line TQ-L1 (stations, picks, automatic start, default settings): one inversion with
 *     one worker on every core, then the same ensemble (24 members, fixed seed) with 1, 2 and 4
 *     worker processes of one solver thread each; prints each wall time (POST → combined), the
 *     speed-up over 1 process and the ratio to the one inversion;
 *  2. peak memory of a worker process (VmHWM, Linux) running members on a 1000 × 200 grid.
 * Options: --members N, --processes 1,2,4, --no-memory, --json (one JSON object per line).
 * Run with `npm run bench:ensemble` (starts the test services, scripts/bench-services.sh).
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { dataSource } from '../server/db/dataSource';
import { importPicks } from '../server/services/importPicks';
import { saveModelVersion } from '../server/services/models';
import { replaceStations } from '../server/services/stations';
import { SurveyLine } from '../server/entities';
import { parseStationCsv } from '../shared/stations';
import { signedInAgent, startTestApp, type Agent } from '../tests/api/support/app';
import { gradientPicks, range } from '../tests/api/support/inversion-data';
import { startWorker, waitFor, type WorkerProcess } from '../tests/api/support/worker';
import { emailOf, PASSWORD, resetWorld } from '../tests/api/support/world';

const argv = process.argv.slice(2);
const option = (name: string) => (argv.includes(name) ? argv[argv.indexOf(name) + 1] : undefined);
const json = argv.includes('--json');
const MEMBERS = Number(option('--members') ?? 24);
const PROCESSES = (option('--processes') ?? '1,2,4').split(',').map(Number);
const print = (out: Record<string, unknown>) =>
  console.log(json ? JSON.stringify(out) : Object.entries(out).map(([k, v]) => `${k}=${typeof v === 'object' ? JSON.stringify(v) : v}`).join('  '));
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)];

const t = await startTestApp();
const world = await resetWorld();
await t.queue.obliterate({ force: true });
const geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);

/** Waits for the row to settle; an inversion must finish, an ensemble may fail (too few members fit) and says so. */
async function until(table: 'inversions' | 'ensembles', id: string): Promise<string> {
  return waitFor(async () => {
    const [r] = await dataSource.query(`SELECT status, error FROM ${table} WHERE id = $1`, [id]);
    if (table === 'inversions' && (r.status === 'failed' || r.status === 'cancelled')) throw new Error(`${table} ${id}: ${r.status} ${r.error ?? ''}`);
    return r.status === 'queued' || r.status === 'running' ? undefined : (r.status as string);
  }, 3_600_000, `${table} ${id}`);
}

async function timedInversion(agent: Agent, body: object): Promise<{ id: string; seconds: number }> {
  const t0 = performance.now();
  const id = (await agent.post('/api/inversions').set('X-CSRF-Token', agent.csrf).send(body).expect(202)).body.id;
  await until('inversions', id);
  return { id, seconds: (performance.now() - t0) / 1000 };
}

async function timedEnsemble(inversionId: string, body: object): Promise<{ id: string; seconds: number; status: string }> {
  const t0 = performance.now();
  const id = (await geo.post(`/api/inversions/${inversionId}/ensembles`).set('X-CSRF-Token', geo.csrf).send(body).expect(202)).body.id;
  const status = await until('ensembles', id);
  return { id, seconds: (performance.now() - t0) / 1000, status };
}

const withWorkers = async <T>(count: number, threads: string | undefined, work: (workers: WorkerProcess[]) => Promise<T>): Promise<T> => {
  const workers = range(1, count, 1).map((k) => startWorker(`bench-ensemble-${k}`, threads ? { WORKER_THREADS: threads } : {}));
  try {
    return await work(workers);
  } finally {
    await Promise.all(workers.map((w) => w.stop()));
  }
};

// 1. The demo line.
const lines = dataSource.getRepository(SurveyLine);
const line = await lines.save(lines.create({ projectId: world.projectA.id, name: 'TQ-L1 (bench)' }));
const stations = parseStationCsv(readFileSync('fixtures/demo/tq-l1.stations.csv', 'utf8'));
if (!stations.ok) throw new Error('the demo stations do not parse');
await replaceStations(world.users.geophysicist.id, world.projectA.id, line.id, stations.stations);
const { id: pickSetId } = await importPicks(world.users.field_tech.id, world.projectA.id, line.id, 'tq-l1.picks.csv', readFileSync('fixtures/demo/tq-l1.picks.csv'));

const base = await withWorkers(1, undefined, async () => {
  const runs = [];
  for (let i = 0; i < 3; i++) runs.push(await timedInversion(geo, { pickSetId, start: { kind: 'gradient' } }));
  return { id: runs.at(-1)!.id, seconds: median(runs.map((r) => r.seconds)) };
});
const [baseStats] = await dataSource.query('SELECT stats FROM inversions WHERE id = $1', [base.id]);
print({ case: 'demo-line-one-inversion', worker_threads: 'all', median_seconds: +base.seconds.toFixed(2), iterations: baseStats.stats.iterations, chi2: +baseStats.stats.chi2.toFixed(3) });

let oneProcess = Number.NaN;
for (const processes of PROCESSES) {
  const run = await withWorkers(processes, '1', () => timedEnsemble(base.id, { members: MEMBERS, seed: 20261205 }));
  if (processes === 1) oneProcess = run.seconds;
  const [e] = await dataSource.query('SELECT stats FROM ensembles WHERE id = $1', [run.id]);
  const members = await dataSource.query(`SELECT worker, iterations, seconds FROM ensemble_members WHERE ensemble_id = $1 AND status = 'done'`, [run.id]);
  const [r] = await dataSource.query('SELECT bands FROM ensemble_results WHERE ensemble_id = $1', [run.id]);
  const widths = ((r?.bands ?? []) as { p5: number | null; p95: number | null }[]).filter((b) => b.p5 !== null).map((b) => b.p95! - b.p5!);
  print({
    case: `demo-line-ensemble-${MEMBERS}`,
    processes,
    status: run.status,
    seconds: +run.seconds.toFixed(1),
    speedup_over_1: +(oneProcess / run.seconds).toFixed(2),
    times_one_inversion: +(run.seconds / base.seconds).toFixed(1),
    used: e.stats.used,
    excluded: e.stats.excluded,
    median_member_seconds: +median(members.map((m: { seconds: number }) => m.seconds)).toFixed(2),
    median_member_iterations: median(members.map((m: { iterations: number }) => m.iterations)),
    workers: new Set(members.map((m: { worker: string }) => m.worker)).size,
    median_band_width_m: widths.length ? +median(widths).toFixed(2) : null,
  });
}

// 2. Memory of a worker process on a 1000 × 200 grid (1 m nodes): a start model of the gradient
// v = 500 + 20·depth, picks of 24 shots into 100 geophones from the exact diving-wave time.
if (!argv.includes('--no-memory')) {
  const big = await lines.save(lines.create({ projectId: world.projectA.id, name: 'memory line' }));
  const model = { format: 'timefield-model/1', grid: { x0: 0, dx: 1, nx: 1000, z0: 0, dz: 1, nz: 200 }, layers: [{ name: 'gradient', v_top: 500, v_base: 500 + 20 * 199 }] };
  const { id: modelId } = await saveModelVersion(world.users.geophysicist.id, world.projectA.id, big.id, model, { name: 'memory start', comment: '', basedOn: null });
  const survey = gradientPicks({ v0: 500, k: 20, shotXs: range(0, 990, 43), receiverXs: range(0, 990, 10), sigmaMs: 1 });
  const { id: bigPicks } = await importPicks(world.users.field_tech.id, world.projectA.id, big.id, 'memory.picks.csv', Buffer.from(survey.csv));
  await withWorkers(1, '1', async ([worker]) => {
    const inversion = await timedInversion(geo, { pickSetId: bigPicks, start: { kind: 'model', modelId }, settings: { maxIterations: 4 } });
    const ensemble = await timedEnsemble(inversion.id, { members: 2, seed: 1, vary: { start: false, smoothing: true, picks: 'sigma' } });
    // A member taken over (its lock lost while the worker was busy) shows as a second attempt.
    const [{ attempts }] = await dataSource.query('SELECT max(attempts)::int AS attempts FROM ensemble_members WHERE ensemble_id = $1', [ensemble.id]);
    const status = readFileSync(`/proc/${worker.child.pid}/status`, 'utf8');
    const peakMb = Number(/VmHWM:\s+(\d+) kB/.exec(status)?.[1] ?? NaN) / 1024;
    print({ case: 'worker-memory-1000x200', worker_threads: 1, inversion_seconds: +inversion.seconds.toFixed(1), ensemble_2_members_seconds: +ensemble.seconds.toFixed(1), ensemble_status: ensemble.status, member_max_attempts: attempts, worker_peak_rss_mb: Math.round(peakMb) });
  });
}
await t.close();
process.exit(0); // an idle read-pool thread or queue connection must not keep the benchmark alive
