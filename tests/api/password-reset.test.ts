/**
 * Password reset by one-time link (issue 17 item 3): the administrator starts it, the owner gets the
 * link by mail, sets a new password once, and every old session ends; the link cannot be used twice,
 * an older link dies when a newer one is sent, and no one else can start a reset. The rules are the
 * issue's; the 24-hour life is checked by moving the stored expiry (common practice for reset links,
 * no source).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { anonymousAgent, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

describe('password reset by one-time link', () => {
  let t: TestApp;
  let world: World;
  let admin: Agent;
  const NEW_PASSWORD = 'moorland-granite-quarry-7';

  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    admin = await signedInAgent(t.app, emailOf('admin'), PASSWORD);
  }, 60_000);
  afterAll(async () => t?.close());

  const outbox = async () => (await admin.get('/api/outbox').expect(200)).body as { to: string[]; subject: string; body: string }[];
  const tokenIn = (body: string): string => /#token=([\w-]+)/.exec(body)![1];
  const send = async () => {
    const res = await admin.post(`/api/users/${world.loner.id}/password-reset`).set('X-CSRF-Token', admin.csrf);
    expect(res.status).toBe(202);
    const mail = (await outbox()).filter((m) => m.to.includes(emailOf('loner')) && m.subject === 'Set a new Timefield password').at(-1)!;
    return tokenIn(mail.body);
  };
  const finish = async (token: string, newPassword = NEW_PASSWORD) => {
    const anon = await anonymousAgent(t.app);
    return anon.post('/api/auth/password-reset').set('X-CSRF-Token', anon.csrf).send({ token, newPassword });
  };

  it('mails the owner a link that sets a new password once and ends their sessions', async () => {
    const session = await signedInAgent(t.app, emailOf('loner'), PASSWORD);
    const res = await admin.post(`/api/users/${world.loner.id}/password-reset`).set('X-CSRF-Token', admin.csrf);
    expect(res.status).toBe(202);
    expect(res.body.sentTo).toBe(emailOf('loner'));
    expect(Date.parse(res.body.expiresAt) - Date.now()).toBeGreaterThan(23.9 * 3600_000);
    const mail = (await outbox()).filter((m) => m.to.includes(emailOf('loner'))).at(-1)!;
    const token = tokenIn(mail.body);
    // Only a hash of the token is stored.
    const stored = await dataSource.query('SELECT token_hash FROM password_resets WHERE user_id = $1', [world.loner.id]);
    expect(stored.some((r: { token_hash: string }) => r.token_hash.includes(token))).toBe(false);

    // A weak password is refused with its field; the link is not used up by that.
    const weak = await finish(token, 'short');
    expect(weak.status).toBe(400);
    expect(weak.body.issues[0].path).toBe('newPassword');

    expect((await finish(token)).status).toBe(204);
    expect((await session.get('/api/auth/me')).status).toBe(401); // the old session ended
    await signedInAgent(t.app, emailOf('loner'), NEW_PASSWORD);
    const anon = await anonymousAgent(t.app);
    expect((await anon.post('/api/auth/login').set('X-CSRF-Token', anon.csrf).send({ email: emailOf('loner'), password: PASSWORD })).status).toBe(401);

    // Used once: the same link again is refused in plain words.
    const again = await finish(token, 'another-good-password-9');
    expect(again.status).toBe(400);
    expect(again.body.error).toBe('invalid_reset_link');
    expect(again.body.message).toMatch(/Ask your administrator for a new one/);
  });

  it('a newer link replaces an older one; an expired link is refused', async () => {
    const older = await send();
    const newer = await send();
    expect((await finish(older, 'older-link-password-1')).status).toBe(400);
    await dataSource.query(`UPDATE password_resets SET expires_at = now() - interval '1 minute' WHERE user_id = $1 AND used_at IS NULL`, [world.loner.id]);
    expect((await finish(newer, 'newer-link-password-2')).status).toBe(400);
  });

  it('only an administrator starts a reset; unknown and deactivated accounts are refused', async () => {
    const lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
    expect((await lead.post(`/api/users/${world.loner.id}/password-reset`).set('X-CSRF-Token', lead.csrf)).status).toBe(403);
    expect((await admin.post('/api/users/00000000-0000-4000-8000-000000000000/password-reset').set('X-CSRF-Token', admin.csrf)).status).toBe(404);
    await admin.patch(`/api/users/${world.loner.id}`).set('X-CSRF-Token', admin.csrf).send({ active: false }).expect(200);
    const inactive = await admin.post(`/api/users/${world.loner.id}/password-reset`).set('X-CSRF-Token', admin.csrf);
    expect(inactive.status).toBe(409);
    expect(inactive.body.error).toBe('account_inactive');
  });
});
