import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';

export interface ApiIssue {
  path?: string;
  message: string;
  line?: number;
  column?: string;
}

/** An error that becomes the API.md error shape: { error, message, issues? }. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: ApiIssue[],
  ) {
    super(message);
  }
}

/** zod path ['layers', 1, 'base', 3] → 'layers[1].base[3]'. */
export function formatPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((out, key) => (typeof key === 'number' ? `${out}[${key}]` : out ? `${out}.${String(key)}` : String(key)), '');
}

export function validationError(err: ZodError, status = 400): HttpError {
  const issues = err.issues.map((i) => ({ path: formatPath(i.path), message: i.message }));
  const first = issues[0];
  const message = first ? `${first.path ? `${first.path}: ` : ''}${first.message}` : 'The request is not valid.';
  return new HttpError(status, 'validation_failed', message, issues);
}

export const notFoundApi: RequestHandler = (req, _res, next) =>
  next(new HttpError(404, 'not_found', `No such API route: ${req.method} ${req.path}`));

/** Last handler: the API.md error shape, never a stack trace, never a 500 for input. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) {
    // E.g. a session that could not be saved after the answer went out: nothing more to send.
    console.error(`[api] after the response to ${req.method} ${req.path}: ${(err as Error)?.message ?? err}`);
    return;
  }
  if (err instanceof ZodError) err = validationError(err);
  err = fromDatabase(err) ?? err;
  // The request body was not read (refused before parsing): close the connection instead of draining it.
  if (!req.complete && err instanceof HttpError) res.set('Connection', 'close');
  if (err instanceof HttpError) {
    res.status(err.status).json({ error: err.code, message: err.message, ...(err.issues ? { issues: err.issues } : {}) });
    return;
  }
  // body-parser: malformed JSON or a body that is too large.
  if (err?.type === 'entity.parse.failed') {
    res.status(400).json({ error: 'malformed_json', message: 'The request body is not valid JSON.' });
    return;
  }
  if (err?.type === 'entity.too.large') {
    res.status(413).json({ error: 'too_large', message: 'The request body is too large.' });
    return;
  }
  // Express, the router and the static server mark client errors (a malformed URL: 400) with a status.
  if (Number.isInteger(err?.status) && err.status >= 400 && err.status < 500) {
    res.status(err.status).json({ error: 'bad_request', message: err.status === 400 ? 'The request could not be read (for example a malformed address).' : String(err.message ?? 'The request was refused.') });
    return;
  }
  console.error(err);
  res.status(500).json({ error: 'internal', message: 'Something went wrong on the server. The error has been logged.' });
};

/** PostgreSQL and connection errors that say something about the request or the service, as API errors. */
export function fromDatabase(err: unknown): HttpError | null {
  const e = err as { code?: string; message?: string; driverError?: { code?: string } } | null;
  const code = e?.driverError?.code ?? e?.code;
  const message = e?.message ?? '';
  switch (code) {
    case '23505': // unique_violation: two creations of the same name, one after the other or at once
      return new HttpError(409, 'already_exists', 'Something with the same name already exists here. Choose another name, or reload to see it.');
    case '23503': // foreign_key_violation: it refers to something that was removed meanwhile
      return new HttpError(409, 'conflict', 'This refers to something that no longer exists. Reload the page and try again.');
    case '22021': // a NUL byte in text
    case '22P05': // \u0000 in JSON
      return new HttpError(400, 'invalid_text', 'Text may not contain NUL or other control characters.');
    case 'ECONNREFUSED': case 'ECONNRESET': case 'ETIMEDOUT': case 'ENOTFOUND':
    case '57P01': case '57P02': case '57P03': case '53300': case '08000': case '08001': case '08003': case '08006':
      return databaseUnavailable();
  }
  if (/Connection terminated|connection is closed|timeout exceeded when trying to connect|Client has encountered a connection error/i.test(message)) return databaseUnavailable();
  return null;
}

const databaseUnavailable = () =>
  new HttpError(503, 'database_unavailable', 'The database cannot be reached just now. Nothing was changed; try again in a minute.');
