import { z } from 'zod';
import { VELOCITY_RANGE } from '../limits';
import { inRange } from './ranges';

/** Body of POST /api/runs/:runId/reports. Defaults: the run's first shot, 2500 m/s (a common top-of-rock value; common practice, no source). */
export const startReportBody = z.strictObject({
  shotId: z.string().trim().min(1).max(100).optional(),
  isoVelocity: inRange(z.number(), VELOCITY_RANGE).optional().default(2500),
  acquisitionNotes: z.string().trim().max(4000).optional().default(''),
});

/** Body of POST /api/inversions/:inversionId/reports: the iso-velocity to tabulate and the coverage (m of ray) below which the section is greyed. */
export const startInversionReportBody = z.strictObject({
  isoVelocity: inRange(z.number(), VELOCITY_RANGE).optional().default(2500),
  acquisitionNotes: z.string().trim().max(4000).optional().default(''),
  coverageThreshold: z.number().min(0, 'must be 0 or more').max(1000, 'must be at most 1000 m').optional().default(1),
});

/** Body of the workflow steps; returning a report needs a comment saying why. */
export const reportStepBody = z.strictObject({ comment: z.string().trim().max(4000).optional().default('') });

export type StartReportBody = z.infer<typeof startReportBody>;
export type StartInversionReportBody = z.infer<typeof startInversionReportBody>;
