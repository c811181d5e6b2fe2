import { encodeSeg2Samples, seg2DataBytes, type Seg2FormatCode } from './seg2-samples';
import { encodeSeg2Strings } from './seg2-strings';
import type { RecordPoint } from './types';

export interface Seg2TraceInput {
  samples: ArrayLike<number>;
  channel: number;
  /** Seconds. */
  sampleInterval: number;
  /** Seconds (first sample's time after the shot). */
  delay?: number;
  descale?: number;
  receiver?: RecordPoint | null;
  source?: RecordPoint | null;
  stack?: number;
  /** More keywords, written after the ones above. */
  keywords?: [string, string][];
}

export interface Seg2WriteOptions {
  format?: Seg2FormatCode;
  littleEndian?: boolean;
  /** File-level keywords (ACQUISITION_DATE, UNITS, NOTE …); UNITS METERS is written when absent. */
  keywords?: [string, string][];
}

const pointText = (p: RecordPoint): string => [p.x, p.y ?? (p.z === null ? null : 0), p.z].filter((v) => v !== null).join(' ');
const TERMINATOR = new Uint8Array([0]);

/**
 * Writes a SEG-2 file in the layout of Pullan (1990): a 32-byte file descriptor block, the trace
 * pointer sub-block, the file strings, then per trace a descriptor block (32 bytes + strings, padded
 * to a multiple of 4) followed by its data block. Terminators: NUL for strings, LF for lines.
 */
export function writeSeg2(traces: Seg2TraceInput[], options: Seg2WriteOptions = {}): Uint8Array {
  const format = options.format ?? 4;
  const le = options.littleEndian ?? true;
  const fileKeys = [...(options.keywords ?? [])];
  if (!fileKeys.some(([k]) => k === 'UNITS')) fileKeys.unshift(['UNITS', 'METERS']);
  const fileStrings = encodeSeg2Strings(fileKeys, TERMINATOR, le);
  const pointerBytes = 4 * traces.length;
  const blocks = traces.map((t) => traceBlock(t, format, le));
  const head = pad4(32 + pointerBytes + fileStrings.length);
  const total = head + blocks.reduce((n, b) => n + b.length, 0);
  const out = new Uint8Array(total);
  const v = new DataView(out.buffer);
  v.setUint16(0, 0x3a55, le);
  v.setUint16(2, 1, le); // revision 1
  v.setUint16(4, pointerBytes, le);
  v.setUint16(6, traces.length, le);
  out[8] = 1; // string terminator: one byte, NUL
  out[9] = 0;
  out[11] = 1; // line terminator: one byte, LF
  out[12] = 0x0a;
  out.set(fileStrings, 32 + pointerBytes);
  let at = head;
  blocks.forEach((b, i) => {
    v.setUint32(32 + 4 * i, at, le);
    out.set(b, at);
    at += b.length;
  });
  return out;
}

function traceBlock(t: Seg2TraceInput, format: Seg2FormatCode, le: boolean): Uint8Array {
  const keys: [string, string][] = [
    ['CHANNEL_NUMBER', String(t.channel)],
    ['SAMPLE_INTERVAL', String(t.sampleInterval)],
    ['DELAY', String(t.delay ?? 0)],
  ];
  if (t.descale !== undefined) keys.push(['DESCALING_FACTOR', String(t.descale)]);
  if (t.receiver) keys.push(['RECEIVER_LOCATION', pointText(t.receiver)]);
  if (t.source) keys.push(['SOURCE_LOCATION', pointText(t.source)]);
  if (t.stack !== undefined) keys.push(['STACK', String(t.stack)]);
  keys.push(...(t.keywords ?? []));
  const strings = encodeSeg2Strings(keys, TERMINATOR, le);
  const blockSize = pad4(32 + strings.length);
  if (blockSize > 0xfffc) throw new RangeError(`trace ${t.channel}: its keywords do not fit a SEG-2 trace descriptor block`);
  const data = encodeSeg2Samples(t.samples, format, le);
  const out = new Uint8Array(blockSize + data.length);
  const v = new DataView(out.buffer);
  v.setUint16(0, 0x4422, le);
  v.setUint16(2, blockSize, le);
  v.setUint32(4, seg2DataBytes(format, t.samples.length), le);
  v.setUint32(8, t.samples.length, le);
  out[12] = format;
  out.set(strings, 32);
  out.set(data, blockSize);
  return out;
}

const pad4 = (n: number): number => (n + 3) & ~3;
