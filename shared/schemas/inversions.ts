import { z } from 'zod';
import { SPACING_RANGE, VELOCITY_RANGE } from '../limits';
import type { InversionSettings } from '../inversion/types';
import { inRange } from './ranges';

/** Defaults of every inversion setting (shared/inversion/README.md says why each). */
export const DEFAULT_INVERSION_SETTINGS: InversionSettings = {
  maxIterations: 15,
  smoothing: null,
  verticalWeight: 0.5,
  damping: 0.05,
  vMin: 100,
  vMax: 7000,
  order: 2,
  checkerboard: false,
  checkerSize: null,
};

/** Upper limit of the iteration cap: each iteration solves every shot and traces every ray. */
export const MAX_INVERSION_ITERATIONS = 50;

const velocity = (what: string) => inRange(z.number({ error: `${what} must be a number` }), VELOCITY_RANGE, what);

/** Settings as a user may give them: every key optional, defaults filled in. */
export const inversionSettingsInput = z
  .strictObject({
    maxIterations: z.number().int('must be a whole number').min(1, 'must be at least 1').max(MAX_INVERSION_ITERATIONS, `must be at most ${MAX_INVERSION_ITERATIONS}`).optional(),
    smoothing: z.number().positive('must be greater than 0').max(1e6, 'must be at most 1e6').nullable().optional(),
    verticalWeight: z.number().positive('must be greater than 0').max(10, 'must be at most 10').optional(),
    damping: z.number().min(0, 'must be 0 or more').max(100, 'must be at most 100').optional(),
    vMin: velocity('vMin').optional(),
    vMax: velocity('vMax').optional(),
    order: z.union([z.literal(1), z.literal(2)], { error: 'must be 1 (first order) or 2 (second order)' }).optional(),
    checkerboard: z.boolean().optional(),
    checkerSize: inRange(z.number(), { min: 0.1, max: 10_000, unit: 'm' }, 'checkerSize').nullable().optional(),
  })
  .transform((s): InversionSettings => ({ ...DEFAULT_INVERSION_SETTINGS, ...Object.fromEntries(Object.entries(s).filter(([, v]) => v !== undefined)) }))
  .superRefine((s, ctx) => {
    if (s.vMin >= s.vMax) ctx.addIssue({ code: 'custom', path: ['vMax'], message: `must be greater than vMin (${s.vMin} m/s); the bounds are reversed or equal` });
  });

/** Where an inversion starts: the automatic 1-D gradient on a grid made for the line, or a saved model version (its grid and surface). */
export const inversionStart = z.discriminatedUnion('kind', [
  z.strictObject({
    kind: z.literal('gradient'),
    /** Grid spacing dx = dz (m); absent = a default from the station spacing. */
    spacing: inRange(z.number(), SPACING_RANGE, 'spacing').optional(),
  }),
  z.strictObject({ kind: z.literal('model'), modelId: z.uuid('must be a model version id') }),
]);

/** Body of POST /api/inversions. */
export const startInversionBody = z.strictObject({
  pickSetId: z.uuid('must be a pick set id'),
  /** Absent = the pick set's latest revision. */
  pickSetRevision: z.number().int('must be a whole number').min(0, 'must be 0 (as uploaded) or a later revision').optional(),
  start: inversionStart,
  settings: inversionSettingsInput.prefault({}),
  label: z.string().trim().max(200).optional().default(''),
});

export type StartInversionBody = z.infer<typeof startInversionBody>;
export type InversionStart = z.infer<typeof inversionStart>;

/** One iteration as stored and shown: χ² and RMS misfit of the model after the step. */
export interface InversionIterationView {
  iteration: number;
  chi2: number;
  rmsMs: number;
  smoothing: number | null;
}

/** GET /api/inversions/:inversionId (and each row of GET /api/lines/:lineId/inversions). */
export interface InversionView {
  id: string;
  lineId: string;
  label: string;
  status: 'queued' | 'running' | 'done' | 'failed' | 'cancelled';
  pickSetId: string;
  pickSetRevision: number;
  /** Gradient start: spacing used and the fitted v0 (m/s) and k (1/s) once known; model start: the version. */
  start: { kind: 'gradient'; spacing: number; v0: number | null; k: number | null } | { kind: 'model'; modelId: string; modelVersion: number | null };
  grid: { x0: number; dx: number; nx: number; z0: number; dz: number; nz: number };
  settings: InversionSettings;
  /** Iterations stored so far, iteration 0 (the starting model) first; live while running. */
  history: InversionIterationView[];
  progress: { iteration: number; maxIterations: number };
  stats: {
    chi2: number;
    rms_ms: number;
    picks: number;
    shots: number;
    iterations: number;
    stopReason: 'target-misfit' | 'stalled' | 'iteration-cap' | 'cancelled';
    /** Checkerboard correlation in covered cells, when the test was run. */
    checkerboardCorrelation: number | null;
    /** Seconds spent: forward solves and rays, matrix build, LSQR. */
    timings: { forward: number; matrix: number; lsqr: number; total: number };
  } | null;
  error?: string;
  /** Model version made from this inversion, when saved. */
  savedModelId: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

/** GET /api/inversions/:inversionId/section: the final model and its checks, node arrays row-major (iz outer), null in the air. */
export interface InversionSectionView {
  grid: { x0: number; dx: number; nx: number; z0: number; dz: number; nz: number };
  surface: [number, number][] | null;
  /** m/s, whole numbers. */
  velocity: (number | null)[];
  /** Summed ray length per node (m, two decimals) and rays touching it. */
  coverage: (number | null)[];
  hits: (number | null)[];
  /** Depth-of-investigation elevation per grid column (m), null where no ray passes. */
  doi: (number | null)[];
  checkerboard: {
    size: number;
    amplitude: number;
    /** null when it cannot be computed (a flat recovered pattern, or fewer than two covered nodes). */
    correlation: number | null;
    coverageThreshold: number;
    truePattern: (number | null)[];
    recovered: (number | null)[];
  } | null;
  shots: { shotId: string; x: number; z: number }[];
  stations: { station: string; x: number; z: number }[];
}
