import { z } from 'zod';
import { VELOCITY_RANGE } from '../limits';
import type { DepthBand } from '../uncertainty/combine';
import { inRange } from './ranges';

/** Members of an ensemble: the default, and the limits (two for a spread at all; 256 keeps one combine in memory). */
export const DEFAULT_ENSEMBLE_MEMBERS = 24;
export const MAX_ENSEMBLE_MEMBERS = 256;
/** The rock velocity v* when none is given (a common weathered/sound rock threshold; common practice, no source). */
export const DEFAULT_ROCK_VELOCITY = 2500;

const velocity = (what: string) => inRange(z.number({ error: `${what} must be a number` }), VELOCITY_RANGE, what);

/** Body of POST /api/inversions/:inversionId/ensembles. */
export const startEnsembleBody = z
  .strictObject({
    members: z.number().int('must be a whole number').min(2, 'must be at least 2').max(MAX_ENSEMBLE_MEMBERS, `must be at most ${MAX_ENSEMBLE_MEMBERS}`).default(DEFAULT_ENSEMBLE_MEMBERS),
    vary: z
      .strictObject({
        start: z.boolean().default(true),
        smoothing: z.boolean().default(true),
        picks: z.enum(['none', 'sigma', 'bootstrap'], { error: 'must be "none", "sigma" or "bootstrap"' }).default('sigma'),
      })
      .prefault({}),
    /** v* (m/s), or the lower end of its range when rockVelocityMax is given. */
    rockVelocity: velocity('rockVelocity').default(DEFAULT_ROCK_VELOCITY),
    rockVelocityMax: velocity('rockVelocityMax').optional(),
    /** Summed ray length (m) a node needs to count as covered. */
    coverageThreshold: z.number().positive('must be greater than 0').max(1000, 'must be at most 1000').default(1),
    /** Absent: drawn at random (and recorded). */
    seed: z.number().int('must be a whole number').min(0, 'must be 0 or more').max(4294967295, 'must be at most 4294967295').optional(),
    label: z.string().trim().max(200).optional().default(''),
  })
  .superRefine((b, ctx) => {
    if (!b.vary.start && !b.vary.smoothing && b.vary.picks === 'none') {
      ctx.addIssue({ code: 'custom', path: ['vary'], message: 'nothing varies: every member would repeat the same inversion; vary the start, the weight or the picks' });
    }
    if (b.rockVelocityMax !== undefined && b.rockVelocityMax < b.rockVelocity) {
      ctx.addIssue({ code: 'custom', path: ['rockVelocityMax'], message: `must be at least the rock velocity (${b.rockVelocity} m/s)` });
    }
  });

export type StartEnsembleBody = z.infer<typeof startEnsembleBody>;

export type EnsembleStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';

export interface EnsembleMemberView {
  index: number;
  status: EnsembleStatus;
  /** The worker process that took it last (host:pid or WORKER_NAME). */
  worker: string | null;
  attempts: number;
  /** χ² per datum against the observed picks, once done. */
  chi2: number | null;
  iterations: number | null;
  seconds: number | null;
  /** The member's draws: factors on v0, k and the weight; its v* when drawn from a range. */
  plan: { v0Factor: number; kFactor: number; smoothingFactor: number; picks: 'none' | 'sigma' | 'bootstrap'; rockVelocity: number };
  error?: string;
}

/** GET /api/ensembles/:ensembleId (and each row of GET /api/inversions/:inversionId/ensembles). */
export interface EnsembleView {
  id: string;
  inversionId: string;
  lineId: string;
  label: string;
  status: EnsembleStatus;
  members: number;
  seed: number;
  vary: { start: boolean; smoothing: boolean; picks: 'none' | 'sigma' | 'bootstrap' };
  rockVelocity: { min: number; max: number };
  coverageThreshold: number;
  /** Members per state, and per worker process the members it has done, is running, and failed. */
  progress: { queued: number; running: number; done: number; failed: number; cancelled: number };
  workers: { worker: string; done: number; running: number; failed: number; seconds: number }[];
  /** Once combined: members used, left out (χ² above maxChi2: 1.2, or 25 % above the base's when it stopped higher) and failed. */
  stats: { used: number; excluded: number; failed: number; maxChi2: number; baseChi2: number | null; seconds: number; medianMemberSeconds: number | null } | null;
  error?: string;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

/** GET /api/ensembles/:ensembleId/section: the combined result, node arrays row-major (iz outer), null where too few members cover. */
export interface EnsembleSectionView {
  grid: { x0: number; dx: number; nx: number; z0: number; dz: number; nz: number };
  surface: [number, number][] | null;
  used: number;
  excluded: number;
  rockVelocity: { min: number; max: number };
  /** Members covering each node. */
  covering: number[];
  /** m/s, whole numbers. */
  mean: (number | null)[];
  std: (number | null)[];
  /** Share of members faster than v* (two decimals). */
  probability: (number | null)[];
  /** Per station: depth below ground of v* (m), median and 5–95 % band over the members that resolve it there. */
  bands: (DepthBand & { station: string; groundZ: number })[];
  stations: { station: string; x: number; z: number }[];
}
