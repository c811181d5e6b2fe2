/**
 * zod 4 schemas for picks sent as JSON (e.g. the editor saving a corrected pick set).
 * Field names and units match the CSV columns of FORMATS.md §2 (ms at the edge);
 * `toPicks` converts to the SI Pick used inside. Cross-row rules (one source per shot,
 * no duplicate receiver) and the zero-time rule are the same code the CSV parser runs.
 * Issue paths are `[row, column]`, e.g. `[14, 'time_ms']`.
 */
import { z } from 'zod';
import { MAX_PICK_ROWS, SIGMA_MS_RANGE, TIME_MS_RANGE, X_RANGE, Z_RANGE } from '../limits';
import { inRange } from './ranges';
import { atSource, PickSetTracker } from '../picks/pick-set';
import type { Pick } from '../picks/types';
import { msToS } from '../units';

const need = (what: string) => (issue: { input?: unknown }) =>
  issue.input === undefined ? `${what} is required` : `${what} must be a finite number`;
const coord = (what: string) => z.number({ error: need(what) });
const position = (what: string) => inRange(coord(what), X_RANGE, what);
const optionalZ = (what: string) =>
  inRange(z.number({ error: `${what} must be a finite number or null (on the surface)` }), Z_RANGE, what).nullable().optional();

export const pickRowSchema = z.object({
  shot_id: z.string({ error: 'shot_id must be text' }).trim().min(1, { error: 'shot_id is empty' }),
  source_x: position('source_x'),
  source_z: optionalZ('source_z'),
  receiver_x: position('receiver_x'),
  receiver_z: optionalZ('receiver_z'),
  time_ms: coord('time_ms')
    .min(0, { error: 'time_ms is negative; a travel time must be > 0' })
    .max(TIME_MS_RANGE.max, { error: (i) => `time_ms must be between 0 and ${TIME_MS_RANGE.max} ms (got ${String(i.input)})` }),
  sigma_ms: inRange(z.number({ error: 'sigma_ms must be a finite number' }), SIGMA_MS_RANGE, 'sigma_ms').nullable().optional(),
});
export type PickRow = z.infer<typeof pickRowSchema>;

const DEFAULT_SIGMA_MS = 1.0;

/** Row (ms, CSV names) → Pick (SI). `line` is the 1-based row number. */
export function toPick(row: PickRow, index: number): Pick {
  return {
    line: index + 1,
    shotId: row.shot_id,
    sourceX: row.source_x,
    sourceZ: row.source_z ?? null,
    receiverX: row.receiver_x,
    receiverZ: row.receiver_z ?? null,
    time: msToS(row.time_ms),
    sigma: msToS(row.sigma_ms ?? DEFAULT_SIGMA_MS),
  };
}

export const pickSetSchema = z
  .array(pickRowSchema, { error: 'picks must be a list of rows' })
  .min(1, { error: 'no picks' })
  .max(MAX_PICK_ROWS, { error: `more than ${MAX_PICK_ROWS} picks; split the set` })
  .superRefine((rows, ctx) => {
    const tracker = new PickSetTracker('row');
    rows.forEach((row, i) => {
      const pick = toPick(row, i);
      if (row.time_ms === 0 && !atSource(pick)) {
        ctx.addIssue({ code: 'custom', path: [i, 'time_ms'], message: 'time_ms is 0, which is allowed only for a pick at the source position itself' });
      }
      for (const c of tracker.add(pick)) ctx.addIssue({ code: 'custom', path: [i, c.column], message: c.message });
    });
  });

export const toPicks = (rows: PickRow[]): Pick[] => rows.map(toPick);

/** Internal SI form, for messages between server and worker. */
export const pickSchema = z.object({
  line: z.number().int().positive(),
  shotId: z.string().min(1),
  sourceX: z.number(),
  sourceZ: z.number().nullable(),
  receiverX: z.number(),
  receiverZ: z.number().nullable(),
  time: z.number().min(0),
  sigma: z.number().positive(),
});
