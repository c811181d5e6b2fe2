/**
 * A replaced station table is never lost (issue 17, item 4): every save keeps the table it replaces
 * as a numbered revision, which can be listed and restored (the table then replaced is kept in turn);
 * a restore is audited; an unknown revision is a 404, and a field technician may restore, a lead only read.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

describe('station table revisions', () => {
  let t: TestApp;
  let world: World;
  let tech: Agent;
  let lead: Agent;
  const many = Array.from({ length: 48 }, (_, i) => ({ station: i + 1, x: 2.5 * i, z: 100 + 0.01 * i }));
  const two = [{ station: 1, x: 0, z: 100 }, { station: 2, x: 2.5, z: 100.1 }];

  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
    lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
  });
  afterAll(async () => t?.close());

  const base = () => `/api/lines/${world.lineA.id}/stations`;

  it('keeps the 48 stations that a 2-station file replaced, and brings them back', async () => {
    await tech.put(base()).set('X-CSRF-Token', tech.csrf).send(many).expect(200);
    await tech.put(base()).set('X-CSRF-Token', tech.csrf).send(two).expect(200);
    const list = await lead.get(`${base()}/revisions`).expect(200);
    expect(list.body[0]).toMatchObject({ stations: 48, replacedBy: { name: expect.any(String) } });
    const newest = list.body[0].number as number;

    // A lead reads but may not restore.
    expect((await lead.post(`${base()}/revisions/${newest}/restore`).set('X-CSRF-Token', lead.csrf)).status).toBe(403);
    const restored = await tech.post(`${base()}/revisions/${newest}/restore`).set('X-CSRF-Token', tech.csrf).expect(200);
    expect(restored.body.stations).toEqual(many);
    expect((await tech.get(`/api/lines/${world.lineA.id}`)).body.stations).toEqual(many);

    // The 2-station table it replaced is now the newest revision.
    const after = await tech.get(`${base()}/revisions`).expect(200);
    expect(after.body[0]).toMatchObject({ number: newest + 1, stations: 2 });
    const audit = await dataSource.query(`SELECT detail FROM audit_log WHERE action = 'line.stations.restore' AND object_id = $1`, [world.lineA.id]);
    expect(audit).toHaveLength(1);
    expect(audit[0].detail).toMatchObject({ restoredFrom: newest, stations: 48, replaced: 2, keptAsRevision: newest + 1 });
  });

  it('keeps no revision when a save changes nothing', async () => {
    const before = (await tech.get(`${base()}/revisions`)).body.length;
    await tech.put(base()).set('X-CSRF-Token', tech.csrf).send(many).expect(200); // the table on record already
    expect((await tech.get(`${base()}/revisions`)).body).toHaveLength(before);
  });

  it('answers 404 for a revision the line does not have, and changes nothing', async () => {
    const before = (await tech.get(`/api/lines/${world.lineA.id}`)).body.stations;
    for (const n of ['0', '9999', 'abc']) {
      const res = await tech.post(`${base()}/revisions/${n}/restore`).set('X-CSRF-Token', tech.csrf);
      expect(res.status).toBe(404);
      expect(res.body.message).toMatch(/no station revision/);
    }
    expect((await tech.get(`/api/lines/${world.lineA.id}`)).body.stations).toEqual(before);
  });
});
