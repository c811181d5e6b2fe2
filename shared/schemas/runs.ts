import { z } from 'zod';

/** Body of POST /api/runs. */
export const startRunBody = z.strictObject({
  modelId: z.uuid('must be a model version id'),
  pickSetId: z.uuid('must be a pick set id'),
  order: z.union([z.literal(1), z.literal(2)], { error: 'must be 1 (first order) or 2 (second order)' }).optional().default(2),
});

export type StartRunBody = z.infer<typeof startRunBody>;
