/**
 * Starting an inversion (issue 11 items 3 and "bad input gets clear errors before anything is
 * queued"): a good request records every input and queues one job; each bad one gets a 4xx that
 * names the field (JSON path) or the pick-file line, and leaves no row and no job behind.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { importPicks } from '../../server/services/importPicks';
import { saveModelVersion } from '../../server/services/models';
import { DEFAULT_INVERSION_SETTINGS } from '../../shared/schemas/inversions';
import { MAX_GRID_NODES } from '../../shared/limits';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, WORLD_MODEL, WORLD_PICKS, type World } from './support/world';

const HEADER = 'shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms';

describe('starting an inversion', () => {
  let t: TestApp;
  let world: World;
  let geo: Agent;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    await t.queue.obliterate({ force: true });
    geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
  });
  afterAll(async () => t?.close());

  const post = (body: object, agent = geo) => agent.post('/api/inversions').set('X-CSRF-Token', agent.csrf).send(body);
  const rowCount = async () => (await dataSource.query('SELECT count(*)::int AS n FROM inversions'))[0].n as number;
  const invertJobs = async () => (await t.queue.getJobs(['waiting', 'delayed', 'active', 'prioritized'])).filter((j) => j?.name === 'invert');
  const picksOf = async (name: string, rows: string[]) =>
    (await importPicks(world.users.field_tech.id, world.projectA.id, world.lineA.id, name, Buffer.from([HEADER, ...rows].join('\n')))).id;

  it('records a gradient start with its grid and every setting, and queues one job under the row id', async () => {
    const res = await post({ pickSetId: world.pickSetA, start: { kind: 'gradient' }, settings: { maxIterations: 5 }, label: 'first try' });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(res.body).toEqual({ id: expect.any(String), status: 'queued' });
    const view = (await geo.get(`/api/inversions/${res.body.id}`).expect(200)).body;
    // Requirement (issue 11 item 3): the row records its inputs exactly — pick-set revision, start, grid, every setting.
    expect(view).toMatchObject({ status: 'queued', label: 'first try', pickSetId: world.pickSetA, pickSetRevision: 0, history: [], stats: null, savedModelId: null });
    expect(view.settings).toEqual({ ...DEFAULT_INVERSION_SETTINGS, maxIterations: 5 });
    // The world's line has no station table, so its receivers stand in: every 6 m, half of it is 3 m,
    // and the next round spacing below is 2.5 m (the default rule of shared/inversion/grid-for-line.ts).
    expect(view.start).toEqual({ kind: 'gradient', spacing: 2.5, v0: null, k: null });
    expect(view.grid.dx).toBe(2.5);
    expect(view.grid.x0).toBeLessThanOrEqual(0);
    expect(view.grid.x0 + (view.grid.nx - 1) * view.grid.dx).toBeGreaterThanOrEqual(24);
    const jobs = await invertJobs();
    expect(jobs.map((j) => j.id)).toEqual([res.body.id]);
    expect(jobs[0].data).toEqual({ inversionId: res.body.id });
    const list = (await geo.get(`/api/lines/${world.lineA.id}/inversions`).expect(200)).body;
    // Newest first: the new one, then the world's finished one.
    expect(list.map((i: { id: string }) => i.id)).toEqual([res.body.id, world.inversionA]);
  });

  it('records a start from a saved model on its grid, and honours an Idempotency-Key', async () => {
    const send = () => geo.post('/api/inversions').set('X-CSRF-Token', geo.csrf).set('Idempotency-Key', 'inversion-form-0001')
      .send({ pickSetId: world.pickSetA, start: { kind: 'model', modelId: world.modelA } });
    const before = await rowCount();
    const answers = await Promise.all([send(), send()]);
    expect(answers.map((r) => r.status)).toEqual([202, 202]);
    expect(answers[0].body.id).toBe(answers[1].body.id);
    expect(await rowCount()).toBe(before + 1);
    const view = (await geo.get(`/api/inversions/${answers[0].body.id}`).expect(200)).body;
    expect(view.start).toEqual({ kind: 'model', modelId: world.modelA, modelVersion: 1 });
    expect(view.grid).toEqual(WORLD_MODEL.grid);
  });

  it('refuses bad input before anything is queued, naming the field or the pick-file line', async () => {
    await t.queue.obliterate({ force: true });
    await dataSource.query('DELETE FROM inversions WHERE id <> $1', [world.inversionA]);
    const cases: { what: string; body: object; status: number; error: string; path?: string; message?: RegExp }[] = [];

    cases.push({ what: 'bounds reversed', body: { pickSetId: world.pickSetA, start: { kind: 'gradient' }, settings: { vMin: 3000, vMax: 2000 } }, status: 400, error: 'validation_failed', path: 'settings.vMax', message: /greater than vMin/ });

    // Too few picks: 8 picks from two shots (the rule: at least 10 picks, shared/inversion/problem.ts).
    const few = await picksOf('few.picks.csv', [...[0, 6, 12, 18].map((x) => `F,0,,${x},,${(x / 0.6).toFixed(3)},0.5`), ...[0, 6, 12, 18].map((x) => `R,24,,${x},,${((24 - x) / 0.6).toFixed(3)},0.5`)]);
    cases.push({ what: 'too few picks', body: { pickSetId: few, start: { kind: 'gradient' } }, status: 422, error: 'not_invertible', path: 'pickSetId', message: /at least 10 picks \(there are 8\)/ });

    // Every pick from one shot: no crossing rays.
    const oneShot = await picksOf('one-shot.picks.csv', Array.from({ length: 12 }, (_, i) => `F,0,,${2 * (i + 1)},,${((2 * (i + 1)) / 0.6).toFixed(3)},0.5`));
    cases.push({ what: 'one shot', body: { pickSetId: oneShot, start: { kind: 'gradient' } }, status: 422, error: 'not_invertible', path: 'pickSetId', message: /all picks belong to shot F/ });

    // A revision that excludes every pick.
    const excludedAll = await picksOf('excluded.picks.csv', WORLD_PICKS.split('\n').slice(1));
    const revision = await geo.post(`/api/picksets/${excludedAll}/revisions`).set('X-CSRF-Token', geo.csrf)
      .send({ exclusions: Array.from({ length: 10 }, (_, index) => ({ index, reason: 'noisy' })) });
    expect(revision.status).toBe(201);
    cases.push({ what: 'all excluded', body: { pickSetId: excludedAll, start: { kind: 'gradient' } }, status: 422, error: 'not_invertible', path: 'pickSetRevision', message: /there are 0\); this revision excludes 10/ });
    // Revision 0 of the same set still has its ten picks: allowed (checked below, after the refusals).
    cases.push({ what: 'revision missing', body: { pickSetId: excludedAll, pickSetRevision: 7, start: { kind: 'gradient' } }, status: 422, error: 'validation_failed', path: 'pickSetRevision', message: /revisions 0 to 1/ });

    // A start model of another line of the same project, and one of another project.
    const line2 = (await geo.post(`/api/projects/${world.projectA.id}/lines`).set('X-CSRF-Token', geo.csrf).send({ name: 'A-2' })).body;
    const otherLine = (await geo.post(`/api/lines/${line2.id}/models`).set('X-CSRF-Token', geo.csrf).send(WORLD_MODEL)).body.id;
    cases.push({ what: 'model of another line', body: { pickSetId: world.pickSetA, start: { kind: 'model', modelId: otherLine } }, status: 409, error: 'different_lines' });
    const otherProject = (await saveModelVersion(world.users.outsider.id, world.projectB.id, world.lineB.id, WORLD_MODEL, { name: 'b', comment: '', basedOn: null })).id;
    cases.push({ what: 'model of another project', body: { pickSetId: world.pickSetA, start: { kind: 'model', modelId: otherProject } }, status: 422, error: 'validation_failed', path: 'start.modelId' });

    // A grid past the node limit: 1 cm cells over the world line's 35 m × 12.5 m.
    cases.push({ what: 'grid too large', body: { pickSetId: world.pickSetA, start: { kind: 'gradient', spacing: 0.01 } }, status: 422, error: 'grid_too_large', path: 'start.spacing', message: new RegExp(`limit is ${MAX_GRID_NODES.toLocaleString('en-GB')}`) });

    // Too few picks for the grid: the world's ten picks under 10 cm cells (some 35 000 ground nodes; at most 2 000 per pick).
    cases.push({ what: 'too few picks for the grid', body: { pickSetId: world.pickSetA, start: { kind: 'gradient', spacing: 0.1 } }, status: 422, error: 'not_invertible', path: 'start.spacing', message: /too few picks for the grid/ });
    // A start model too short for the spread (receiver at 24 m off a 20 m grid), and one whose ground lies below a receiver.
    const short = (await saveModelVersion(world.users.geophysicist.id, world.projectA.id, world.lineA.id, { ...WORLD_MODEL, grid: { ...WORLD_MODEL.grid, nx: 41 } }, { name: 'short', comment: '', basedOn: null })).id;
    cases.push({ what: 'receiver off the grid', body: { pickSetId: world.pickSetA, start: { kind: 'model', modelId: short } }, status: 409, error: 'outside_model', message: /line 6 of the pick file, receiver at x 24 m/ });
    const sunken = (await saveModelVersion(world.users.geophysicist.id, world.projectA.id, world.lineA.id, { ...WORLD_MODEL, surface: [[0, -2], [25, -2]] }, { name: 'sunken', comment: '', basedOn: null })).id;
    const raised = await picksOf('raised.picks.csv', [...[3, 6, 12, 18, 24].map((x) => `F,0,-2,${x},${x === 12 ? -1 : ''},${(x / 0.6).toFixed(3)},0.5`), ...[0, 6, 12, 18, 21].map((x) => `R,24,-2,${x},,${((24 - x) / 0.6).toFixed(3)},0.5`)]);
    cases.push({ what: 'receiver in the air', body: { pickSetId: raised, start: { kind: 'model', modelId: sunken } }, status: 409, error: 'outside_model', message: /line 4 of the pick file, receiver at x 12 m, z -1 m is in the air/ });

    for (const c of cases) {
      const res = await post(c.body);
      expect(res.status, `${c.what}: ${JSON.stringify(res.body)}`).toBe(c.status);
      expect(res.body.error, c.what).toBe(c.error);
      if (c.path) expect(res.body.issues?.[0]?.path, c.what).toBe(c.path);
      if (c.message) expect(res.body.message, c.what).toMatch(c.message);
    }
    // Nothing recorded, nothing queued.
    expect(await rowCount()).toBe(1);
    expect(await invertJobs()).toEqual([]);

    // The same pick set at its first revision is fine.
    expect((await post({ pickSetId: excludedAll, pickSetRevision: 0, start: { kind: 'gradient' } })).status).toBe(202);
  }, 60_000);

  it('lets only geophysicists start one, and hides another project’s pick set', async () => {
    for (const role of ['lead', 'field_tech', 'client'] as const) {
      const agent = await signedInAgent(t.app, emailOf(role), PASSWORD);
      expect((await post({ pickSetId: world.pickSetA, start: { kind: 'gradient' } }, agent)).status, role).toBe(403);
    }
    const { id: pickSetB } = await importPicks(world.users.outsider.id, world.projectB.id, world.lineB.id, 'b.picks.csv', Buffer.from(WORLD_PICKS));
    expect((await post({ pickSetId: pickSetB, start: { kind: 'gradient' } })).status).toBe(404);
  });
});
