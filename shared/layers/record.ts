/**
 * What a layered model saved from a layer interpretation keeps of it, as the model file's
 * `interpretation` key (an extra key, FORMATS.md §1): the method, velocities, depth under each
 * geophone and warnings, so a report on that model can show how it was made. Small by design
 * (well under the 64 kB an extra key may hold): depths rounded to the centimetre.
 */
import { z } from 'zod';
import type { LayerResult } from './types';

export const interpretationRecordSchema = z.object({
  method: z.enum(['grm', 'plus-minus', 'intercept']),
  /** GRM: the XY used (m); null otherwise. */
  xy: z.number().nullable(),
  /** Velocity per layer, top down (m/s). */
  velocities: z.array(z.number().positive()).min(2).max(3),
  /** [x, refractor, vertical depth below ground] per geophone and refractor (m). */
  depths: z.array(z.tuple([z.number(), z.number().int().min(1), z.number()])).max(4000),
  warnings: z.array(z.string()).max(20),
  /** The picks it was made from, e.g. "tq-l1.picks.csv revision 2". */
  picks: z.string().max(300),
  /** Picks whose refractor was set by hand rather than by the automatic suggestion. */
  handAssigned: z.number().int().min(0),
});
export type InterpretationRecord = z.infer<typeof interpretationRecordSchema>;

export function interpretationRecord(result: LayerResult, picks: string, handAssigned: number): InterpretationRecord {
  return {
    method: result.method,
    xy: result.xy === null ? null : +result.xy.toFixed(3),
    velocities: result.velocities.map((v) => Math.round(v)),
    depths: [...result.depths].sort((a, b) => a.refractor - b.refractor || a.x - b.x).map((d) => [+d.x.toFixed(3), d.refractor, +d.depth.toFixed(2)]),
    warnings: result.warnings,
    picks,
    handAssigned,
  };
}

/** The record of a model file, or null when it has none (or one this code cannot read). */
export function readInterpretationRecord(model: { interpretation?: unknown } | Record<string, unknown>): InterpretationRecord | null {
  const parsed = interpretationRecordSchema.safeParse((model as { interpretation?: unknown }).interpretation);
  return parsed.success ? parsed.data : null;
}
