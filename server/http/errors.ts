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

/** Last handler: the API.md error shape, never a stack trace. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof ZodError) err = validationError(err);
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
  console.error(err);
  res.status(500).json({ error: 'internal', message: 'Something went wrong on the server. The error has been logged.' });
};
