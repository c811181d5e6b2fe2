import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { HttpError } from '../http/errors';

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The synchronizer token of this session, made on first request. */
export function csrfTokenFor(session: Express.Request['session']): string {
  session.csrfToken ??= randomBytes(24).toString('base64url');
  return session.csrfToken;
}

/** Every state-changing request must echo the session's token in X-CSRF-Token. */
export const requireCsrfToken: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  const sent = req.get('x-csrf-token') ?? '';
  const expected = req.session?.csrfToken ?? '';
  const ok = expected.length > 0 && sent.length === expected.length && timingSafeEqual(Buffer.from(sent), Buffer.from(expected));
  if (!ok) return next(new HttpError(403, 'csrf_failed', 'The form has expired or did not come from Timefield. Reload the page and try again.'));
  next();
};
