import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { anonymousAgent, signedInAgent, startTestApp, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

describe('sign-in, sessions and CSRF', () => {
  let t: TestApp;
  let world: World;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
  });
  afterAll(async () => t?.close());

  it('signs in, renews the session and reports the user with project roles', async () => {
    const agent = await anonymousAgent(t.app);
    const res = await agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).send({ email: 'LEAD@world.test ', password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ email: 'lead@world.test', globalRole: null, projectRoles: [{ projectId: world.projectA.id, role: 'lead' }] });
    expect(JSON.stringify(res.body)).not.toMatch(/password|scrypt/i);
    const cookie = res.headers['set-cookie']?.[0] ?? '';
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    // The old token belonged to the session before sign-in.
    const stale = await agent.post('/api/projects').set('X-CSRF-Token', agent.csrf).send({});
    expect(stale.status).toBe(403);
    expect(stale.body.error).toBe('csrf_failed');
    const fresh = (await agent.get('/api/auth/csrf')).body.token;
    expect((await agent.post('/api/projects').set('X-CSRF-Token', fresh).send({})).status).toBe(400);
  });

  it('says who is signed in, if anyone, without an error status for a signed-out visitor (issue 17 item 14)', async () => {
    const anon = await request(t.app).get('/api/auth/session');
    expect(anon.status).toBe(200);
    expect(anon.body).toEqual({ user: null });
    const geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
    const me = await geo.get('/api/auth/me');
    const session = await geo.get('/api/auth/session');
    expect(session.status).toBe(200);
    expect(session.body.user).toEqual(me.body); // the same presentation as /api/auth/me
  });

  it('answers a wrong password and an unknown e-mail with the same message', async () => {
    const agent = await anonymousAgent(t.app);
    const wrong = await agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).send({ email: emailOf('geophysicist'), password: 'not-the-password' });
    const unknown = await agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).send({ email: 'nobody@world.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error).toBe('invalid_credentials');
  });

  it('refuses state-changing requests without the CSRF token, sign-in included', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: emailOf('admin'), password: PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('csrf_failed');
    const agent = await signedInAgent(t.app, emailOf('admin'), PASSWORD);
    expect((await agent.post('/api/users').set('X-CSRF-Token', 'forged').send({})).status).toBe(403);
  });

  it('throttles repeated failures for one address and e-mail, then keeps refusing even the right password', async () => {
    const agent = await anonymousAgent(t.app);
    const statuses: number[] = [];
    for (let i = 0; i < 11; i++) {
      const r = await agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).send({ email: emailOf('field_tech'), password: `guess-${i}` });
      statuses.push(r.status);
    }
    expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
    expect(statuses[10]).toBe(429);
    const right = await agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).send({ email: emailOf('field_tech'), password: PASSWORD });
    expect(right.status).toBe(429);
    expect(right.body.message).toMatch(/Too many/);
    // Another account from the same address is not locked out by it.
    const other = await agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).send({ email: emailOf('client'), password: PASSWORD });
    expect(other.status).toBe(200);
  });

  it('rejects malformed bodies with 400 in the API error shape, without a stack trace', async () => {
    const agent = await anonymousAgent(t.app);
    const malformed = await agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).set('Content-Type', 'application/json').send('{"email": ');
    expect(malformed.status).toBe(400);
    expect(malformed.body).toEqual({ error: 'malformed_json', message: expect.any(String) });
    const wrongTypes = await agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).send({ email: 42, password: true, extra: 1 });
    expect(wrongTypes.status).toBe(400);
    expect(wrongTypes.body.error).toBe('validation_failed');
    expect(wrongTypes.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(['', 'email', 'password']);
    expect(JSON.stringify(wrongTypes.body)).not.toMatch(/at .*\.ts:\d+/);
  });

  it('answers unknown API routes with 404 JSON', async () => {
    const res = await request(t.app).get('/api/no/such/thing');
    expect(res.status).toBe(404);
    expect(res.body.error).toBe('not_found');
  });

  it('signs out, after which the session is gone', async () => {
    const agent = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    expect((await agent.post('/api/auth/logout').set('X-CSRF-Token', agent.csrf)).status).toBe(204);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('signs out a deactivated account on its next request and refuses its sign-in', async () => {
    const agent = await signedInAgent(t.app, emailOf('outsider'), PASSWORD);
    await dataSource.query('UPDATE users SET active = false WHERE id = $1', [world.users.outsider.id]);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    const again = await anonymousAgent(t.app);
    const res = await again.post('/api/auth/login').set('X-CSRF-Token', again.csrf).send({ email: emailOf('outsider'), password: PASSWORD });
    expect(res.status).toBe(401);
  });

  it('stores a salted scrypt hash, different for two accounts with the same password', async () => {
    const admin = await signedInAgent(t.app, emailOf('admin'), PASSWORD);
    for (const email of ['twin1@world.test', 'twin2@world.test']) {
      await admin.post('/api/users').set('X-CSRF-Token', admin.csrf).send({ email, name: email, password: 'same-password-1' }).expect(201);
    }
    const rows = await dataSource.query(`SELECT password_hash FROM users WHERE email IN ('twin1@world.test', 'twin2@world.test')`);
    const [a, b] = rows.map((r: { password_hash: string }) => r.password_hash);
    expect(a).toMatch(/^scrypt\$32768\$8\$1\$/);
    expect(a).not.toBe(b);
  });

  it('sends the usual security headers', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
