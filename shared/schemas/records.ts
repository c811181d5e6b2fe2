/**
 * Shot records on a line (issue 12): what the API returns and accepts. The pages read the original
 * bytes (GET /api/records/:id/file) with shared/records, so the server sends headers, never samples.
 */
import { z } from 'zod';
import { pickRowSchema } from './picks';
import { MAX_PICK_ROWS } from '../limits';

/** Where a receiver position came from: the trace's own header, or the line's station whose number is the channel (as `npm run pick --stations`). */
export type GeometrySource = 'header' | 'stations' | 'none';

/** One row of GET /api/lines/:lineId/records, and the body of the 201 after an upload. */
export interface RecordSummaryView {
  id: string;
  lineId: string;
  fileName: string;
  format: 'seg2' | 'segy';
  /** SEG-2 revision number, or SEG-Y "1.0" / "2.0". */
  revision: string;
  bytes: number;
  /** Hex SHA-256 of the original bytes; a second upload of the same file on the line is refused (409). */
  sha256: string;
  channels: number;
  /** Of the first trace (ms); traces that differ are flagged in the trace list. */
  sampleIntervalMs: number;
  samplesPerTrace: number;
  /** From the first sample to the last, ms. */
  recordLengthMs: number;
  /** Time of the first sample after the shot, ms (negative: pre-trigger). */
  delayMs: number;
  /** ISO 8601 without zone, from the file; null when absent. */
  acquired: string | null;
  /** The shot id the picks will carry (from the file name's digits unless set by PATCH). */
  shotId: string;
  /** Source position (m): from the headers, else set by PATCH; null until known. z null = on the ground surface. */
  source: { x: number; z: number | null } | null;
  sourceFrom: 'header' | 'set' | 'none';
  /** How the receivers are placed: headers when every live trace has a position, else stations by channel. */
  receiversFrom: GeometrySource;
  uploadedBy: string;
  uploadedAt: string;
  /** Pick sets saved from this record (a record linked to one cannot be deleted). */
  pickSetIds: string[];
}

/** One trace's headers in GET /api/records/:recordId. */
export interface RecordTraceView {
  index: number;
  channel: number;
  /** Receiver position used for picks (m), or null when neither header nor station gives one. */
  receiver: { x: number; z: number | null } | null;
  sampleIntervalMs: number;
  samples: number;
  delayMs: number;
  stack: number | null;
  markedDead: boolean;
}

export interface RecordDetailView extends RecordSummaryView {
  traces: RecordTraceView[];
  /** File-level keywords as read (SEG-2 strings, SEG-Y binary header fields). */
  keywords: Record<string, string>;
  notes: string[];
}

/** PATCH /api/records/:recordId: set what the file lacks or has wrong. Absent keys keep their value. */
export const recordGeometryBody = z
  .strictObject({
    shotId: z.string().trim().min(1, 'shot id is empty').max(64).optional(),
    source: z
      .strictObject({ x: z.number({ error: 'x must be a finite number' }), z: z.number({ error: 'z must be a finite number or null' }).nullable() })
      .nullable()
      .optional(),
    /** Place the receivers on the line's stations by channel number (station n for channel n, as `npm run pick --stations`) even when headers have positions. */
    receiversFrom: z.enum(['header', 'stations']).optional(),
  })
  .refine((b) => Object.keys(b).length > 0, { message: 'nothing to change' });
export type RecordGeometryBody = z.infer<typeof recordGeometryBody>;

/**
 * POST /api/lines/:lineId/picksets/from-records: picks made on the records, saved as a new pick set
 * (stored as a pick file per FORMATS.md §2, so it behaves like an uploaded one) linked to its records.
 * → 201 { id, shots, picks } or 422 with paths like ["picks", 14, "time_ms"].
 */
export const picksFromRecordsBody = z.strictObject({
  name: z.string().trim().min(1, 'give the pick set a name').max(200),
  recordIds: z.array(z.uuid('not a record id')).min(1, 'no records').max(2000),
  picks: z.array(pickRowSchema).min(1, 'no picks').max(MAX_PICK_ROWS),
  /** A pick set of the line these picks are a new version of: it is retired (kept for what used it) as the new one is stored. */
  replaces: z.uuid('not a pick set id').optional(),
});
export type PicksFromRecordsBody = z.infer<typeof picksFromRecordsBody>;
