/**
 * Requests a careless user or an attacker sends (issue 16 items 1, 6 and 13): each gets a clear
 * 4xx (or 503 when a service is down) and never a 500; a large body is read only after the caller
 * is known to be allowed; an anonymous visitor costs no session row.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { dataSource } from '../../server/db/dataSource';
import { services } from './support/services';
import { anonymousAgent, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';


/**
 * Starts a POST of `announced` bytes, sends only the first MB, and resolves with the status as
 * soon as the server answers. A server that parsed the body first would never answer.
 */
function postHuge(port: number, urlPath: string, headers: Record<string, string>, announced = 60 * 1024 * 1024): Promise<{ status: number; ms: number }> {
  return new Promise((resolve, reject) => {
    const started = Date.now();
    const req = http.request({ host: '127.0.0.1', port, path: urlPath, method: 'POST', headers: { 'Content-Type': 'application/json', 'Content-Length': String(announced), ...headers } });
    req.on('response', (res) => {
      resolve({ status: res.statusCode ?? 0, ms: Date.now() - started });
      res.resume();
      req.destroy();
    });
    req.on('error', (err) => (err.message.includes('EPIPE') || err.message.includes('ECONNRESET') ? undefined : reject(err)));
    req.write('{"format":"timefield-model/1","velocity":[' + '1500,'.repeat(200_000));
    setTimeout(() => reject(new Error('no answer within 5 s: the body is being read before the caller is checked')), 5000);
  });
}

describe('hardening against careless and hostile requests', () => {
  let t: TestApp;
  let world: World;
  let server: http.Server;
  let port: number;
  let geo: Agent;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
    server = await new Promise((resolve) => {
      const s = t.app.listen(0, '127.0.0.1', () => resolve(s));
    });
    port = (server.address() as AddressInfo).port;
  });
  afterAll(async () => {
    await new Promise((r) => server?.close(r));
    await t?.close();
  });

  it('refuses big model bodies from anonymous and unauthorised callers without reading them, while health answers', async () => {
    const models = `/api/lines/${world.lineA.id}/models`;
    const anon = await anonymousAgent(t.app);
    const client = await signedInAgent(t.app, emailOf('client'), PASSWORD);
    const cookieOf = (agent: Agent) => (agent as unknown as { jar: { getCookies: (o: object) => { toValueString(): string }[] } }).jar
      .getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false }).map((c) => c.toValueString()).join('; ');
    const attempts = Promise.all([
      postHuge(port, models, {}), // no token at all
      postHuge(port, models, { Cookie: cookieOf(anon), 'X-CSRF-Token': anon.csrf }), // anonymous with a good token: 401
      postHuge(port, models, { Cookie: cookieOf(client), 'X-CSRF-Token': client.csrf }), // a client: signed in, not allowed
      postHuge(port, models, {}),
    ]);
    const health = await request(server).get('/api/health');
    expect(health.status).not.toBe(500);
    const answers = await attempts;
    expect(answers.map((a) => a.status)).toEqual([403, 401, 403, 403]);
  }, 30_000);

  it('still takes a large model file from a geophysicist', async () => {
    const nx = 400, nz = 300; // 120 000 velocities, about 700 kB… and a 1.4 MB body with the comment below
    const model = { format: 'timefield-model/1', grid: { x0: 0, dx: 0.1, nx, z0: 0, dz: 0.1, nz }, velocity: new Array(nx * nz).fill(1234.567891) };
    const res = await geo.post(`/api/lines/${world.lineA.id}/models`).set('X-CSRF-Token', geo.csrf).send(model);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  }, 30_000);

  it('answers 400 for a NUL character in a name, a note and the sign-in e-mail', async () => {
    const line = await geo.post(`/api/projects/${world.projectA.id}/lines`).set('X-CSRF-Token', geo.csrf).send({ name: 'A\u0000B' });
    expect(line.status).toBe(400);
    expect(line.body.issues[0].path).toBe('name');
    const note = await geo.post(`/api/projects/${world.projectA.id}/lines`).set('X-CSRF-Token', geo.csrf).send({ name: 'ok', notes: 'x\u0000' });
    expect(note.status).toBe(400);
    const anon = await anonymousAgent(t.app);
    const login = await anon.post('/api/auth/login').set('X-CSRF-Token', anon.csrf).send({ email: 'geo\u0000@x.test', password: 'whatever-it-is' });
    expect(login.status).toBe(400);
    const query = await geo.post(`/api/lines/${world.lineA.id}/models?name=a%00b`).set('X-CSRF-Token', geo.csrf).send({});
    expect(query.status).toBe(400);
  });

  it('answers 400 for a body nested 3 000 levels deep', async () => {
    const deep = '['.repeat(3000) + ']'.repeat(3000);
    const res = await geo.post(`/api/projects/${world.projectA.id}/lines`).set('X-CSRF-Token', geo.csrf).set('Content-Type', 'application/json').send(`{"name":"deep","notes":${deep}}`);
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/nests deeper/);
  });

  it('answers 400 for control characters in an uploaded file name', async () => {
    const tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
    const res = await tech.post(`/api/lines/${world.lineA.id}/picksets`).set('X-CSRF-Token', tech.csrf)
      .attach('file', Buffer.from('shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms\nA,0,,6,,10,0.5\n'), 'bad\u0007name.picks.csv');
    expect(res.status).toBe(400);
    expect(['bad_file_name', 'bad_upload']).toContain(res.body.error);
  });

  it('answers 400 for a malformed address outside the API', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'tf-client-'));
    writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>t</title>');
    const app = createApp({ redis: t.redis, pgPool: t.pgPool, queue: t.queue, mailer: t.mailer, clientDir: dir });
    const res = await request(app).get('/%E0%A4%A');
    expect(res.status).toBe(400);
  });

  it('answers 409 to the second of two parallel creations of the same line name', async () => {
    const create = () => geo.post(`/api/projects/${world.projectA.id}/lines`).set('X-CSRF-Token', geo.csrf).send({ name: 'Twin' });
    const answers = (await Promise.all([create(), create(), create()])).map((r) => r.status).sort();
    expect(answers).toEqual([201, 409, 409]);
  });

  it('keeps no session row for anonymous visitors, and their token still signs them in', async () => {
    const before = (await dataSource.query('SELECT count(*)::int AS n FROM session'))[0].n;
    for (let i = 0; i < 20; i++) await request(t.app).get('/api/auth/csrf').expect(200);
    const anon = await anonymousAgent(t.app);
    expect((await dataSource.query('SELECT count(*)::int AS n FROM session'))[0].n).toBe(before);
    await anon.post('/api/auth/login').set('X-CSRF-Token', anon.csrf).send({ email: emailOf('lead'), password: PASSWORD }).expect(200);
    // A token made for one visitor's cookie is no use with another's.
    const other = await anonymousAgent(t.app);
    const stolen = await other.post('/api/auth/login').set('X-CSRF-Token', anon.csrf).send({ email: emailOf('lead'), password: PASSWORD });
    expect(stolen.status).toBe(403);
  });

  it('answers 503 (not 500) while PostgreSQL is down, and hands out working anonymous tokens', async () => {
    services('stop_postgres');
    try {
      const projects = await geo.get('/api/projects');
      expect(projects.status).toBe(503);
      expect(projects.body.error).toBe('database_unavailable');
      const csrf = await request(t.app).get('/api/auth/csrf');
      expect(csrf.status).toBe(200);
    } finally {
      services('start_postgres');
    }
    await new Promise((r) => setTimeout(r, 500));
  }, 60_000);
});
