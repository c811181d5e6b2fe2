import type { RequestHandler } from 'express';
import { HttpError } from './errors';

/** Deeper than any Timefield body (a model file nests 5 levels); 3 000 levels is an attack or a bug. */
export const MAX_BODY_DEPTH = 32;
/** NUL and the other C0 controls except tab, line feed and carriage return, and DEL. */
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;

/**
 * Refuses, with the JSON path, a body or query that nests too deeply or holds a string (or key) with
 * control characters (PostgreSQL stores no NUL; nobody types the others): 400, before any route runs.
 * Iterative, so a hostile depth cannot overflow the stack.
 */
export const checkBodyShape: RequestHandler = (req, _res, next) => {
  const problem = inspect(req.body, 'body') ?? inspect(req.query, 'query');
  next(problem ? new HttpError(400, 'invalid_body', `${problem.path}: ${problem.message}`, [{ path: problem.path, message: problem.message }]) : undefined);
};

export function inspect(root: unknown, rootName: string): { path: string; message: string } | null {
  const stack: { value: unknown; path: string; depth: number }[] = [{ value: root, path: '', depth: 0 }];
  while (stack.length) {
    const { value, path, depth } = stack.pop()!;
    if (typeof value === 'string') {
      if (CONTROL.test(value)) return { path: path || rootName, message: 'contains a control character (such as NUL); remove it' };
      continue;
    }
    if (value === null || typeof value !== 'object') continue;
    if (depth >= MAX_BODY_DEPTH) return { path: path || rootName, message: `nests deeper than ${MAX_BODY_DEPTH} levels` };
    if (Array.isArray(value)) {
      // Long numeric arrays (a velocity grid) are skipped quickly; only strings and objects need a look.
      for (let i = value.length - 1; i >= 0; i--) if (typeof value[i] === 'string' || (value[i] !== null && typeof value[i] === 'object')) stack.push({ value: value[i], path: `${path}[${i}]`, depth: depth + 1 });
      continue;
    }
    for (const [key, child] of Object.entries(value)) {
      const childPath = path ? `${path}.${key}` : key;
      if (CONTROL.test(key)) return { path: childPath, message: 'has a name with a control character' };
      stack.push({ value: child, path: childPath, depth: depth + 1 });
    }
  }
  return null;
}
