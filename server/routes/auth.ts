import { Router } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { loginBody } from '../../shared/schemas/accounts';
import { csrfTokenFor } from '../auth/csrf';
import { checkCredentials } from '../auth/passport';
import { dataSource } from '../db/dataSource';
import { HttpError } from '../http/errors';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { presentMe } from '../presenters/me';
import { audit } from '../services/audit';

// Failed sign-ins per address and e-mail; successful ones do not count.
const loginLimiter = rateLimit({
  windowMs: 15 * 60 * 1000,
  limit: 10,
  skipSuccessfulRequests: true,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').trim().toLowerCase()}`,
  handler: (_req, res) =>
    res.status(429).json({ error: 'too_many_attempts', message: 'Too many failed sign-ins. Wait 15 minutes and try again.' }),
});

export function authRouter(): Router {
  const r = Router();

  r.get('/auth/csrf', authorize('auth.csrf'), (req, res) => {
    res.json({ token: csrfTokenFor(req.session) });
  });

  r.post('/auth/login', authorize('auth.login'), loginLimiter, async (req, res) => {
    const body = parse(loginBody, req.body);
    const user = await checkCredentials(body.email, body.password);
    if (!user) {
      await audit(dataSource.manager, { actorId: null, action: 'auth.login_failed', objectType: 'user', detail: { email: body.email } });
      throw new HttpError(401, 'invalid_credentials', 'The e-mail or password is not right.');
    }
    // passport 0.7 regenerates the session here, so the CSRF token must be fetched again.
    await new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
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

  return r;
}
