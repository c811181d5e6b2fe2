import { z } from 'zod';

/** One geophone station of a survey line: number, chainage x (m) and ground elevation z (m). */
export const stationRow = z.strictObject({
  station: z.number().int('must be a whole number').positive('must be positive'),
  x: z.number().refine(Number.isFinite, 'must be a finite number'),
  z: z.number().refine(Number.isFinite, 'must be a finite number'),
});

/** The JSON body of PUT /api/lines/:lineId/stations. Up to 10 000 stations on one line. */
export const stationTableBody = z.array(stationRow).max(10_000, 'at most 10 000 stations on one line');

export type Station = z.infer<typeof stationRow>;
