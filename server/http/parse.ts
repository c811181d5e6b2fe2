import type { z } from 'zod';
import { validationError } from './errors';

/** Validates a request body (or query) with a shared zod schema; 400 in the API.md shape when it fails. */
export function parse<S extends z.ZodType>(schema: S, data: unknown): z.infer<S> {
  const result = schema.safeParse(data ?? {});
  if (!result.success) throw validationError(result.error);
  return result.data;
}
