import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { signedInAgent, startTestApp, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

describe('projects, members and lines', () => {
  let t: TestApp;
  let world: World;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
  });
  afterAll(async () => t?.close());

  it('lists only the projects a user belongs to; the admin sees all', async () => {
    const names = async (role: Parameters<typeof emailOf>[0]) =>
      (await (await signedInAgent(t.app, emailOf(role), PASSWORD)).get('/api/projects')).body.map((p: { name: string }) => p.name);
    expect(await names('client')).toEqual(['Project A']);
    expect(await names('outsider')).toEqual(['Project B']);
    expect(await names('loner')).toEqual([]);
    expect(await names('admin')).toEqual(['Project A', 'Project B']);
  });

  it('hides another project behind 404, for real and guessed ids alike', async () => {
    const outsider = await signedInAgent(t.app, emailOf('outsider'), PASSWORD);
    const real = await outsider.get(`/api/projects/${world.projectA.id}`);
    const guessed = await outsider.get('/api/projects/00000000-0000-4000-8000-000000000000');
    const garbage = await outsider.get('/api/projects/not-an-id');
    expect([real.status, guessed.status, garbage.status]).toEqual([404, 404, 404]);
    expect(real.body).toEqual(guessed.body);
    expect((await outsider.get(`/api/lines/${world.lineA.id}`)).status).toBe(404);
  });

  it('shows a client the project and its people but not its lines', async () => {
    const client = await signedInAgent(t.app, emailOf('client'), PASSWORD);
    const res = await client.get(`/api/projects/${world.projectA.id}`);
    expect(res.status).toBe(200);
    expect(res.body.myRole).toBe('client');
    expect(res.body.lines).toEqual([]);
    expect(res.body.members).toHaveLength(4);
    expect((await client.get(`/api/lines/${world.lineA.id}`)).status).toBe(403);
  });

  it('lets a lead create a project (and lead it), add and remove members, with an audit trail', async () => {
    const lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
    const created = await lead.post('/api/projects').set('X-CSRF-Token', lead.csrf).send({ name: 'Cutting C', site: 'Km 12', clientOrganisation: 'Roads' });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ name: 'Cutting C', status: 'active', myRole: 'lead' });
    const pid = created.body.id;
    const add = await lead.post(`/api/projects/${pid}/members`).set('X-CSRF-Token', lead.csrf).send({ userId: world.loner.id, role: 'field_tech' });
    expect(add.status).toBe(201);
    const again = await lead.post(`/api/projects/${pid}/members`).set('X-CSRF-Token', lead.csrf).send({ userId: world.loner.id, role: 'client' });
    expect(again.status).toBe(409);
    const badRole = await lead.post(`/api/projects/${pid}/members`).set('X-CSRF-Token', lead.csrf).send({ userId: world.loner.id, role: 'owner' });
    expect(badRole.status).toBe(400);
    expect(badRole.body.issues[0].path).toBe('role');
    const loner = await signedInAgent(t.app, emailOf('loner'), PASSWORD);
    expect((await loner.get(`/api/projects/${pid}`)).body.myRole).toBe('field_tech');
    expect((await lead.delete(`/api/projects/${pid}/members/${world.loner.id}`).set('X-CSRF-Token', lead.csrf)).status).toBe(204);
    expect((await loner.get(`/api/projects/${pid}`)).status).toBe(404);
    // The only lead cannot remove themself.
    const last = await lead.delete(`/api/projects/${pid}/members/${world.users.lead.id}`).set('X-CSRF-Token', lead.csrf);
    expect(last.status).toBe(409);
    const trail = await dataSource.query(`SELECT action, actor_id FROM audit_log WHERE project_id = $1 ORDER BY id`, [pid]);
    expect(trail.map((r: { action: string }) => r.action)).toEqual(['project.create', 'project.member.add', 'project.member.remove']);
    expect(new Set(trail.map((r: { actor_id: string }) => r.actor_id))).toEqual(new Set([world.users.lead.id]));
  });

  it('changes a member\'s role in place (issue 17 item 5): access follows at once, the last lead stays, bad roles refused', async () => {
    const lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
    const created = await lead.post('/api/projects').set('X-CSRF-Token', lead.csrf).send({ name: 'Cutting D', site: 'Km 14', clientOrganisation: 'Roads' });
    const pid = created.body.id;
    await lead.post(`/api/projects/${pid}/members`).set('X-CSRF-Token', lead.csrf).send({ userId: world.loner.id, role: 'client' }).expect(201);
    const loner = await signedInAgent(t.app, emailOf('loner'), PASSWORD);
    expect((await loner.get(`/api/projects/${pid}`)).body.myRole).toBe('client');
    const url = `/api/projects/${pid}/members/${world.loner.id}`;
    const changed = await lead.patch(url).set('X-CSRF-Token', lead.csrf).send({ role: 'geophysicist' });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ userId: world.loner.id, role: 'geophysicist' });
    // The member's next request already has the new role (a client could not create a line; a geophysicist can).
    expect((await loner.get(`/api/projects/${pid}`)).body.myRole).toBe('geophysicist');
    expect((await loner.post(`/api/projects/${pid}/lines`).set('X-CSRF-Token', loner.csrf).send({ name: 'D-1' })).status).toBe(201);

    const bad = await lead.patch(url).set('X-CSRF-Token', lead.csrf).send({ role: 'owner' });
    expect(bad.status).toBe(400);
    expect(bad.body.issues[0].path).toBe('role');
    const lastLead = await lead.patch(`/api/projects/${pid}/members/${world.users.lead.id}`).set('X-CSRF-Token', lead.csrf).send({ role: 'geophysicist' });
    expect(lastLead.status).toBe(409);
    expect(lastLead.body.error).toBe('last_lead');
    const stranger = await lead.patch(`/api/projects/${pid}/members/${world.users.client.id}`).set('X-CSRF-Token', lead.csrf).send({ role: 'lead' });
    expect(stranger.status).toBe(404);

    // Two leads: one may hand the lead over and step down.
    await lead.patch(url).set('X-CSRF-Token', lead.csrf).send({ role: 'lead' }).expect(200);
    await lead.patch(`/api/projects/${pid}/members/${world.users.lead.id}`).set('X-CSRF-Token', lead.csrf).send({ role: 'geophysicist' }).expect(200);
    const trail = await dataSource.query(`SELECT detail FROM audit_log WHERE project_id = $1 AND action = 'project.member.role' ORDER BY id`, [pid]);
    expect(trail.map((r: { detail: unknown }) => r.detail)).toEqual([{ from: 'client', to: 'geophysicist' }, { from: 'geophysicist', to: 'lead' }, { from: 'lead', to: 'geophysicist' }]);
  });

  it('keeps a velocity colour range per project (issue 17 item 6): default, changed by the lead, bad ranges refused in plain words', async () => {
    const lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
    const path = `/api/projects/${world.projectA.id}`;
    expect((await lead.get(path)).body.velocityColours).toEqual({ min: 200, max: 5000 });
    const changed = await lead.patch(path).set('X-CSRF-Token', lead.csrf).send({ velocityColours: { min: 300, max: 4500 } });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ name: 'Project A', velocityColours: { min: 300, max: 4500 } });
    const geophysicist = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
    expect((await geophysicist.get(path)).body.velocityColours).toEqual({ min: 300, max: 4500 });
    const upsideDown = await lead.patch(path).set('X-CSRF-Token', lead.csrf).send({ velocityColours: { min: 3000, max: 1000 } });
    expect(upsideDown.status).toBe(400);
    expect(upsideDown.body.issues).toEqual([{ path: 'velocityColours.max', message: 'the fast end of the colour range must be above the slow end' }]);
    const tooFast = await lead.patch(path).set('X-CSRF-Token', lead.csrf).send({ velocityColours: { min: 300, max: 40000 } });
    expect(tooFast.body.issues[0].message).toBe('the fast end of the colour range must be at most 10000 m/s');
    expect((await lead.patch(path).set('X-CSRF-Token', lead.csrf).send({})).status).toBe(400);
    expect((await lead.patch(path).set('X-CSRF-Token', lead.csrf).send({ owner: 'me' })).status).toBe(400);
    expect((await lead.get(path)).body.velocityColours).toEqual({ min: 300, max: 4500 });
    const [entry] = await dataSource.query(`SELECT detail FROM audit_log WHERE action = 'project.update' AND project_id = $1 ORDER BY id DESC LIMIT 1`, [world.projectA.id]);
    expect(entry.detail.velocityColours).toEqual({ from: { min: 200, max: 5000 }, to: { min: 300, max: 4500 } });
  });

  it('creates survey lines for staff, refuses duplicates and unknown fields', async () => {
    const tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
    const url = `/api/projects/${world.projectA.id}/lines`;
    const ok = await tech.post(url).set('X-CSRF-Token', tech.csrf).send({ name: 'A-2', notes: 'north bench' });
    expect(ok.status).toBe(201);
    expect((await tech.get(`/api/lines/${ok.body.id}`)).body).toMatchObject({ name: 'A-2', notes: 'north bench', stations: [] });
    expect((await tech.post(url).set('X-CSRF-Token', tech.csrf).send({ name: 'A-2' })).status).toBe(409);
    const unknown = await tech.post(url).set('X-CSRF-Token', tech.csrf).send({ name: 'A-3', colour: 'red' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error).toBe('validation_failed');
    const empty = await tech.post(url).set('X-CSRF-Token', tech.csrf).send({ name: '   ' });
    expect(empty.body.issues).toEqual([{ path: 'name', message: 'is required' }]);
  });
});

describe('accounts (admin)', () => {
  let t: TestApp;
  let world: World;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
  });
  afterAll(async () => t?.close());

  it('creates, lists and updates accounts without ever showing a password hash', async () => {
    const admin = await signedInAgent(t.app, emailOf('admin'), PASSWORD);
    const created = await admin.post('/api/users').set('X-CSRF-Token', admin.csrf).send({ email: 'New.Person@World.test', name: 'New Person', password: 'long-enough-pw' });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ email: 'new.person@world.test', globalRole: null, active: true });
    const dup = await admin.post('/api/users').set('X-CSRF-Token', admin.csrf).send({ email: 'new.person@world.test', name: 'Again', password: 'long-enough-pw' });
    expect(dup.status).toBe(409);
    const short = await admin.post('/api/users').set('X-CSRF-Token', admin.csrf).send({ email: 'x@world.test', name: 'X', password: 'short' });
    expect(short.body.issues).toEqual([{ path: 'password', message: 'must be at least 10 characters' }]);
    const list = await admin.get('/api/users');
    expect(list.body.length).toBe(8);
    expect(JSON.stringify(list.body)).not.toMatch(/scrypt|passwordHash|password_hash/);
    const patched = await admin.patch(`/api/users/${created.body.id}`).set('X-CSRF-Token', admin.csrf).send({ globalRole: 'admin', active: false });
    expect(patched.body).toMatchObject({ globalRole: 'admin', active: false });
    const self = await admin.patch(`/api/users/${world.users.admin.id}`).set('X-CSRF-Token', admin.csrf).send({ active: false });
    expect(self.status).toBe(409);
  });
});
