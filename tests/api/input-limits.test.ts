/**
 * Issue 16 item 5: absurd numbers are refused at the edge with line/column (files) or a path
 * (bodies), and nothing is stored. The absurd values are the ones the issue reports as stored
 * (201) before; the ranges are shared/limits.ts (velocities 50–10 000 m/s, coordinates ±1e7 m,
 * elevations −12 000…+9 000 m, times 0–10 000 ms, sigmas 0.01–100 ms, spacings 0.01–100 m).
 * Also: a pick position far from every station is a warning in the checks, not a refusal.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, WORLD_MODEL, type World } from './support/world';

const count = async (table: string) => Number((await dataSource.query(`SELECT count(*) AS n FROM ${table}`))[0].n);
const HEADER = 'shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms';

describe('input limits at the edge', () => {
  let t: TestApp;
  let world: World;
  let tech: Agent;
  let geo: Agent;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
    geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
  });
  afterAll(async () => t?.close());

  describe('pick files', () => {
    it.each([
      ['receiver_x −1e20', 'S1,0,,-1e20,,5.8,0.5', 'receiver_x'],
      ['time_ms 1e308', 'S1,0,,4,,1e308,0.5', 'time_ms'],
      ['sigma_ms 1e-321', 'S1,0,,4,,11.4,1e-321', 'sigma_ms'],
    ])('%s → 422 with line and column, nothing stored', async (_name, row, column) => {
      const before = [await count('pick_sets'), await count('picks')];
      const file = Buffer.from(`${HEADER}\nS1,0,,2,,5.8,0.5\n${row}\n`);
      const res = await tech.post(`/api/lines/${world.lineA.id}/picksets`).set('X-CSRF-Token', tech.csrf).attach('file', file, 'absurd.picks.csv');
      expect(res.status).toBe(422);
      expect(res.body.issues[0]).toMatchObject({ line: 3, column, message: expect.stringMatching(/must be between/) });
      expect([await count('pick_sets'), await count('picks')]).toEqual(before);
    });
  });

  describe('station tables', () => {
    const url = () => `/api/lines/${world.lineA.id}/stations`;
    it('JSON: x = 1e15 and z = 1e308 → 422 naming row and column, old table kept', async () => {
      const good = [{ station: 1, x: 0, z: 100 }, { station: 2, x: 5, z: 100 }];
      expect((await tech.put(url()).set('X-CSRF-Token', tech.csrf).send(good)).status).toBe(200);
      const res = await tech.put(url()).set('X-CSRF-Token', tech.csrf).send([{ station: 1, x: 0, z: 100 }, { station: 2, x: 1e15, z: 1e308 }]);
      expect(res.status).toBe(422);
      expect(res.body.issues.map((i: { row: number; column: string }) => [i.row, i.column])).toEqual([[2, 'x'], [2, 'z']]);
      expect((await tech.get(`/api/lines/${world.lineA.id}`)).body.stations).toEqual(good);
    });

    it('CSV: the same values → 422 naming file line and column', async () => {
      const res = await tech.put(url()).set('X-CSRF-Token', tech.csrf).attach('file', Buffer.from('station,x,z\n1,0,100\n2,1e15,1e308\n'), 'stations.csv');
      expect(res.status).toBe(422);
      expect(res.body.issues.map((i: { line: number; column: string }) => [i.line, i.column])).toEqual([[3, 'x'], [3, 'z']]);
    });
  });

  describe('model files', () => {
    const save = (body: unknown) => geo.post(`/api/lines/${world.lineA.id}/models`).set('X-CSRF-Token', geo.csrf).send(body as object);
    const withLayer = (layer: object) => ({ ...WORLD_MODEL, layers: [{ ...WORLD_MODEL.layers[0], ...layer }] });
    it.each([
      ['velocity 1e308', withLayer({ v_top: 1e308 }), 'layers[0].v_top'],
      ['velocity 1e-300', withLayer({ v_base: 1e-300 }), 'layers[0].v_base'],
      ['grid spacing 1e308', { ...WORLD_MODEL, grid: { ...WORLD_MODEL.grid, dx: 1e308 } }, 'grid.dx'],
      ['a megabyte of junk under an unknown key', { ...WORLD_MODEL, junk: 'j'.repeat(1024 * 1024) }, 'junk'],
      ['more than 64 kB under an unknown key inside a layer', withLayer({ extra: ['x'.repeat(70 * 1024)] }), 'layers[0].extra'],
    ])('%s → 422 with the JSON path, nothing stored', async (_name, body, path) => {
      const before = await count('velocity_models');
      const res = await save(body);
      expect(res.status).toBe(422);
      expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path);
      expect(await count('velocity_models')).toBe(before);
    });
  });

  describe('far pick positions', () => {
    it('a receiver 10 km from a 25 m spread is stored, and the checks warn about it', async () => {
      const stations = [0, 5, 10, 15, 20, 25].map((x, i) => ({ station: i + 1, x, z: 100 }));
      expect((await tech.put(`/api/lines/${world.lineA.id}/stations`).set('X-CSRF-Token', tech.csrf).send(stations)).status).toBe(200);
      // Median spacing 5 m → warning beyond 15 m from the nearest station (3 spacings; our rule, shared/limits.ts).
      const file = Buffer.from(`${HEADER}\nS1,0,,5,,8.3,0.5\nS1,0,,10005,,12.1,0.5\nS1,0,,25,,40.1,0.5\n`);
      const up = await tech.post(`/api/lines/${world.lineA.id}/picksets`).set('X-CSRF-Token', tech.csrf).attach('file', file, 'typo.picks.csv');
      expect(up.status).toBe(201);
      const res = await tech.get(`/api/picksets/${up.body.id}`);
      expect(res.status).toBe(200);
      expect(res.body.qc.farPositions.limit).toBe(15);
      expect(res.body.qc.farPositions.positions).toEqual([
        expect.objectContaining({ role: 'receiver', x: 10005, nearestStationX: 25, distance: 9980, picks: 1 }),
      ]);
    });
  });
});
