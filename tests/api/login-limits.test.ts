/**
 * Issue 16 item 8: a spray of failed sign-ins from one address is cut off before it costs a hash
 * per attempt, one account is protected across addresses, and the counters live in Redis so every
 * API process sees them. Numbers from server/auth/loginLimits.ts (30 per address, 10 per account,
 * per 15 minutes; the requirement, the numbers our choice). Addresses are from the
 * documentation ranges of RFC 5737 (TEST-NET-2 and -3).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { clearLoginLimits, LOGIN_LIMITS } from '../../server/auth/loginLimits';
import { createRedis } from '../../server/queue/connection';
import { anonymousAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld } from './support/world';

const SPRAYER = '203.0.113.7';
const HONEST = '198.51.100.9';

const login = (agent: Agent, from: string, email: string, password: string) =>
  agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).set('X-Forwarded-For', from).send({ email, password });

describe('sign-in limits per address and per account, shared through Redis', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
    t.app.set('trust proxy', 1); // as TRUST_PROXY=1 does: X-Forwarded-For gives each caller its address
    await resetWorld();
  });
  afterAll(async () => {
    await clearLoginLimits(t.redis);
    await t?.close();
  });

  it('answers 429 after the per-address limit to 200 different e-mails, and a correct sign-in elsewhere still works', async () => {
    const agent = await anonymousAgent(t.app);
    const statuses: number[] = [];
    for (let i = 0; i < 200; i++) statuses.push((await login(agent, SPRAYER, `nobody-${i}@spray.test`, `guess-${i}-x`)).status);
    const limit = LOGIN_LIMITS.perAddress.points;
    expect(statuses.slice(0, limit).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(limit).every((s) => s === 429)).toBe(true);
    const refused = await login(agent, SPRAYER, emailOf('lead'), PASSWORD);
    expect(refused.status).toBe(429);
    expect(refused.headers['retry-after']).toMatch(/^\d+$/);
    expect(refused.body.message).toMatch(/Too many failed sign-ins/);

    const honest = await anonymousAgent(t.app);
    expect((await login(honest, HONEST, emailOf('lead'), PASSWORD)).status).toBe(200);
  });

  it('limits one account across addresses', async () => {
    const agent = await anonymousAgent(t.app);
    const statuses: number[] = [];
    for (let i = 0; i <= LOGIN_LIMITS.perAccount.points; i++) {
      statuses.push((await login(agent, `192.0.2.${10 + i}`, emailOf('geophysicist'), `guess-${i}-x`)).status);
    }
    expect(statuses.slice(0, -1).every((s) => s === 401)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
    // Even the right password from a fresh address waits out the account's window.
    expect((await login(agent, '192.0.2.200', emailOf('geophysicist'), PASSWORD)).status).toBe(429);
    // A correct sign-in clears an account's failures: another account is not affected.
    expect((await login(agent, '192.0.2.201', emailOf('field_tech'), PASSWORD)).status).toBe(200);
  });

  it('keeps the counters in Redis: a second API instance refuses the same address at once', async () => {
    const redis2 = createRedis();
    if (redis2.status !== 'ready') await new Promise((resolve) => redis2.once('ready', resolve));
    try {
      const second = createApp({ redis: redis2, pgPool: t.pgPool, queue: t.queue, mailer: t.mailer, clientDir: '/nonexistent' });
      second.set('trust proxy', 1);
      const agent = await anonymousAgent(second);
      const res = await login(agent, SPRAYER, 'someone-new@spray.test', 'another-guess-1');
      expect(res.status).toBe(429);
      expect((await login(agent, HONEST, emailOf('client'), PASSWORD)).status).toBe(200);
    } finally {
      await redis2.quit();
    }
  });
});
