import { textToEbcdic } from './ebcdic';
import { BIN, BINARY_HEADER_AT, TEXT_HEADER_BYTES, TRACE, TRACE_HEADER_BYTES } from './segy-headers';
import { encodeSegySamples, SEGY_SAMPLE_BYTES } from './segy-samples';
import type { RecordPoint } from './types';

export interface SegyTraceInput {
  samples: ArrayLike<number>;
  channel: number;
  receiver?: RecordPoint | null;
  source?: RecordPoint | null;
  /** Seconds; written in whole milliseconds (bytes 109–110). */
  delay?: number;
}

export interface SegyWriteOptions {
  /** Seconds, one for the whole file (written in whole microseconds). */
  sampleInterval: number;
  format?: 1 | 2 | 3 | 5;
  /** Up to 40 lines of the textual header (cut at 80 characters). */
  text?: string[];
  ebcdic?: boolean;
  fieldRecord?: number;
}

/** Coordinates in centimetres: scalar −100 (SEG-Y: a negative scalar divides). */
const COORDINATE_SCALAR = -100;

/**
 * Writes a SEG-Y rev 1 file (SEG Technical Standards Committee, 2002): big-endian, fixed-length
 * traces, textual header in EBCDIC (default) or ASCII, binary header with sample interval, count,
 * format and metres; per trace the channel, source and group coordinates and elevations (scalar −100),
 * delay recording time, sample count and interval.
 */
export function writeSegy(traces: SegyTraceInput[], options: SegyWriteOptions): Uint8Array {
  const format = options.format ?? 5;
  const n = traces[0]?.samples.length ?? 0;
  if (traces.some((t) => t.samples.length !== n)) throw new RangeError('every trace needs the same number of samples');
  const interval = Math.round(options.sampleInterval * 1e6);
  if (interval < 1 || interval > 0xffff || n > 0xffff) throw new RangeError('sample interval or count does not fit SEG-Y rev 1');
  const traceBytes = TRACE_HEADER_BYTES + n * SEGY_SAMPLE_BYTES[format];
  const out = new Uint8Array(TEXT_HEADER_BYTES + 400 + traces.length * traceBytes);
  const v = new DataView(out.buffer);

  const cards = Array.from({ length: 40 }, (_, i) => (options.text?.[i] ?? (i === 0 ? 'C 1 SEG-Y REV1 WRITTEN BY TIMEFIELD' : `C${String(i + 1).padStart(2)}`)).slice(0, 80).padEnd(80));
  const text = cards.join('');
  out.set(options.ebcdic === false ? Uint8Array.from(text, (c) => c.charCodeAt(0) & 0x7f) : textToEbcdic(text), 0);

  v.setInt16(BIN.tracesPerEnsemble, traces.length);
  v.setUint16(BIN.sampleInterval, interval);
  v.setUint16(BINARY_HEADER_AT + 18, interval); // original field recording interval
  v.setUint16(BIN.samplesPerTrace, n);
  v.setUint16(BINARY_HEADER_AT + 22, n);
  v.setInt16(BIN.format, format);
  v.setInt16(BIN.measurementSystem, 1);
  out[BIN.majorRevision] = 1;
  out[BIN.minorRevision] = 0;
  v.setInt16(BIN.fixedLength, 1);

  const cm = (m: number | null | undefined) => Math.round((m ?? 0) * 100);
  traces.forEach((t, i) => {
    const at = TEXT_HEADER_BYTES + 400 + i * traceBytes;
    v.setInt32(at + TRACE.sequenceInLine, i + 1);
    v.setInt32(at + TRACE.sequenceInFile, i + 1);
    v.setInt32(at + TRACE.fieldRecord, options.fieldRecord ?? 1);
    v.setInt32(at + TRACE.channel, t.channel);
    v.setInt16(at + TRACE.identification, 1);
    v.setInt16(at + TRACE.verticalSum, 1);
    v.setInt16(at + TRACE.elevationScalar, COORDINATE_SCALAR);
    v.setInt16(at + TRACE.coordinateScalar, COORDINATE_SCALAR);
    v.setInt32(at + TRACE.sourceX, cm(t.source?.x));
    v.setInt32(at + TRACE.sourceY, cm(t.source?.y));
    v.setInt32(at + TRACE.groupX, cm(t.receiver?.x));
    v.setInt32(at + TRACE.groupY, cm(t.receiver?.y));
    v.setInt32(at + TRACE.receiverElevation, cm(t.receiver?.z));
    v.setInt32(at + TRACE.sourceElevation, cm(t.source?.z));
    if (t.source && t.receiver) v.setInt32(at + TRACE.offset, Math.round(Math.abs(t.receiver.x - t.source.x)));
    v.setInt16(at + TRACE.coordinateUnits, 1);
    v.setInt16(at + TRACE.delay, Math.round((t.delay ?? 0) * 1000));
    v.setUint16(at + TRACE.samples, n);
    v.setUint16(at + TRACE.sampleInterval, interval);
    out.set(encodeSegySamples(t.samples, format), at + TRACE_HEADER_BYTES);
  });
  return out;
}
