import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { config } from '../config';
import { HttpError } from '../http/errors';

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
/** Cookie holding an anonymous caller's random nonce; the token is its keyed hash. */
const NONCE_COOKIE = 'tf.csrf';

/**
 * The CSRF token of this caller. Signed in: the session's synchronizer token (made at sign-in, so
 * reading it never writes the session). Anonymous: a signed double-submit token (OWASP CSRF
 * Prevention Cheat Sheet, "Signed Double-Submit Cookie") — an HMAC of a random nonce kept in a
 * cookie — so an anonymous visitor costs no session row and needs no database.
 */
export function csrfTokenFor(req: Request, res: Response): string {
  if (req.user) return (req.session.csrfToken ??= newToken());
  let nonce = readCookie(req, NONCE_COOKIE);
  if (!nonce || !/^[\w-]{32}$/.test(nonce)) {
    nonce = newToken();
    res.cookie(NONCE_COOKIE, nonce, { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, path: '/' });
  }
  return anonymousToken(nonce);
}

/** Gives a new session its token at sign-in (the session is saved with the sign-in anyway). */
export function startSessionToken(req: Request): void {
  req.session.csrfToken = newToken();
}

/** Every state-changing request must echo the caller's token in X-CSRF-Token. */
export const requireCsrfToken: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  const sent = req.get('x-csrf-token') ?? '';
  const nonce = readCookie(req, NONCE_COOKIE);
  const expected = req.user ? (req.session?.csrfToken ?? '') : nonce ? anonymousToken(nonce) : '';
  if (!same(sent, expected)) return next(new HttpError(403, 'csrf_failed', 'The form has expired or did not come from Timefield. Reload the page and try again.'));
  next();
};

const newToken = () => randomBytes(24).toString('base64url');
const anonymousToken = (nonce: string) => createHmac('sha256', config.sessionSecret).update(`anonymous-csrf:${nonce}`).digest('base64url');
const same = (a: string, b: string) => b.length > 0 && a.length === b.length && timingSafeEqual(Buffer.from(a), Buffer.from(b));

function readCookie(req: Request, name: string): string | undefined {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return part.slice(eq + 1).trim();
  }
  return undefined;
}
