/**
 * Ensembles of inversions end to end (issue 20): the API refuses what cannot run, records the members
 * and queues one job each; two real worker processes share the members; the last one combines them.
 * A member whose worker is killed is taken over by the other; cancel stops every member.
 * Data: flat ground where v = v0 + k·depth, first arrivals from the exact diving-wave time
 * (tests/api/support/inversion-data.ts) plus Gaussian noise of the stated sigma. The depth of a
 * velocity v* in that ground is (v* − v0)/k exactly — the independent truth for the band.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import type { EnsembleMemberView, EnsembleSectionView, EnsembleView } from '../../shared/schemas/ensembles';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pageTexts } from '../unit/report/poppler';
import { binaryBody, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { flatStations, gradientPicks, range } from './support/inversion-data';
import { startWorker, waitFor, type WorkerProcess } from './support/worker';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

const V0 = 500;
const K = 20;
const RECEIVERS = range(0, 48, 2);
const NAMES = ['ensemble-w1', 'ensemble-w2'];
const ROCK = 600; // m/s: at (600 − 500)/20 = 5 m, where rays of offsets over ~33 m turn

describe('ensembles through the workers', () => {
  let t: TestApp;
  let world: World;
  let geo: Agent;
  let lead: Agent;
  let workers: WorkerProcess[] = [];
  let inversionId: string;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    await t.queue.obliterate({ force: true });
    geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
    lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
    const lineId = (await geo.post(`/api/projects/${world.projectA.id}/lines`).set('X-CSRF-Token', geo.csrf).send({ name: 'gradient line' }).expect(201)).body.id;
    await geo.put(`/api/lines/${lineId}/stations`).set('X-CSRF-Token', geo.csrf).send(flatStations(RECEIVERS)).expect(200);
    const survey = gradientPicks({ v0: V0, k: K, shotXs: [0, 12, 24, 36, 48], receiverXs: RECEIVERS, sigmaMs: 0.3 });
    const pickSetId = (await geo.post(`/api/lines/${lineId}/picksets`).set('X-CSRF-Token', geo.csrf).attach('file', Buffer.from(survey.csv), 'gradient.picks.csv').expect(201)).body.id;
    // One solver thread per worker process, as when many workers share a machine.
    workers = NAMES.map((name) => startWorker(name, { WORKER_THREADS: '1' }));
    inversionId = (await geo.post('/api/inversions').set('X-CSRF-Token', geo.csrf).send({ pickSetId, start: { kind: 'gradient' } }).expect(202)).body.id;
    await waitFor(async () => ((await geo.get(`/api/inversions/${inversionId}`)).body.status === 'done' ? true : undefined), 120_000, 'the base inversion');
  }, 180_000);
  afterAll(async () => {
    await Promise.all(workers.map((w) => w.stop()));
    await t?.close();
  });

  const view = async (id: string): Promise<EnsembleView> => (await geo.get(`/api/ensembles/${id}`).expect(200)).body;
  const finished = (id: string, timeoutMs = 240_000) =>
    waitFor(async () => {
      const v = await view(id);
      return ['done', 'failed', 'cancelled'].includes(v.status) ? v : undefined;
    }, timeoutMs, `ensemble ${id} to finish`);
  const start = (body: object) => geo.post(`/api/inversions/${inversionId}/ensembles`).set('X-CSRF-Token', geo.csrf).send(body);
  const logs = () => workers.map((w) => w.output.join('')).join('\n');

  it('refuses, before anything is queued, what cannot make a spread', async () => {
    const before = await t.queue.count();
    const one = await start({ members: 1 }).expect(400);
    expect(one.body.issues[0]).toMatchObject({ path: 'members' });
    const none = await start({ vary: { start: false, smoothing: false, picks: 'none' } }).expect(400);
    expect(none.body.issues[0].message).toMatch(/nothing varies/);
    const reversed = await start({ rockVelocity: 2000, rockVelocityMax: 1500 }).expect(400);
    expect(reversed.body.issues[0]).toMatchObject({ path: 'rockVelocityMax' });
    await start({ members: 300 }).expect(400);
    await start({ vary: { picks: 'jackknife' } }).expect(400);
    const [{ id: queued }] = await dataSource.query(
      `INSERT INTO inversions (line_id, pick_set_id, pick_set_revision, start_kind, start_spacing, grid, settings, status, shots, picks)
       SELECT line_id, pick_set_id, pick_set_revision, start_kind, start_spacing, grid, settings, 'failed', shots, picks FROM inversions WHERE id = $1 RETURNING id`,
      [inversionId],
    );
    const notDone = await geo.post(`/api/inversions/${queued}/ensembles`).set('X-CSRF-Token', geo.csrf).send({}).expect(409);
    expect(notDone.body.error).toBe('not_done');
    expect(await t.queue.count()).toBe(before);
    const [{ n }] = await dataSource.query('SELECT count(*)::int AS n FROM ensembles WHERE inversion_id = ANY($1::uuid[])', [[inversionId, queued]]);
    expect(n).toBe(0);
  });

  let doneId: string;

  it('spreads the members over both workers, combines them once, and holds the true depth of v* inside the 5–95 % band', async () => {
    const res = await start({ members: 8, seed: 7, rockVelocity: ROCK, label: 'first ensemble' }).expect(202);
    doneId = res.body.id;
    const v = await finished(doneId);
    expect(v.status, `${v.error} ${logs()}`).toBe('done');
    expect(v).toMatchObject({ members: 8, seed: 7, label: 'first ensemble', vary: { start: true, smoothing: true, picks: 'sigma' }, rockVelocity: { min: ROCK, max: ROCK } });
    expect(v.progress).toEqual({ queued: 0, running: 0, done: 8, failed: 0, cancelled: 0 });
    expect(v.workers.reduce((s, w) => s + w.done, 0)).toBe(8);
    for (const w of v.workers) expect(NAMES).toContain(w.worker);
    expect(v.stats!.used + v.stats!.excluded).toBe(8);
    expect(v.stats!.used).toBeGreaterThanOrEqual(6);

    const members: EnsembleMemberView[] = (await geo.get(`/api/ensembles/${doneId}/members`).expect(200)).body;
    expect(members.map((m) => m.index)).toEqual(range(0, 7, 1));
    // The draws stay inside the stated spreads (v0 ×/÷ 1.25, k ×/÷ 2, weight ×/÷ 3) and differ between members.
    for (const m of members) {
      expect(m.plan.v0Factor).toBeGreaterThanOrEqual(0.8);
      expect(m.plan.v0Factor).toBeLessThanOrEqual(1.25);
      expect(m.plan.kFactor).toBeGreaterThanOrEqual(0.5);
      expect(m.plan.smoothingFactor).toBeLessThanOrEqual(3);
      expect(m.chi2).toBeGreaterThan(0);
    }
    expect(new Set(members.map((m) => m.plan.v0Factor)).size).toBe(8);

    const section: EnsembleSectionView = (await geo.get(`/api/ensembles/${doneId}/section`).expect(200)).body;
    const { nx, nz } = section.grid;
    expect(section.mean).toHaveLength(nx * nz);
    expect(section.bands).toHaveLength(RECEIVERS.length);
    // Mean velocity near the truth where covered, down to 5 m (deeper, fewer and longer rays smooth more);
    // spread and probability defined wherever the mean is.
    let checked = 0;
    for (let iz = 0; iz < nz; iz++) {
      for (let ix = 0; ix < nx; ix++) {
        const i = iz * nx + ix;
        if (section.mean[i] === null) continue;
        const depth = iz * section.grid.dz - section.grid.z0; // flat ground at z = 0, z up
        if (depth <= 5) {
          expect(Math.abs(section.mean[i]! - (V0 + K * depth)) / (V0 + K * depth), `node ${ix},${iz}`).toBeLessThan(0.1);
          checked++;
        }
        expect(section.std[i]).toBeGreaterThanOrEqual(0);
        expect(section.probability[i]).toBeGreaterThanOrEqual(0);
        expect(section.probability[i]).toBeLessThanOrEqual(1);
      }
    }
    expect(checked).toBeGreaterThan(50);
    const truth = (ROCK - V0) / K;
    const resolved = section.bands.filter((b) => b.median !== null);
    // Rays reach 5 m only under the middle of this short line (measured: 12 of 25 stations).
    expect(resolved.length).toBeGreaterThanOrEqual(8);
    const inside = resolved.filter((b) => b.p5! <= truth && truth <= b.p95!).length;
    expect(inside / resolved.length).toBeGreaterThanOrEqual(0.8);
    for (const b of resolved) expect(b.p5!).toBeLessThanOrEqual(b.p95!);
    // Once combined, a second combine changes nothing (one result row).
    const [{ n }] = await dataSource.query('SELECT count(*)::int AS n FROM ensemble_results WHERE ensemble_id = $1', [doneId]);
    expect(n).toBe(1);
    const list: EnsembleView[] = (await geo.get(`/api/inversions/${inversionId}/ensembles`).expect(200)).body;
    expect(list.map((e) => e.id)).toContain(doneId);
  }, 300_000);

  it('a report of the inversion made now states the newest ensemble\'s band as its accuracy', async () => {
    const reportId = (await lead.post(`/api/inversions/${inversionId}/reports`).set('X-CSRF-Token', lead.csrf).send({ isoVelocity: ROCK }).expect(202)).body.id;
    const ready = await waitFor(async () => {
      const r = (await lead.get(`/api/reports/${reportId}`)).body;
      return r.render.state === 'ready' || r.render.state === 'failed' ? r : undefined;
    }, 90_000, 'the PDF');
    expect(ready.render.state, `${ready.render.error} ${logs()}`).toBe('ready');
    const [{ snapshot }] = await dataSource.query('SELECT snapshot FROM reports WHERE id = $1', [reportId]);
    expect(snapshot.ensembleId).toBe(doneId);
    const pdf = await lead.get(`/api/reports/${reportId}/pdf`).buffer(true).parse(binaryBody);
    const file = join(mkdtempSync(join(tmpdir(), 'tf-ensemble-report-')), 'report.pdf');
    writeFileSync(file, pdf.body);
    const text = pageTexts(file).join('\n').replace(/\s+/g, ' ');
    expect(text).toContain(`Accuracy of the depth to ${ROCK} m/s`);
    expect(text).toContain('The band covers only what was varied between the members');
  }, 120_000);

  it('hands a member whose worker was killed to the other worker, which finishes it', async () => {
    const id = (await start({ members: 4, seed: 11, rockVelocity: ROCK }).expect(202)).body.id;
    const running = await waitFor(async () => {
      const [row] = await dataSource.query(`SELECT index, worker FROM ensemble_members WHERE ensemble_id = $1 AND status = 'running' LIMIT 1`, [id]);
      return row;
    }, 60_000, 'a running member');
    const at = NAMES.indexOf(running.worker);
    await workers[at].stop('SIGKILL');
    const v = await finished(id);
    expect(v.status, `${v.error} ${logs()}`).toBe('done');
    expect(v.progress.done).toBe(4);
    const [row] = await dataSource.query('SELECT attempts, status FROM ensemble_members WHERE ensemble_id = $1 AND index = $2', [id, running.index]);
    expect(row).toEqual({ attempts: 2, status: 'done' });
    workers[at] = startWorker(NAMES[at], { WORKER_THREADS: '1' });
  }, 300_000);

  it('cancel stops every member: waiting jobs leave the queue, running ones stop, nothing is combined', async () => {
    const id = (await start({ members: 40, seed: 3, rockVelocity: ROCK }).expect(202)).body.id;
    await waitFor(async () => ((await view(id)).progress.running > 0 ? true : undefined), 60_000, 'members to start');
    const cancelled: EnsembleView = (await lead.post(`/api/ensembles/${id}/cancel`).set('X-CSRF-Token', lead.csrf).send({}).expect(200)).body;
    expect(cancelled.status).toBe('cancelled');
    expect(cancelled.progress.queued + cancelled.progress.running).toBe(0);
    await lead.post(`/api/ensembles/${id}/cancel`).set('X-CSRF-Token', lead.csrf).send({}).expect(409);
    const waiting = await t.queue.getJobs(['waiting', 'prioritized', 'delayed']);
    expect(waiting.filter((j) => j.data?.ensembleId === id)).toEqual([]);
    // Members that were running notice within about a second and write nothing more.
    await new Promise((r) => setTimeout(r, 3000));
    const after = await view(id);
    expect(after.status).toBe('cancelled');
    expect(after.progress.done).toBe(cancelled.progress.done);
    await geo.get(`/api/ensembles/${id}/section`).expect(409);
  }, 120_000);
});
