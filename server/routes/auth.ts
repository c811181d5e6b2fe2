import { Router, type Request, type Response } from 'express';
import type { Redis } from 'ioredis';
import { changePasswordBody, finishPasswordResetBody, loginBody } from '../../shared/schemas/accounts';
import { config } from '../config';
import { csrfTokenFor, startSessionToken } from '../auth/csrf';
import { createLoginLimits, type LoginLimits } from '../auth/loginLimits';
import { checkCredentials } from '../auth/passport';
import { hashingBacklogFull } from '../auth/password';
import { DEMO_PASSWORD } from '../../fixtures/demo/scenario';
import { dataSource } from '../db/dataSource';
import { HttpError } from '../http/errors';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { presentMe } from '../presenters/me';
import { audit } from '../services/audit';
import { changeOwnPassword } from '../services/users';
import { finishPasswordReset } from '../services/passwordResets';

const invalidCredentials = () => new HttpError(401, 'invalid_credentials', 'The e-mail or password is not right.');

/** Refused before any password is hashed: used-up limits (429) or a full hashing queue (503). */
async function admitAttempt(limits: LoginLimits, req: Request, res: Response, email: string): Promise<void> {
  // A full queue first, so a 503 costs the caller none of their attempts.
  if (hashingBacklogFull()) throw new HttpError(503, 'busy', 'Sign-in is busy right now. Try again in a few seconds.');
  const waitSeconds = await limits.reserve(req.ip ?? '', email);
  if (waitSeconds !== null) {
    res.set('Retry-After', String(waitSeconds));
    throw new HttpError(429, 'too_many_attempts', `Too many failed sign-ins. Wait ${Math.ceil(waitSeconds / 60)} minutes and try again.`);
  }
}

export function authRouter(redis: Redis): Router {
  const r = Router();
  const limits = createLoginLimits(redis);

  r.get('/auth/csrf', authorize('auth.csrf'), (req, res) => {
    res.json({ token: csrfTokenFor(req, res) });
  });

  r.post('/auth/login', authorize('auth.login'), async (req, res) => {
    const body = parse(loginBody, req.body);
    await admitAttempt(limits, req, res, body.email);
    // The demo scenario's published password opens nothing outside local demo mode.
    const demoRefused = !config.demoMode && body.password === DEMO_PASSWORD;
    const user = demoRefused ? null : await checkCredentials(body.email, body.password);
    if (!user) {
      await audit(dataSource.manager, { actorId: null, action: 'auth.login_failed', objectType: 'user', detail: { email: body.email, demoPasswordRefused: demoRefused || undefined } });
      throw invalidCredentials();
    }
    await limits.succeeded(req.ip ?? '', body.email);
    // passport 0.7 regenerates the session here, so the CSRF token must be fetched again.
    await new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
    startSessionToken(req);
    await audit(dataSource.manager, { actorId: user.id, action: 'auth.login', objectType: 'user', objectId: user.id });
    res.json(await presentMe(user));
  });

  r.post('/auth/logout', authorize('auth.logout'), async (req, res) => {
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie('tf.sid');
    res.status(204).end();
  });

  r.get('/auth/me', authorize('auth.me'), async (req, res) => {
    res.json(await presentMe(req.user!));
  });

  // Who is signed in, if anyone: the pages ask this on every load, and a signed-out visitor is an
  // expected answer (200, user null), not an error in the browser's console.
  r.get('/auth/session', authorize('auth.session'), async (req, res) => {
    res.json({ user: req.user ? await presentMe(req.user) : null });
  });

  // A signed-in user's own password; guessing the current one counts against the sign-in limits.
  r.post('/auth/password', authorize('auth.password.change'), async (req, res) => {
    const body = parse(changePasswordBody, req.body);
    const user = req.user!;
    await changeOwnPassword(user, req.sessionID, body, () => admitAttempt(limits, req, res, user.email));
    await limits.succeeded(req.ip ?? '', user.email);
    res.status(204).end();
  });

  // A new password from a one-time link an administrator had sent (services/passwordResets.ts).
  r.post('/auth/password-reset', authorize('auth.password.reset'), async (req, res) => {
    await finishPasswordReset(parse(finishPasswordResetBody, req.body));
    res.status(204).end();
  });

  return r;
}
