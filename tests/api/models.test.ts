import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { binaryBody, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

const fixture = (name: string) => JSON.parse(readFileSync(`fixtures/models/${name}`, 'utf8'));

describe('velocity model versions', () => {
  let t: TestApp;
  let world: World;
  let geo: Agent;
  let lead: Agent;
  const url = () => `/api/lines/${world.lineA.id}/models`;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
    lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
  });
  afterAll(async () => t?.close());

  it('saves a model file and gives it back exactly, with its grid summary', async () => {
    const file = fixture('three-layer.model.json');
    const saved = await geo.post(`${url()}?name=ridge&comment=first%20pass`).set('X-CSRF-Token', geo.csrf).send(file);
    expect(saved.status).toBe(201);
    expect(saved.body).toMatchObject({ version: 1, name: 'ridge', warnings: [] });
    const got = await lead.get(`/api/models/${saved.body.id}`);
    expect(got.status).toBe(200);
    expect(got.body.model).toEqual(file);
    expect(got.body).toMatchObject({ name: 'ridge', version: 1, comment: 'first pass', lineId: world.lineA.id });
    expect(got.body.summary.grid).toEqual({ x0: 0, dx: 0.5, nx: 241, z0: 62, dz: 0.5, nz: 61 });
    expect(got.body.summary.nodes).toBe(241 * 61);
    // Slowest: topsoil v_top 350 m/s; fastest: mudstone v_base 3400 m/s at the grid bottom (the file's own values).
    expect(got.body.summary.vMin).toBeCloseTo(350, 0);
    expect(got.body.summary.vMax).toBeCloseTo(3400, 0);
  });

  it('numbers each save of the same name as a new version and keeps the old ones unchanged', async () => {
    const file = fixture('two-layer.model.json');
    const v1 = await geo.post(url()).set('X-CSRF-Token', geo.csrf).send(file);
    const changed = { ...file, layers: [{ ...file.layers[0], v_top: 650 }, file.layers[1]] };
    const v2 = await geo.post(`${url()}?basedOn=${v1.body.id}`).set('X-CSRF-Token', geo.csrf).send(changed);
    // "main" already has version 1 from the test world.
    expect([v1.body.version, v2.body.version]).toEqual([2, 3]);
    expect((await geo.get(`/api/models/${v1.body.id}`)).body.model.layers[0].v_top).toBe(600);
    expect((await geo.get(`/api/models/${v2.body.id}`)).body.basedOn).toBe(v1.body.id);
    const put = await geo.put(`/api/models/${v1.body.id}`).set('X-CSRF-Token', geo.csrf).send(changed);
    expect(put.status).toBe(409);
    expect(put.body.error).toBe('immutable');
    await expect(dataSource.query(`UPDATE velocity_models SET comment = 'x' WHERE id = $1`, [v1.body.id])).rejects.toThrow(/immutable/);
    const versions = (await geo.get(`/api/lines/${world.lineA.id}`)).body.models.filter((m: { name: string }) => m.name === 'main');
    expect(versions.map((m: { version: number }) => m.version)).toEqual([3, 2, 1]);
  });

  it('refuses invalid models with JSON-path errors and stores nothing', async () => {
    const before = (await dataSource.query('SELECT count(*)::int AS n FROM velocity_models'))[0].n;
    const bad = await geo.post(url()).set('X-CSRF-Token', geo.csrf).send(fixture('bad/base-x-not-increasing.model.json'));
    expect(bad.status).toBe(422);
    expect(bad.body.error).toBe('invalid_model');
    expect(bad.body.issues[0].path).toMatch(/^layers\[\d+\]\.base\[\d+\]$/);
    expect(bad.body.issues[0].message).toMatch(/x must increase/);
    const big = await geo.post(url()).set('X-CSRF-Token', geo.csrf).send(fixture('bad/grid-too-large.model.json'));
    expect(big.status).toBe(422);
    expect(big.body.message).toMatch(/\d[\d\s,]*(nodes|×)/);
    const negative = fixture('two-layer.model.json');
    negative.layers[1].v_top = -5;
    const neg = await geo.post(url()).set('X-CSRF-Token', geo.csrf).send(negative);
    expect(neg.status).toBe(422);
    expect(neg.body.issues.map((i: { path: string }) => i.path)).toContain('layers[1].v_top');
    const malformed = await geo.post(url()).set('X-CSRF-Token', geo.csrf).set('Content-Type', 'application/json').send('{"format": "timefield-model/1", ');
    expect(malformed.status).toBe(400);
    expect((await dataSource.query('SELECT count(*)::int AS n FROM velocity_models'))[0].n).toBe(before);
  });

  it('warns, without refusing, about velocities outside 100–7000 m/s', async () => {
    const fast = fixture('two-layer.model.json');
    fast.layers[1].v_base = 7600;
    const res = await geo.post(url()).set('X-CSRF-Token', geo.csrf).send(fast);
    expect(res.status).toBe(201);
    expect(res.body.warnings.join(' ')).toMatch(/faster than 7000 m\/s/);
  });

  it('serves the rasterised grid as Float32 with air as NaN', async () => {
    const file = fixture('three-layer.model.json');
    const saved = await geo.post(`${url()}?name=grid-check`).set('X-CSRF-Token', geo.csrf).send(file);
    const res = await geo.get(`/api/models/${saved.body.id}/grid`).buffer(true).parse(binaryBody);
    expect(res.status).toBe(200);
    expect(JSON.parse(res.headers['x-grid'])).toMatchObject({ nx: 241, nz: 61 });
    const v = new Float32Array(res.body.buffer, res.body.byteOffset, res.body.length / 4);
    expect(v.length).toBe(241 * 61);
    // Top row z = 62 m is above the surface (58–60.5 m) everywhere: air.
    expect(Number.isNaN(v[0])).toBe(true);
    // Bottom row z = 32 m is mudstone.
    expect(v[60 * 241 + 100]).toBeGreaterThan(2600);
  });
});
