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

  it('then gets a finished run and a report taken through the whole review by the same worker (issue 17 item 2), once', async () => {
    const finish = () => spawnSync(process.execPath, ['--import', 'tsx', 'scripts/demo-finish.ts'], {
      env: { ...process.env, HOST: '127.0.0.1', TRUST_PROXY: '', TF_DEMO: '' }, encoding: 'utf8', timeout: 300_000,
    });
    const first = finish();
    expect(first.status, `${first.stdout}${first.stderr}${worker?.output.join('')}`).toBe(0);
    expect(first.stdout).toMatch(/demo run done[\s\S]*demo report submitted[\s\S]*demo report approved[\s\S]*demo report shared/);
    const runs = await dataSource.query(`SELECT r.id, r.status FROM runs r JOIN survey_lines l ON l.id = r.line_id WHERE l.name = 'TQ-L1'`);
    expect(runs).toEqual([{ id: expect.any(String), status: 'done' }]);
    const reports = await dataSource.query(`SELECT id, status, reviewed_by IS NOT NULL AS reviewed, approved_pdf IS NOT NULL AS pdf FROM reports WHERE run_id = $1`, [runs[0].id]);
    expect(reports).toEqual([{ id: expect.any(String), status: 'shared', reviewed: true, pdf: true }]);
    const steps = await dataSource.query(`SELECT action FROM audit_log WHERE object_id = $1 ORDER BY id`, [reports[0].id]);
    expect(steps.map((r: { action: string }) => r.action)).toEqual(expect.arrayContaining(['report.submit', 'report.approve', 'report.share']));

    const again = finish();
    expect(again.status, again.stderr).toBe(0);
    expect(again.stdout).not.toMatch(/queued|started|submitted|approved|shared\b(?! report)/);
    expect(await dataSource.query(`SELECT id FROM reports WHERE run_id = $1`, [runs[0].id])).toHaveLength(1);
  }, 360_000);
});
