/**
 * Boreholes and trial pits on a line (issue 13 item 3): entered by form (the schema's JSON paths on
 * bad input) or by a CSV file refused whole with line and column (nothing stored), names unique on
 * the line, edited and deleted, the ground at a hole taken from the stations when not logged
 * (linear between stations; hand-computed), every write in the audit trail.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

const holesOnLine = async (lineId: string) => Number((await dataSource.query('SELECT count(*) AS n FROM boreholes WHERE line_id = $1', [lineId]))[0].n);

describe('boreholes on a line', () => {
  let t: TestApp;
  let world: World;
  let tech: Agent;
  let lead: Agent;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
    lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
    await dataSource.query('DELETE FROM boreholes');
    await dataSource.query(`INSERT INTO stations (line_id, station, x, z) VALUES ($1, 1, 0, 100), ($1, 2, 10, 102), ($1, 3, 20, 101)`, [world.lineA.id]);
  });
  afterAll(async () => t?.close());

  const post = (body: object) => tech.post(`/api/lines/${world.lineA.id}/boreholes`).set('X-CSRF-Token', tech.csrf).send(body);
  const upload = (text: string, name = 'holes.csv') => tech.post(`/api/lines/${world.lineA.id}/boreholes/file`).set('X-CSRF-Token', tech.csrf).attach('file', Buffer.from(text), name);
  const hole = { name: 'BH1', x: 15, contacts: [{ depth: 0, material: 'topsoil' }, { depth: 4.2, material: 'sandstone', rockTop: true }] };

  it('creates a hole from the form; the ground comes from the stations when not logged', async () => {
    const res = await post(hole);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: 'BH1', kind: 'borehole', x: 15, groundZ: null, waterDepth: null, note: '', contacts: [{ depth: 0, rockTop: false }, { depth: 4.2, rockTop: true }] });
    // Between stations 2 (x 10, z 102) and 3 (x 20, z 101): 101.5.
    expect(res.body.groundZResolved).toBeCloseTo(101.5, 9);
    const [entry] = await dataSource.query(`SELECT action FROM audit_log WHERE object_id = $1`, [res.body.id]);
    expect(entry.action).toBe('borehole.create');
  });

  it('refuses a second hole of the same name (409) and bad input with JSON paths (400/422), storing nothing', async () => {
    const before = await holesOnLine(world.lineA.id);
    expect((await post(hole)).status).toBe(409);
    const bad = await post({ ...hole, name: 'BH2', contacts: [{ depth: 5, material: 'clay' }, { depth: 2, material: 'rock' }] });
    expect([400, 422]).toContain(bad.status);
    expect(bad.body.issues).toContainEqual(expect.objectContaining({ path: 'contacts[1].depth' }));
    expect(await holesOnLine(world.lineA.id)).toBe(before);
  });

  it('stores every hole of a good file, and refuses a file with any problem whole, with line and column', async () => {
    const ok = await upload('hole,kind,x,ground_z,water_depth,depth,material,rock_top\nTP1,trial pit,5,99.5,,0,made ground,\nTP1,trial pit,5,99.5,,1.8,rock,yes\nBH7,,18,,2.5,6,rock,yes\n');
    expect(ok.status).toBe(201);
    expect(ok.body.created).toBe(2);
    expect(ok.body.boreholes.map((b: { name: string; groundZResolved: number }) => [b.name, b.groundZResolved])).toEqual([['TP1', 99.5], ['BH7', 101.2]]);
    const before = await holesOnLine(world.lineA.id);
    const bad = await upload('hole,x,depth,material\nBH8,30,1,clay\nBH8,30,x,rock\n');
    expect(bad.status).toBe(422);
    expect(bad.body.message).toBe('holes.csv was not stored: line 3, depth: "x" is not a number');
    expect(bad.body.issues).toEqual([{ line: 3, column: 'depth', message: '"x" is not a number' }]);
    const clash = await upload('hole,x,depth,material\nBH9,30,1,clay\nBH1,12,3,rock\n');
    expect(clash.status).toBe(422);
    expect(clash.body.issues).toEqual([{ line: 3, column: 'hole', message: expect.stringMatching(/BH1 is already on this line/) }]);
    expect(await holesOnLine(world.lineA.id)).toBe(before);
  });

  it('lists the holes along the line for a lead; edits and deletes for a field technician', async () => {
    const list = await lead.get(`/api/lines/${world.lineA.id}/boreholes`);
    expect(list.status).toBe(200);
    const names = list.body.map((b: { name: string }) => b.name);
    expect(names.indexOf('TP1')).toBeLessThan(names.indexOf('BH1'));
    const bh1 = list.body.find((b: { name: string }) => b.name === 'BH1');
    const put = await tech.put(`/api/boreholes/${bh1.id}`).set('X-CSRF-Token', tech.csrf).send({ ...hole, groundZ: 103, waterDepth: 1.2 });
    expect(put.status).toBe(200);
    expect(put.body).toMatchObject({ groundZ: 103, groundZResolved: 103, waterDepth: 1.2 });
    const del = await tech.delete(`/api/boreholes/${bh1.id}`).set('X-CSRF-Token', tech.csrf);
    expect(del.status).toBe(204);
    expect((await lead.get(`/api/lines/${world.lineA.id}/boreholes`)).body.some((b: { name: string }) => b.name === 'BH1')).toBe(false);
  });
});
