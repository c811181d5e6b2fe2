import { z } from 'zod';
import { X_RANGE, Z_RANGE } from '../limits';
import { inRange } from './ranges';

const coordinate = () => inRange(z.number().refine(Number.isFinite, 'must be a finite number'), X_RANGE);

/**
 * One geophone station of a survey line: number, chainage x (m) and ground elevation z (m), and
 * optionally its easting and northing (m) in the project's coordinate reference system.
 */
export const stationRow = z
  .strictObject({
    station: z.number().int('must be a whole number').positive('must be positive'),
    x: inRange(z.number().refine(Number.isFinite, 'must be a finite number'), X_RANGE),
    z: inRange(z.number().refine(Number.isFinite, 'must be a finite number'), Z_RANGE),
    easting: coordinate().optional(),
    northing: coordinate().optional(),
  })
  .refine((s) => (s.easting === undefined) === (s.northing === undefined), { error: 'give easting and northing together, or neither', path: ['northing'] });

/** The JSON body of PUT /api/lines/:lineId/stations. Up to 10 000 stations on one line. */
export const stationTableBody = z.array(stationRow).max(10_000, 'at most 10 000 stations on one line');

export type Station = z.infer<typeof stationRow>;
