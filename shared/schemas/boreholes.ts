/**
 * Boreholes and trial pits on a line (issue 13): what the API returns and accepts. Depths are metres
 * below the ground at the hole (positive down); positions are the line's chainage x and elevation z,
 * as everywhere else in Timefield.
 */
import { z } from 'zod';
import { X_RANGE, Z_RANGE } from '../limits';
import { inRange } from './ranges';

export const BOREHOLE_KINDS = ['borehole', 'trial_pit'] as const;
export type BoreholeKind = (typeof BOREHOLE_KINDS)[number];

const finite = (what: string) => z.number({ error: `${what} must be a finite number` });
const depth = (what: string) => finite(what).min(0, `${what} must be 0 or more (metres below ground)`).max(500, `${what} must be at most 500 m`);

/** One logged contact: the depth (m below ground) where `material` begins. */
export const boreholeContact = z.strictObject({
  depth: depth('depth'),
  material: z.string().trim().min(1, 'name the material, e.g. "top of rock"').max(120),
  /** This contact is the top of the refractor/rock the interpretation is tied to. */
  rockTop: z.boolean().optional().default(false),
});

/** POST /api/lines/:lineId/boreholes and PUT /api/boreholes/:id (the form). */
export const boreholeBody = z
  .strictObject({
    name: z.string().trim().min(1, 'give the hole a name, e.g. "BH3"').max(40),
    kind: z.enum(BOREHOLE_KINDS).optional().default('borehole'),
    x: inRange(finite('x'), X_RANGE, 'x'),
    /** Ground elevation at the hole; null = on the line's ground surface at x. */
    groundZ: inRange(finite('groundZ'), Z_RANGE, 'groundZ').nullable().optional().default(null),
    /** Depth to water (m below ground) when logged. */
    waterDepth: depth('waterDepth').nullable().optional().default(null),
    contacts: z.array(boreholeContact).max(100),
    note: z.string().trim().max(1000).optional().default(''),
  })
  .superRefine((b, ctx) => {
    b.contacts.forEach((c, i) => {
      if (i > 0 && c.depth <= b.contacts[i - 1].depth) {
        ctx.addIssue({ code: 'custom', path: ['contacts', i, 'depth'], message: 'contacts must be listed top-down, each deeper than the one before' });
      }
    });
  });
export type BoreholeBody = z.infer<typeof boreholeBody>;

export interface BoreholeView extends BoreholeBody {
  id: string;
  lineId: string;
  /** groundZ as given, else the line's ground (stations) at x; null when neither is known. */
  groundZResolved: number | null;
  createdBy: string;
  createdAt: string;
  updatedAt: string;
}

/**
 * The tie of one logged contact to an interpreted surface (interface of a layered model, iso-velocity
 * contour of an inversion, refractor of a layer interpretation) at the hole: interpreted depth minus
 * logged depth, m (positive: the interpretation is deeper than the log). null where the interpreted
 * surface does not reach the hole.
 */
export interface BoreholeTie {
  boreholeId: string;
  name: string;
  x: number;
  contactDepth: number;
  material: string;
  interpretedDepth: number | null;
  differenceM: number | null;
}
