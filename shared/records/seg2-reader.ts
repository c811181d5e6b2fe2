import { MAX_RECORD_BYTES, MAX_RECORD_SAMPLES, MAX_RECORD_TRACES, MAX_TRACE_SAMPLES, outOfRange, RECORD_DELAY_RANGE, SAMPLE_INTERVAL_RANGE, X_RANGE, Z_RANGE } from '../limits';
import { ByteReader } from './bytes';
import { RecordFormatError } from './errors';
import { acquisitionTime, Seg2Keywords } from './seg2-keywords';
import { decodeSeg2Samples, isSeg2FormatCode, seg2DataBytes } from './seg2-samples';
import { readSeg2Strings, type Seg2String } from './seg2-strings';
import type { RecordPoint, RecordTrace, SeismicRecord } from './types';

/** File descriptor block id 0x3A55 and trace descriptor block id 0x4422 (Pullan 1990). */
export const SEG2_FILE_ID = 0x3a55;
export const SEG2_TRACE_ID = 0x4422;

/** True when the bytes start like a SEG-2 file in either byte order. */
export const looksLikeSeg2 = (b: Uint8Array): boolean => b.length >= 2 && ((b[0] === 0x55 && b[1] === 0x3a) || (b[0] === 0x3a && b[1] === 0x55));

/**
 * Reads a SEG-2 file (Pullan, S. E., 1990, "Recommended standard for seismic (/radar) data files in
 * the personal computer environment", Geophysics 55(9), 1260–1271): the file descriptor block (id,
 * revision, trace pointer sub-block size M, trace count N, string and line terminators, N trace
 * pointers at byte 32, then the file's strings), and per trace a descriptor block (id, block size,
 * data block size, sample count, data format code, strings at byte 32) followed by its data block.
 * Every problem throws RecordFormatError with the byte offset.
 */
export function readSeg2(bytes: Uint8Array): SeismicRecord {
  if (bytes.length > MAX_RECORD_BYTES) throw new RecordFormatError(0, `the file is ${bytes.length} bytes; at most ${MAX_RECORD_BYTES} are accepted`);
  if (!looksLikeSeg2(bytes)) throw new RecordFormatError(0, 'expected the SEG-2 file descriptor block id 0x3A55 (bytes 55 3A or 3A 55)');
  const r = new ByteReader(bytes, bytes[0] === 0x55);
  const revision = r.u16(2, 'the revision number');
  const pointerBytes = r.u16(4, 'the size of the trace pointer sub-block');
  const count = r.u16(6, 'the number of traces');
  const termSize = r.u8(8, 'the size of the string terminator');
  if (termSize !== 1 && termSize !== 2) throw new RecordFormatError(8, `the string terminator must be 1 or 2 bytes (got ${termSize})`);
  const terminator = bytes.slice(9, 9 + termSize);
  const lineSize = r.u8(11, 'the size of the line terminator');
  if (lineSize > 2) throw new RecordFormatError(11, `the line terminator must be 0, 1 or 2 bytes (got ${lineSize})`);
  const lineTerminator = String.fromCharCode(...bytes.subarray(12, 12 + lineSize));
  r.need(0, 32, 'the 32-byte file descriptor block');
  if (count === 0) throw new RecordFormatError(6, 'the record has no traces (N = 0)');
  if (count > MAX_RECORD_TRACES) throw new RecordFormatError(6, `the record claims ${count} traces; at most ${MAX_RECORD_TRACES} are accepted`);
  if (pointerBytes < 4 * count) throw new RecordFormatError(4, `the trace pointer sub-block (${pointerBytes} bytes) cannot hold ${count} pointers of 4 bytes`);
  r.need(32, pointerBytes, 'the trace pointer sub-block');

  const stringsStart = 32 + pointerBytes;
  const pointers: number[] = [];
  for (let i = 0; i < count; i++) {
    const p = r.u32(32 + 4 * i, `trace pointer ${i + 1}`);
    if (p < stringsStart || p + 32 > bytes.length) {
      throw new RecordFormatError(32 + 4 * i, `trace pointer ${i + 1} is ${p}; expected a byte from ${stringsStart} (after the pointers) to ${bytes.length - 32} (a whole 32-byte block before the end of the file)`);
    }
    pointers.push(p);
  }
  const fileStrings = readSeg2Strings(r, stringsStart, Math.min(...pointers), terminator, 'the file descriptor block');
  const fileKeys = new Seg2Keywords(fileStrings, [], 'file descriptor block');

  let totalSamples = 0;
  const traces: RecordTrace[] = pointers.map((p, i) => {
    const trace = readTrace(r, p, i, fileStrings, terminator, lineTerminator);
    totalSamples += trace.samples.length;
    if (totalSamples > MAX_RECORD_SAMPLES) throw new RecordFormatError(p + 8, `the record holds more than ${MAX_RECORD_SAMPLES} samples in all`);
    return trace;
  });
  const notes = fileStrings.filter((s) => s.key === 'NOTE').flatMap((s) => splitNote(s.value, lineTerminator));
  return {
    format: 'seg2',
    revision: String(revision),
    byteOrder: r.littleEndian ? 'little' : 'big',
    traces,
    keywords: keywordMap(fileStrings),
    notes,
    acquired: acquisitionTime(fileKeys.get('ACQUISITION_DATE')?.value, fileKeys.get('ACQUISITION_TIME')?.value),
  };
}

function readTrace(r: ByteReader, p: number, i: number, fileStrings: Seg2String[], terminator: Uint8Array, lineTerminator: string): RecordTrace {
  const no = i + 1;
  const id = r.u16(p, `the trace descriptor block id of trace ${no}`);
  if (id !== SEG2_TRACE_ID) throw new RecordFormatError(p, `trace ${no}: expected the trace descriptor block id 0x4422, found 0x${id.toString(16).toUpperCase().padStart(4, '0')}`);
  const blockSize = r.u16(p + 2, `the block size of trace ${no}`);
  if (blockSize < 32) throw new RecordFormatError(p + 2, `trace ${no}: the trace descriptor block must be at least 32 bytes (got ${blockSize})`);
  r.need(p, blockSize, `the trace descriptor block of trace ${no}`);
  const dataSize = r.u32(p + 4, `the data block size of trace ${no}`);
  const n = r.u32(p + 8, `the sample count of trace ${no}`);
  const code = r.u8(p + 12, `the data format code of trace ${no}`);
  if (!isSeg2FormatCode(code)) throw new RecordFormatError(p + 12, `trace ${no}: data format code must be 1, 2, 3, 4 or 5 (got ${code})`);
  if (n > MAX_TRACE_SAMPLES) throw new RecordFormatError(p + 8, `trace ${no} claims ${n} samples; at most ${MAX_TRACE_SAMPLES} are accepted`);
  if (seg2DataBytes(code, n) > dataSize) {
    throw new RecordFormatError(p + 4, `trace ${no}: ${n} samples of data format ${code} need ${seg2DataBytes(code, n)} bytes, but the data block is ${dataSize} bytes`);
  }

  const strings = readSeg2Strings(r, p + 32, p + blockSize, terminator, `trace ${no}'s descriptor block`);
  const keys = new Seg2Keywords(fileStrings, strings, `trace ${no}`);
  const dataAt = p + blockSize;
  const samples = decodeSeg2Samples(r, dataAt, n, code, no);
  if (code >= 4) {
    const bad = samples.findIndex((v) => !Number.isFinite(v));
    if (bad >= 0) throw new RecordFormatError(dataAt + bad * (code === 4 ? 4 : 8), `trace ${no}: sample ${bad + 1} is not a finite number`);
  }

  const interval = keys.number('SAMPLE_INTERVAL');
  if (interval === null) throw new RecordFormatError(p + 32, `trace ${no}: expected a SAMPLE_INTERVAL keyword (seconds)`);
  checkRange(keys, 'SAMPLE_INTERVAL', interval, SAMPLE_INTERVAL_RANGE, p);
  const delay = keys.number('DELAY') ?? 0;
  checkRange(keys, 'DELAY', delay, RECORD_DELAY_RANGE, p);
  const descale = keys.number('DESCALING_FACTOR') ?? 1;
  const channel = keys.number('CHANNEL_NUMBER');
  const receiver = checkedPoint(keys, 'RECEIVER_LOCATION', no);
  const source = checkedPoint(keys, 'SOURCE_LOCATION', no);
  const keywords = keywordMap(strings);
  for (const s of strings) if (s.key === 'NOTE') keywords.NOTE = splitNote(s.value, lineTerminator).join('\n');
  return {
    index: i,
    channel: channel !== null && Number.isInteger(channel) && channel > 0 ? channel : no,
    samples,
    descale,
    sampleInterval: interval,
    delay,
    receiver,
    source,
    stack: keys.number('STACK'),
    markedDead: false,
    keywords,
  };
}

function checkRange(keys: Seg2Keywords, key: string, value: number, range: Parameters<typeof outOfRange>[1], p: number): void {
  const problem = outOfRange(value, range);
  if (problem) throw new RecordFormatError(keys.get(key)?.offset ?? p, `${key} ${problem}`);
}

function checkedPoint(keys: Seg2Keywords, key: string, no: number): RecordPoint | null {
  const point = keys.point(key);
  if (!point) return null;
  const at = keys.get(key)!.offset;
  for (const [name, v, range] of [['x', point.x, X_RANGE], ['y', point.y, X_RANGE], ['z', point.z, Z_RANGE]] as const) {
    const problem = v === null ? null : outOfRange(v, range);
    if (problem) throw new RecordFormatError(at, `trace ${no}: ${key} ${name} ${problem}`);
  }
  return point;
}

/** Keywords by name; a repeated keyword keeps its values joined by a line break (NOTE may repeat). */
function keywordMap(strings: Seg2String[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const s of strings) out[s.key] = s.key in out ? `${out[s.key]}\n${s.value}` : s.value;
  return out;
}

function splitNote(value: string, lineTerminator: string): string[] {
  const lines = lineTerminator ? value.split(lineTerminator) : [value];
  return lines.map((l) => l.trim()).filter(Boolean);
}
