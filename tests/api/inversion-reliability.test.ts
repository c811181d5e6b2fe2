/**
 * Issue 11 item 3: "a worker killed mid-inversion: the job is taken up again and finishes, with
 * exactly one result (resume from the last stored iteration or restart; no duplicates)". A real
 * worker is killed with SIGKILL after some iterations are stored; a second worker takes the job up
 * and goes on from the last stored iteration.
 */
import { Worker } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createRedis, QUEUE_NAME } from '../../server/queue/connection';
import { dataSource } from '../../server/db/dataSource';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { flatStations, gradientPicks, range } from './support/inversion-data';
import { startWorker, waitFor, type WorkerProcess } from './support/worker';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

describe('inversion reliability', () => {
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

  const row = async (id: string) => (await dataSource.query('SELECT status, attempts, error FROM inversions WHERE id = $1', [id]))[0];
  const iterations = async (id: string): Promise<{ iteration: number; chi2: number }[]> =>
    dataSource.query('SELECT iteration, chi2 FROM inversion_iterations WHERE inversion_id = $1 ORDER BY iteration', [id]);

  it('finishes an inversion whose worker was killed, going on from its last stored iteration, with one result', async () => {
    const receivers = range(0, 48, 1);
    const line = (await geo.post(`/api/projects/${world.projectA.id}/lines`).set('X-CSRF-Token', geo.csrf).send({ name: 'kill line' }).expect(201)).body.id;
    await geo.put(`/api/lines/${line}/stations`).set('X-CSRF-Token', geo.csrf).send(flatStations(receivers)).expect(200);
    // Picks stated ten times more certain than their noise: the misfit stays above its target, so
    // the automatic schedule runs many steps (invented data: a 500 m/s + 20 /s gradient).
    const survey = gradientPicks({ v0: 500, k: 20, shotXs: range(0, 48, 6), receiverXs: receivers, sigmaMs: 0.05, noise: 10 });
    const pickSetId = (await geo.post(`/api/lines/${line}/picksets`).set('X-CSRF-Token', geo.csrf).attach('file', Buffer.from(survey.csv), 'kill.picks.csv').expect(201)).body.id;

    const first = startWorker('first');
    workers.push(first);
    const id = (await geo.post('/api/inversions').set('X-CSRF-Token', geo.csrf)
      .send({ pickSetId, start: { kind: 'gradient', spacing: 0.25 }, settings: { maxIterations: 40 } }).expect(202)).body.id;
    await waitFor(async () => ((await iterations(id)).length >= 3 ? true : undefined), 120_000, 'three stored iterations');
    await first.stop('SIGKILL');
    const before = await iterations(id);
    expect((await row(id)).status, 'still running when killed').toBe('running');

    const second = startWorker('second');
    workers.push(second);
    const done = await waitFor(async () => {
      const r = await row(id);
      return ['done', 'failed', 'cancelled'].includes(r.status) ? r : undefined;
    }, 180_000, 'the inversion to finish after the restart');
    expect(done.status, `${done.error} ${second.output.join('')}`).toBe('done');
    expect(done.attempts).toBe(2);

    const after = await iterations(id);
    // Iterations 0, 1, 2, … once each (the table's key would refuse a second row), and those of the
    // killed attempt kept as they were: the second attempt went on from them instead of starting over.
    expect(after.map((r) => r.iteration)).toEqual(range(0, after.length - 1, 1));
    expect(after.slice(0, before.length)).toEqual(before);
    expect(after.length).toBeGreaterThan(before.length);
    const [{ results }] = await dataSource.query('SELECT count(*)::int AS results FROM inversion_results WHERE inversion_id = $1', [id]);
    expect(results).toBe(1);
    const [{ residuals }] = await dataSource.query('SELECT count(*)::int AS residuals FROM inversion_residuals WHERE inversion_id = $1', [id]);
    expect(residuals).toBe(survey.picks);
    const view = (await geo.get(`/api/inversions/${id}`).expect(200)).body;
    expect(view.stats.iterations).toBe(after.at(-1)!.iteration);
    expect(view.history).toHaveLength(after.length);
    await second.stop();
  }, 300_000);

  it('marks inversions failed whose job failed for good or is gone, when a worker starts (as for runs)', async () => {
    const insert = async (status: string, ageSeconds: number) =>
      (await dataSource.query(
        `INSERT INTO inversions (line_id, pick_set_id, pick_set_revision, start_kind, start_spacing, grid, settings, status, shots, picks, created_at, started_at)
         VALUES ($1, $2, 0, 'gradient', 2.5, '{"x0":0,"dx":2.5,"nx":11,"z0":0,"dz":2.5,"nz":5}', '{}', $3, 2, 10, now() - make_interval(secs => $4), now() - make_interval(secs => $4)) RETURNING id`,
        [world.lineA.id, world.pickSetA, status, ageSeconds],
      ))[0].id as string;
    const stalled = await insert('running', 120);
    const orphan = await insert('running', 120);
    const fresh = await insert('queued', 0); // its job may still be on its way: left alone
    // A job that BullMQ failed for good (a worker killed again and again) while the row could not be told.
    await t.queue.add('invert', { inversionId: stalled }, { jobId: stalled });
    const failer = new Worker(QUEUE_NAME, async () => {
      throw new Error('job stalled more than allowable limit');
    }, { connection: createRedis({ forBullmq: true }), autorun: true });
    await waitFor(async () => ((await t.queue.getJob(stalled))?.failedReason ? true : undefined), 10_000, 'the job to fail');
    await failer.close();

    const worker = startWorker('reconciler');
    workers.push(worker);
    const a = await waitFor(async () => ((await row(stalled)).status === 'failed' ? row(stalled) : undefined), 30_000, 'the stalled inversion to be marked');
    expect(a.error).toMatch(/stopped responding/);
    const b = await waitFor(async () => ((await row(orphan)).status === 'failed' ? row(orphan) : undefined), 30_000, 'the orphaned inversion to be marked');
    expect(b.error).toMatch(/lost/);
    expect((await row(fresh)).status).toBe('queued');
    await worker.stop();
  }, 90_000);
});
