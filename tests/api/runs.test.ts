/**
 * Forward runs end to end: the API queues, a real worker process solves, PostgreSQL holds the results.
 * Reference: in homogeneous ground a surface first arrival is the direct wave, t = x / v
 * (any refraction text, e.g. Telford, Geldart & Sheriff, Applied Geophysics, 2nd ed., 1990, ch. 4).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { binaryBody, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { startWorker, waitFor, type WorkerProcess } from './support/worker';
import { emailOf, PASSWORD, resetWorld, WORLD_MODEL, type World } from './support/world';

describe('forward runs', () => {
  let t: TestApp;
  let world: World;
  let geo: Agent;
  let worker: WorkerProcess;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    await t.queue.obliterate({ force: true });
    geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
    worker = startWorker();
  });
  afterAll(async () => {
    await worker?.stop();
    await t?.close();
  });

  const runStatus = async (id: string) => (await geo.get(`/api/runs/${id}`)).body;
  const finished = (id: string, timeoutMs = 60_000) =>
    waitFor(async () => {
      const r = await runStatus(id);
      return ['done', 'failed', 'cancelled'].includes(r.status) ? r : undefined;
    }, timeoutMs, `run ${id} to finish`);

  it('solves the world pick set against 600 m/s ground: residuals vanish, fields and rays are stored', async () => {
    const res = await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: world.modelA, pickSetId: world.pickSetA, order: 2 });
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ id: expect.any(String), status: 'queued' });
    const run = await finished(res.body.id);
    expect(run.status, `${run.error} ${worker.output.join("")}`).toBe("done");
    expect(run.progress).toMatchObject({ done: 2, total: 2 });
    expect(run.stats).toMatchObject({ shots: 2, picks: 10 });
    // Picks are t = x/600 rounded to 1 µs, so only the solver's own error remains: well below 0.05 ms.
    expect(run.stats.rms_ms).toBeLessThan(0.05);
    expect(run.stats.chi2).toBeLessThan(0.01);

    const rows = (await geo.get(`/api/runs/${res.body.id}/residuals`)).body;
    expect(rows).toHaveLength(10);
    const far = rows.find((r: { shotId: string; receiverX: number }) => r.shotId === 'F' && r.receiverX === 24);
    expect(far.computedMs).toBeCloseTo(40, 1); // 24 m / 600 m/s
    expect(far.observedMs).toBeCloseTo(40, 6);

    const field = await geo.get(`/api/runs/${res.body.id}/fields/F`).buffer(true).parse(binaryBody);
    expect(field.status).toBe(200);
    const grid = JSON.parse(field.headers['x-grid']);
    expect(grid).toEqual(WORLD_MODEL.grid);
    const T = new Float32Array(new Uint8Array(field.body).buffer);
    expect(T.length).toBe(grid.nx * grid.nz);
    // Node (ix 40, iz 10): x = 20 m, z = −5 m; distance from the source at (0, 0) is √425 m.
    expect(T[10 * grid.nx + 40]).toBeCloseTo(Math.sqrt(425) / 600, 4);

    const rays = (await geo.get(`/api/runs/${res.body.id}/rays?shotId=F`)).body;
    expect(rays).toHaveLength(5);
    // In homogeneous ground a ray is the straight segment: simplified to its two ends.
    const ray = rays.find((r: { pickIndex: number }) => r.pickIndex === 4).points;
    expect(ray.slice(0, 2)).toEqual([24, 0]);
    expect(ray.slice(-2).map((v: number) => Math.abs(v))).toEqual([0, 0]);
  });

  it('refuses bad requests before anything is queued', async () => {
    const before = (await dataSource.query('SELECT count(*)::int AS n FROM runs'))[0].n;
    const badOrder = await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: world.modelA, pickSetId: world.pickSetA, order: 3 });
    expect(badOrder.status).toBe(400);
    expect(badOrder.body.issues[0]).toEqual({ path: 'order', message: 'must be 1 (first order) or 2 (second order)' });

    const otherProject = await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: world.modelA, pickSetId: await pickSetOfProjectB() });
    expect(otherProject.status).toBe(422);
    expect(otherProject.body.issues[0].path).toBe('pickSetId');

    // A second line of project A with its own model: a model and a pick set of different lines.
    const line2 = (await geo.post(`/api/projects/${world.projectA.id}/lines`).set('X-CSRF-Token', geo.csrf).send({ name: 'A-2' })).body;
    const model2 = (await geo.post(`/api/lines/${line2.id}/models`).set('X-CSRF-Token', geo.csrf).send(WORLD_MODEL)).body;
    const crossed = await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: model2.id, pickSetId: world.pickSetA });
    expect(crossed.status).toBe(409);
    expect(crossed.body.error).toBe('different_lines');

    // A model too short for the spread: the receiver at 24 m is off the grid.
    const short = { ...WORLD_MODEL, grid: { ...WORLD_MODEL.grid, nx: 41 } };
    const shortModel = (await geo.post(`/api/lines/${world.lineA.id}/models?name=short`).set('X-CSRF-Token', geo.csrf).send(short)).body;
    const outside = await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: shortModel.id, pickSetId: world.pickSetA });
    expect(outside.status).toBe(409);
    expect(outside.body.error).toBe('outside_model');
    expect(outside.body.message).toMatch(/outside the model/);

    expect((await dataSource.query('SELECT count(*)::int AS n FROM runs'))[0].n).toBe(before);
    const lead = await signedInAgent(t.app, emailOf('client'), PASSWORD);
    expect((await lead.post('/api/runs').set('X-CSRF-Token', lead.csrf).send({ modelId: world.modelA, pickSetId: world.pickSetA })).status).toBe(403);
  });

  async function pickSetOfProjectB(): Promise<string> {
    const { importPicks } = await import('../../server/services/importPicks');
    const { WORLD_PICKS } = await import('./support/world');
    return (await importPicks(world.users.outsider.id, world.projectB.id, world.lineB.id, 'b.picks.csv', Buffer.from(WORLD_PICKS))).id;
  }
});
