/** zod refinement for the plausible ranges of shared/limits.ts, with the same message the file parsers give. */
import type { z } from 'zod';
import { outOfRange, type NumberRange } from '../limits';

/** `schema` further limited to `range`; the message starts with `what` when given ("v_top must be between …"). */
export function inRange(schema: z.ZodNumber, range: NumberRange, what?: string): z.ZodNumber {
  return schema.superRefine((value, ctx) => {
    const problem = outOfRange(value, range);
    if (problem) ctx.addIssue({ code: 'custom', input: value, message: what ? `${what} ${problem}` : problem });
  });
}
