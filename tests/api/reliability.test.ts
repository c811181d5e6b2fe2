/**
 * Reliability of the run pipeline with real processes: a worker killed mid-run, two workers sharing
 * the queue, and PostgreSQL and Redis restarted under a running app.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { importPicks } from '../../server/services/importPicks';
import { saveModelVersion } from '../../server/services/models';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { services } from './support/services';
import { startWorker, waitFor, type WorkerProcess } from './support/worker';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

/** A run that takes seconds: `shots` shots over a 1601 × 241 grid (invented test data). */
async function heavyInputs(world: World, shots = 24) {
  const model = { format: 'timefield-model/1', grid: { x0: 0, dx: 0.25, nx: 1601, z0: 0, dz: 0.25, nz: 241 }, layers: [{ name: 'ground', v_top: 1500, v_base: 1500 }] };
  const { id: modelId } = await saveModelVersion(world.users.geophysicist.id, world.projectA.id, world.lineA.id, model, { name: `heavy-${shots}`, comment: '', basedOn: null });
  const rows = ['shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms'];
  for (let s = 0; s < shots; s++) for (let r = 0; r < 60; r++) rows.push(`S${s},${s * 16 + 8},,${r * 6.5 + 4},,${((Math.abs(r * 6.5 + 4 - (s * 16 + 8)) / 1500) * 1000 + 0.01).toFixed(3)},0.5`);
  const { id: pickSetId } = await importPicks(world.users.field_tech.id, world.projectA.id, world.lineA.id, `heavy-${shots}.picks.csv`, Buffer.from(rows.join('\n')));
  return { modelId, pickSetId, picks: shots * 60, shots };
}


describe('run pipeline reliability', () => {
  let t: TestApp;
  let world: World;
  let geo: Agent;
  const workers: WorkerProcess[] = [];
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    await t.queue.obliterate({ force: true });
    geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
  });
  afterAll(async () => {
    await Promise.all(workers.map((w) => w.stop()));
    await t?.close();
  });

  const runRow = async (id: string) => (await dataSource.query('SELECT status, shots_done, shots_total, attempts, error FROM runs WHERE id = $1', [id]))[0];
  const start = async (body: object) => (await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send(body).expect(202)).body.id as string;

  it('finishes a run whose worker was killed mid-solve, with exactly one set of residuals', async () => {
    const inputs = await heavyInputs(world);
    const first = startWorker('first');
    workers.push(first);
    const id = await start({ modelId: inputs.modelId, pickSetId: inputs.pickSetId, order: 2 });
    await waitFor(async () => ((await runRow(id)).shots_done >= 2 ? true : undefined), 60_000, 'two shots solved');
    expect((await runRow(id)).status).toBe('running');
    await first.stop('SIGKILL');

    const second = startWorker('second');
    workers.push(second);
    const row = await waitFor(async () => {
      const r = await runRow(id);
      return ['done', 'failed', 'cancelled'].includes(r.status) ? r : undefined;
    }, 90_000, 'the run to finish after the restart');
    expect(row.status, `${row.error} ${second.output.join('')}`).toBe('done');
    expect(row.attempts).toBeGreaterThanOrEqual(2);
    const [{ n }] = await dataSource.query('SELECT count(*)::int AS n FROM run_residuals WHERE run_id = $1', [id]);
    expect(n).toBe(inputs.picks);
    const [{ fields }] = await dataSource.query('SELECT count(*)::int AS fields FROM run_fields WHERE run_id = $1', [id]);
    expect(fields).toBe(inputs.shots);
    await second.stop();
  }, 180_000);

  it('shares the queue between two worker processes: every run done, both took some', async () => {
    const a = startWorker('worker-a');
    const b = startWorker('worker-b');
    workers.push(a, b);
    const inputs = await heavyInputs(world, 8);
    const ids: string[] = [];
    for (let i = 0; i < 4; i++) ids.push(await start({ modelId: inputs.modelId, pickSetId: inputs.pickSetId, order: 1 }));
    for (const id of ids) {
      await waitFor(async () => ((await runRow(id)).status === 'done' ? true : undefined), 120_000, `run ${id}`);
    }
    const takers = await Promise.all(ids.map(async (id) => (await t.queue.getJob(id))?.processedBy));
    expect(new Set(takers)).toEqual(new Set(['worker-a', 'worker-b']));
    await Promise.all([a.stop(), b.stop()]);
  }, 240_000);

  it('recovers from a PostgreSQL restart and a Redis restart without restarting itself', async () => {
    const worker = startWorker('after-restarts');
    workers.push(worker);
    await waitFor(async () => ((await request(t.app).get('/api/health')).status === 200 ? true : undefined), 20_000, 'a healthy start');

    services('stop_postgres', 'start_postgres');
    services('stop_redis', 'start_redis');
    // The worker's heartbeat key went with Redis; it comes back on the next beat.
    const health = await waitFor(async () => {
      const res = await request(t.app).get('/api/health');
      return res.status === 200 ? res.body : undefined;
    }, 30_000, 'health to be ok again');
    expect(health).toEqual({ db: 'ok', redis: 'ok', worker: 'ok' });

    // Sessions live in PostgreSQL: a fresh sign-in works, and so does a whole run.
    const agent = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
    const id = (await agent.post('/api/runs').set('X-CSRF-Token', agent.csrf).send({ modelId: world.modelA, pickSetId: world.pickSetA }).expect(202)).body.id;
    await waitFor(async () => ((await runRow(id)).status === 'done' ? true : undefined), 60_000, 'a run after the restarts');
  }, 120_000);
});
