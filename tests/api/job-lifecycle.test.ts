/**
 * The life of a job and its row (ARCHITECTURE.md: queued → running → done | failed | cancelled),
 * against real PostgreSQL, Redis and worker processes. Requirements from issue 16 items 3, 11, 14:
 * a job that fails for good leaves its row failed with the reason, rows whose job is gone are
 * found when a worker starts, an unreachable queue answers 503 at once and leaves no row, a
 * repeated submission with one Idempotency-Key makes one run, and a run has a cap on its shots.
 */
import { Worker } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { createRedis, QUEUE_NAME } from '../../server/queue/connection';
import { importPicks } from '../../server/services/importPicks';
import { MAX_SHOTS_PER_RUN } from '../../shared/limits';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { services } from './support/services';
import { startWorker, waitFor, type WorkerProcess } from './support/worker';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';


describe('job lifecycle', () => {
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

  const runRow = async (id: string) => (await dataSource.query('SELECT status, error FROM runs WHERE id = $1', [id]))[0];
  const insertRun = async (status: string, ageSeconds: number) =>
    (
      await dataSource.query(
        `INSERT INTO runs (line_id, model_id, pick_set_id, pick_set_revision, scheme_order, status, shots_total, created_at, started_at)
         VALUES ($1, $2, $3, 0, 2, $4, 2, now() - make_interval(secs => $5), CASE WHEN $4 = 'running' THEN now() - make_interval(secs => $5) END) RETURNING id`,
        [world.lineA.id, world.modelA, world.pickSetA, status, ageSeconds],
      )
    )[0].id as string;

  it('marks runs failed whose job failed for good or is gone, when a worker starts', async () => {
    // A run whose job BullMQ failed ("stalled more than allowable limit" after repeated kills)
    // while the database could not be told, and a run left running whose job vanished.
    const stalled = await insertRun('running', 120);
    const orphan = await insertRun('running', 120);
    const fresh = await insertRun('queued', 0); // its job may still be on its way: left alone
    await t.queue.add('solve', { runId: stalled }, { jobId: stalled });
    const failer = new Worker(QUEUE_NAME, async () => {
      throw new Error('job stalled more than allowable limit');
    }, { connection: createRedis({ forBullmq: true }), autorun: true });
    await waitFor(async () => ((await t.queue.getJob(stalled))?.failedReason ? true : undefined), 10_000, 'the job to fail');
    await failer.close();

    const worker = startWorker('reconciler');
    workers.push(worker);
    const a = await waitFor(async () => ((await runRow(stalled)).status === 'failed' ? runRow(stalled) : undefined), 30_000, 'the stalled run to be marked');
    expect(a.error).toMatch(/stopped responding/);
    const b = await waitFor(async () => ((await runRow(orphan)).status === 'failed' ? runRow(orphan) : undefined), 30_000, 'the orphaned run to be marked');
    expect(b.error).toMatch(/lost/);
    expect((await runRow(fresh)).status).toBe('queued');
    await dataSource.query('DELETE FROM runs WHERE id = $1', [fresh]);
    await worker.stop();
  }, 90_000);

  it('answers 503 within a few seconds while Redis is down, and keeps no run row', async () => {
    const before = (await dataSource.query('SELECT count(*)::int AS n FROM runs'))[0].n;
    services('stop_redis');
    try {
      const started = Date.now();
      const res = await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: world.modelA, pickSetId: world.pickSetA, order: 2 });
      expect(Date.now() - started).toBeLessThan(8000); // issue 16 item 11: "within a few seconds"
      expect(res.status).toBe(503);
      expect(res.body.error).toBe('queue_unavailable');
      expect((await dataSource.query('SELECT count(*)::int AS n FROM runs'))[0].n).toBe(before);
    } finally {
      services('start_redis');
    }
  }, 60_000);

  it('makes one run of three parallel submissions that share an Idempotency-Key', async () => {
    const send = () => geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).set('Idempotency-Key', 'form-submission-0001').send({ modelId: world.modelA, pickSetId: world.pickSetA, order: 2 });
    const before = (await dataSource.query('SELECT count(*)::int AS n FROM runs'))[0].n;
    const answers = await Promise.all([send(), send(), send()]);
    expect(answers.map((r) => r.status)).toEqual([202, 202, 202]);
    expect(new Set(answers.map((r) => r.body.id)).size).toBe(1);
    expect((await dataSource.query('SELECT count(*)::int AS n FROM runs'))[0].n).toBe(before + 1);
    expect(answers.filter((r) => r.headers['idempotent-replayed'] === 'true')).toHaveLength(2);
    // Another key is another submission.
    const other = await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).set('Idempotency-Key', 'form-submission-0002').send({ modelId: world.modelA, pickSetId: world.pickSetA, order: 2 });
    expect(other.body.id).not.toBe(answers[0].body.id);
  }, 30_000);

  it('makes one pick set of a pick upload repeated with its Idempotency-Key', async () => {
    const tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
    const upload = () => tech.post(`/api/lines/${world.lineA.id}/picksets`).set('X-CSRF-Token', tech.csrf).set('Idempotency-Key', 'upload-0001')
      .attach('file', Buffer.from('shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms\nA,0,,6,,10,0.5\n'), 'twice.picks.csv');
    const answers = await Promise.all([upload(), upload()]);
    expect(answers.map((r) => r.status)).toEqual([201, 201]);
    const [{ n }] = await dataSource.query(`SELECT count(*)::int AS n FROM pick_sets WHERE file_name = 'twice.picks.csv'`);
    expect(n).toBe(1);
  }, 30_000);

  it(`refuses a run of more than ${MAX_SHOTS_PER_RUN} shots before queuing`, async () => {
    const rows = ['shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms'];
    for (let s = 0; s <= MAX_SHOTS_PER_RUN; s++) rows.push(`S${s},${(s % 50) * 0.5},,12,,${(Math.abs(12 - (s % 50) * 0.5) / 0.6 + 0.1).toFixed(3)},0.5`);
    const { id: pickSetId } = await importPicks(world.users.field_tech.id, world.projectA.id, world.lineA.id, 'many-shots.picks.csv', Buffer.from(rows.join('\n')));
    const res = await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: world.modelA, pickSetId, order: 2 });
    expect(res.status).toBe(422);
    expect(res.body.error).toBe('too_many_shots');
  }, 30_000);
});
