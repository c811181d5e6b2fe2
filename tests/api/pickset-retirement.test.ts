/**
 * A mistaken pick set can be retired and brought back (issue 17, item 5): retired, it is marked in the
 * line's list with who, when and why, refused for new runs and inversions with the field named, while
 * the runs that used it stay readable; retiring needs a reason, twice is a conflict, both steps are audited.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

describe('retiring a pick set', () => {
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

  const retire = (agent: Agent, body: object) => agent.post(`/api/picksets/${world.pickSetA}/retire`).set('X-CSRF-Token', agent.csrf).send(body);
  const summary = async () => ((await geo.get(`/api/lines/${world.lineA.id}`)).body.pickSets as { id: string; retired: unknown }[]).find((p) => p.id === world.pickSetA)!;

  it('needs a reason, then marks the set retired with who and why', async () => {
    const none = await retire(tech, {});
    expect(none.status).toBe(400);
    expect(none.body.issues[0].path).toBe('reason');
    expect((await summary()).retired).toBeNull();
    expect((await retire(tech, { reason: 'wrong shot file uploaded' })).status).toBe(204);
    expect((await summary()).retired).toMatchObject({ by: 'Test field_tech', reason: 'wrong shot file uploaded' });
    expect((await retire(tech, { reason: 'again' })).status).toBe(409);
  });

  it('refuses new runs and inversions on it, naming the field, and keeps the old run readable', async () => {
    const run = await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: world.modelA, pickSetId: world.pickSetA, order: 2 });
    expect(run.status).toBe(422);
    expect(run.body.issues[0]).toMatchObject({ path: 'pickSetId', message: expect.stringMatching(/retired \(wrong shot file uploaded\)/) });
    const inv = await geo.post('/api/inversions').set('X-CSRF-Token', geo.csrf).send({ pickSetId: world.pickSetA, start: { kind: 'gradient' } });
    expect(inv.status).toBe(422);
    expect(inv.body.issues[0].path).toBe('pickSetId');
    expect((await geo.get(`/api/runs/${world.runA}`)).status).toBe(200);
    expect((await geo.get(`/api/picksets/${world.pickSetA}`)).status).toBe(200);
  });

  it('is reinstated by its uploaders, and both steps are in the audit trail', async () => {
    expect((await tech.post(`/api/picksets/${world.pickSetA}/reinstate`).set('X-CSRF-Token', tech.csrf)).status).toBe(204);
    expect((await summary()).retired).toBeNull();
    expect((await tech.post(`/api/picksets/${world.pickSetA}/reinstate`).set('X-CSRF-Token', tech.csrf)).status).toBe(409);
    const run = await geo.post('/api/runs').set('X-CSRF-Token', geo.csrf).send({ modelId: world.modelA, pickSetId: world.pickSetA, order: 2 });
    expect(run.status).toBe(202);
    const trail = await dataSource.query(`SELECT action FROM audit_log WHERE object_id = $1 AND action IN ('pickset.retire', 'pickset.reinstate') ORDER BY id`, [world.pickSetA]);
    expect(trail.map((r: { action: string }) => r.action)).toEqual(['pickset.retire', 'pickset.reinstate']);
  });
});
