/**
 * Issue 11 item 8: "the demo scenario: the demo line gets one finished inversion from the automatic
 * start". The seed (as `npm start` runs it) queues it once and exits; a real worker makes it.
 */
import { spawnSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { startTestApp, type TestApp } from './support/app';
import { startWorker, waitFor, type WorkerProcess } from './support/worker';
import { resetWorld } from './support/world';

const seed = () => spawnSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts', '--only-in-demo-mode'], {
  env: { ...process.env, HOST: '127.0.0.1', TRUST_PROXY: '', TF_DEMO: '' }, encoding: 'utf8', timeout: 60_000,
});

describe('the demo line’s inversion', () => {
  let t: TestApp;
  let worker: WorkerProcess | undefined;
  beforeAll(async () => {
    t = await startTestApp();
    await resetWorld();
    await t.queue.obliterate({ force: true });
  });
  afterAll(async () => {
    await worker?.stop();
    await t?.close();
  });

  const demoInversions = () => dataSource.query(
    `SELECT i.id, i.status, i.start_kind, i.stats, i.error FROM inversions i JOIN survey_lines l ON l.id = i.line_id WHERE l.name = 'TQ-L1'`,
  );

  it('is queued once by the seed, which exits, and made by the worker from the automatic start', async () => {
    const first = seed();
    expect(first.status, first.stderr).toBe(0);
    expect(first.stdout).toMatch(/demo inversion queued/);
    const [queued] = await demoInversions();
    expect(queued).toMatchObject({ status: 'queued', start_kind: 'gradient' });
    expect((await t.queue.getJob(queued.id))?.name).toBe('invert');

    const again = seed();
    expect(again.status, again.stderr).toBe(0);
    expect(again.stdout).not.toMatch(/demo inversion queued/);
    expect(await demoInversions()).toHaveLength(1);

    worker = startWorker('demo');
    const [done] = await waitFor(async () => {
      const rows = await demoInversions();
      return ['done', 'failed'].includes(rows[0].status) ? rows : undefined;
    }, 120_000, 'the demo inversion');
    expect(done.status, `${done.error} ${worker.output.join('')}`).toBe('done');
    expect(done.stats.picks).toBe(336); // every pick of fixtures/demo/tq-l1.picks.csv
    expect(done.stats.shots).toBe(7);
    const [{ n }] = await dataSource.query('SELECT count(*)::int AS n FROM inversion_iterations WHERE inversion_id = $1', [done.id]);
    expect(n).toBe(done.stats.iterations + 1);
  }, 180_000);
});
