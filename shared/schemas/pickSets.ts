import { z } from 'zod';

/** Body of POST /api/picksets/:pickSetId/revisions: the complete exclusion list of the new revision. */
export const exclusionsBody = z
  .strictObject({
    exclusions: z
      .array(
        z.strictObject({
          index: z.number().int('must be a whole number').nonnegative('must be 0 or more'),
          reason: z.string().trim().min(1, 'give a reason for excluding the pick').max(500),
        }),
      )
      .max(200_000),
    comment: z.string().trim().max(1000).optional().default(''),
  })
  .superRefine((b, ctx) => {
    const seen = new Set<number>();
    b.exclusions.forEach((e, i) => {
      if (seen.has(e.index)) ctx.addIssue({ code: 'custom', path: ['exclusions', i, 'index'], message: `pick ${e.index} is listed twice` });
      seen.add(e.index);
    });
  });

export type ExclusionsBody = z.infer<typeof exclusionsBody>;

/** Body of POST /api/picksets/:pickSetId/retire: why the set should no longer be used. */
export const retirePickSetBody = z.strictObject({
  reason: z.string({ error: 'give a reason for retiring the pick set' }).trim().min(1, 'give a reason for retiring the pick set').max(500),
});
export type RetirePickSetBody = z.infer<typeof retirePickSetBody>;
