/**
 * Issue 16 item 7: behind a TLS-terminating proxy (TRUST_PROXY set) the session cookie is Secure,
 * sign-in works, HSTS is sent; outside local demo mode the demo seed and the demo password are refused.
 * Expected behaviour from the issue; cookie attributes per RFC 6265 §4.1.2.5, HSTS per RFC 6797 §6.1.
 */
import { spawnSync } from 'node:child_process';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../fixtures/demo/scenario';
import { config } from '../../server/config';
import { hashPassword } from '../../server/auth/password';
import { dataSource } from '../../server/db/dataSource';
import { startTestApp, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld } from './support/world';

describe('running behind a TLS-terminating proxy', () => {
  let t: TestApp;
  beforeAll(async () => {
    // What TRUST_PROXY=1 sets (server/config.ts): one proxy hop, Secure cookies, not demo mode.
    config.trustProxy = 1;
    config.cookieSecure = true;
    config.demoMode = false;
    t = await startTestApp();
    await resetWorld();
  });
  afterAll(async () => t?.close());

  /** A browser behind the proxy: https as seen by the proxy, cookies carried by hand (supertest's jar keeps Secure cookies off http). */
  async function signInThroughProxy(email: string, password: string) {
    const https = (r: request.Test) => r.set('X-Forwarded-Proto', 'https').set('X-Forwarded-For', '198.51.100.20');
    const csrf = await https(request(t.app).get('/api/auth/csrf'));
    const anonCookie = (csrf.headers['set-cookie'] as unknown as string[])[0].split(';')[0];
    const login = await https(request(t.app).post('/api/auth/login')).set('Cookie', anonCookie).set('X-CSRF-Token', csrf.body.token).send({ email, password });
    return { login, https };
  }

  it('sets a Secure session cookie over forwarded https and the session works', async () => {
    const csrf = await request(t.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
    // An anonymous visitor gets the cookie of the signed double-submit token (no session yet).
    const setCookie = (csrf.headers['set-cookie'] as unknown as string[])[0];
    expect(setCookie).toMatch(/^tf\.csrf=/);
    expect(setCookie).toMatch(/;\s*Secure/i);

    const { login, https } = await signInThroughProxy(emailOf('lead'), PASSWORD);
    expect(login.status).toBe(200);
    const sessionCookie = (login.headers['set-cookie'] as unknown as string[])[0];
    expect(sessionCookie).toMatch(/;\s*Secure/i);
    const me = await https(request(t.app).get('/api/auth/me')).set('Cookie', sessionCookie.split(';')[0]);
    expect(me.status).toBe(200);
    expect(me.body.email).toBe(emailOf('lead'));
  });

  it('sends HSTS', async () => {
    const res = await request(t.app).get('/api/health').set('X-Forwarded-Proto', 'https');
    expect(res.headers['strict-transport-security']).toMatch(/max-age=\d{7,}/);
  });

  it('refuses the demo password outside local demo mode, even on an account that has it', async () => {
    await dataSource.query('UPDATE users SET password_hash = $1 WHERE email = $2', [await hashPassword(DEMO_PASSWORD), emailOf('client')]);
    const { login } = await signInThroughProxy(emailOf('client'), DEMO_PASSWORD);
    expect(login.status).toBe(401);
    expect(login.body.error).toBe('invalid_credentials');
  });

  it('refuses the demo seed outside local demo mode and seeds nothing', () => {
    const seed = (env: Record<string, string>, ...args: string[]) =>
      spawnSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts', ...args], { env: { ...process.env, TF_DEMO: '', ...env }, encoding: 'utf8', timeout: 60_000 });
    const behindProxy = seed({ HOST: '127.0.0.1', TRUST_PROXY: '1' });
    expect(behindProxy.status).toBe(2);
    expect(behindProxy.stderr).toMatch(/refused.*local demo mode/);
    const openHost = seed({ HOST: '0.0.0.0' });
    expect(openHost.status).toBe(2);
    // npm start asks with --only-in-demo-mode: skipped with a note, not an error.
    const fromStart = seed({ HOST: '0.0.0.0' }, '--only-in-demo-mode');
    expect(fromStart.status).toBe(0);
    expect(fromStart.stderr).toMatch(/skipped/);
  });

  it('seeded nothing when refused', async () => {
    const rows = await dataSource.query(`SELECT count(*)::int AS n FROM users WHERE email LIKE '%@timefield.test'`);
    expect(rows[0].n).toBe(0);
  });
});
