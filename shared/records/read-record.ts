import { RecordFormatError } from './errors';
import { looksLikeSeg2, readSeg2 } from './seg2-reader';
import { readSegy } from './segy-reader';
import type { SeismicRecord } from './types';

/**
 * Reads a field record by its content: SEG-2 starts with its block id 0x3A55; a name ending in
 * .sgy/.segy (or any other file of at least 3600 bytes) is read as SEG-Y.
 */
export function readRecord(bytes: Uint8Array, fileName = ''): SeismicRecord {
  if (looksLikeSeg2(bytes)) return readSeg2(bytes);
  if (/\.(sgy|segy)$/i.test(fileName) || bytes.length >= 3600) return readSegy(bytes);
  throw new RecordFormatError(0, 'expected a SEG-2 file (starting with the block id 0x3A55) or a SEG-Y file (3200-byte textual header, 400-byte binary header, traces)');
}

/** A trace's samples in the instrument's units (stored value × descaling factor). */
export function scaledSamples(trace: { samples: Float64Array; descale: number }): Float64Array {
  return trace.descale === 1 ? trace.samples : trace.samples.map((v) => v * trace.descale);
}

/** Time after the shot of sample i (s), with the record's delay applied. */
export const sampleTime = (trace: { delay: number; sampleInterval: number }, i: number): number => trace.delay + i * trace.sampleInterval;
