import { MAX_RECORD_BYTES, MAX_RECORD_SAMPLES, MAX_RECORD_TRACES, MAX_TRACE_SAMPLES, outOfRange, RECORD_DELAY_RANGE, SAMPLE_INTERVAL_RANGE, X_RANGE, Z_RANGE } from '../limits';
import { ByteReader } from './bytes';
import { ebcdicToText, isEbcdic } from './ebcdic';
import { RecordFormatError } from './errors';
import { applyScalar, BIN, BINARY_HEADER_AT, TEXT_HEADER_BYTES, TRACE, TRACE_HEADER_BYTES } from './segy-headers';
import { decodeSegySamples, SEGY_SAMPLE_BYTES } from './segy-samples';
import type { RecordPoint, RecordTrace, SeismicRecord } from './types';

const FEET = 0.3048;
const END_TEXT = '((SEG: ENDTEXT))';

/**
 * Reads a SEG-Y rev 1 or rev 2.0 file (SEG Technical Standards Committee, 2002 and 2017): the
 * 3200-byte textual header (EBCDIC or ASCII), the 400-byte binary header, extended textual headers,
 * then traces of a 240-byte header (plus any additional trace headers, rev 2) and their samples.
 * Big-endian unless rev 2's byte-order constant (bytes 3297–3300) says little-endian. Positions are
 * the source and group coordinates with their scalar (bytes 71–72) and elevations with theirs
 * (69–70), feet converted; the record has no positions when every coordinate in the file is zero.
 */
export function readSegy(bytes: Uint8Array): SeismicRecord {
  if (bytes.length > MAX_RECORD_BYTES) throw new RecordFormatError(0, `the file is ${bytes.length} bytes; at most ${MAX_RECORD_BYTES} are accepted`);
  const r = new ByteReader(bytes, false);
  r.need(0, TEXT_HEADER_BYTES + 400, 'the 3200-byte textual header and the 400-byte binary header of a SEG-Y file');
  r.littleEndian = littleEndianFile(r);

  const major = r.u8(BIN.majorRevision, 'the revision');
  const minor = r.u8(BIN.minorRevision, 'the revision');
  const format = r.i16(BIN.format, 'the data sample format code');
  if (!(format in SEGY_SAMPLE_BYTES)) throw new RecordFormatError(BIN.format, `expected a data sample format code 1, 2, 3, 5, 6, 8, 10, 11 or 16 (got ${format})`);
  const feet = r.i16(BIN.measurementSystem, 'the measurement system') === 2;
  const rev2 = major >= 2;
  const fixedLength = r.i16(BIN.fixedLength, 'the fixed-length trace flag') === 1;
  let binarySamples = r.u16(BIN.samplesPerTrace, 'the samples per trace');
  if (binarySamples === 0 && rev2) binarySamples = Math.max(0, r.i32(BIN.extSamplesPerTrace, 'the extended samples per trace'));
  let binaryInterval = r.u16(BIN.sampleInterval, 'the sample interval') * 1e-6;
  if (binaryInterval === 0 && rev2) binaryInterval = r.f64(BIN.extSampleInterval, 'the extended sample interval') * 1e-6;
  const extraHeaders = rev2 ? r.i32(BIN.extraTraceHeaders, 'the number of additional trace headers') : 0;
  if (extraHeaders < 0 || extraHeaders > 1000) throw new RecordFormatError(BIN.extraTraceHeaders, `expected 0 to 1000 additional trace headers (got ${extraHeaders})`);
  const trailer = rev2 ? r.i32(BIN.trailerStanzas, 'the number of data trailer stanzas') : 0;
  if (trailer < 0 || trailer * TEXT_HEADER_BYTES > bytes.length) throw new RecordFormatError(BIN.trailerStanzas, `the file cannot hold ${trailer} data trailer stanzas`);

  const notes = textLines(bytes.subarray(0, TEXT_HEADER_BYTES));
  let at = TEXT_HEADER_BYTES + 400;
  at = readExtendedText(r, at, notes);
  if (rev2) {
    const first = r.u64(BIN.firstTraceAt, 'the byte offset of the first trace');
    if (first > 0) {
      if (first < at || first > bytes.length) throw new RecordFormatError(BIN.firstTraceAt, `the first trace is said to start at byte ${first}; expected ${at} to ${bytes.length}`);
      at = first;
    }
  }

  const end = bytes.length - trailer * TEXT_HEADER_BYTES;
  const headerBytes = TRACE_HEADER_BYTES * (1 + extraHeaders);
  const raw: RawTrace[] = [];
  let total = 0;
  while (at < end) {
    if (raw.length >= MAX_RECORD_TRACES) throw new RecordFormatError(at, `the file holds more than ${MAX_RECORD_TRACES} traces`);
    r.need(at, headerBytes, `the trace header of trace ${raw.length + 1}`);
    const t = readTrace(r, at, raw.length, { format, fixedLength, binarySamples, binaryInterval, headerBytes });
    total += t.samples.length;
    if (total > MAX_RECORD_SAMPLES) throw new RecordFormatError(at, `the file holds more than ${MAX_RECORD_SAMPLES} samples in all`);
    raw.push(t);
    at = t.next;
  }
  if (raw.length === 0) throw new RecordFormatError(at, 'expected at least one trace after the headers');
  const traces = placeTraces(raw, feet);
  return {
    format: 'segy',
    revision: `${major}.${minor}`,
    byteOrder: r.littleEndian ? 'little' : 'big',
    traces,
    keywords: {
      SAMPLE_FORMAT: String(format),
      MEASUREMENT_SYSTEM: feet ? 'feet' : 'metres',
      SAMPLES_PER_TRACE: String(binarySamples),
      SAMPLE_INTERVAL_US: String(Math.round(binaryInterval * 1e6 * 1000) / 1000),
      TRACES_PER_ENSEMBLE: String(r.i16(BIN.tracesPerEnsemble, 'the traces per ensemble')),
    },
    notes,
    acquired: raw[0].acquired,
  };
}

/** Rev 2's byte-order constant 0x01020304; without it, big-endian unless only little-endian gives a valid format code. */
function littleEndianFile(r: ByteReader): boolean {
  const constant = r.view.getUint32(BIN.byteOrderConstant, false);
  if (constant === 0x01020304) return false;
  if (constant === 0x04030201) return true;
  const big = r.view.getInt16(BIN.format, false), little = r.view.getInt16(BIN.format, true);
  return !(big in SEGY_SAMPLE_BYTES) && little in SEGY_SAMPLE_BYTES;
}

/** 40 card images of 80 characters, blanks trimmed; empty cards dropped. */
function textLines(block: Uint8Array): string[] {
  const text = isEbcdic(block) ? ebcdicToText(block) : String.fromCharCode(...block).replace(/[^\x20-\x7e]/g, ' ');
  const lines: string[] = [];
  for (let i = 0; i < text.length; i += 80) {
    const line = text.slice(i, i + 80).trimEnd();
    if (line.trim()) lines.push(line);
  }
  return lines;
}

function readExtendedText(r: ByteReader, at: number, notes: string[]): number {
  const count = r.i16(BIN.extendedTextHeaders, 'the number of extended textual headers');
  if (count < -1) throw new RecordFormatError(BIN.extendedTextHeaders, `expected −1 or more extended textual headers (got ${count})`);
  if (count >= 0) {
    r.need(at, count * TEXT_HEADER_BYTES, `${count} extended textual headers`);
    for (let i = 0; i < count; i++) notes.push(...textLines(r.bytes.subarray(at + i * TEXT_HEADER_BYTES, at + (i + 1) * TEXT_HEADER_BYTES)));
    return at + count * TEXT_HEADER_BYTES;
  }
  // −1: as many as there are, the last one holding ((SEG: EndText)); bounded by the file.
  for (;;) {
    r.need(at, TEXT_HEADER_BYTES, 'an extended textual header ending with ((SEG: EndText))');
    const lines = textLines(r.bytes.subarray(at, at + TEXT_HEADER_BYTES));
    notes.push(...lines);
    at += TEXT_HEADER_BYTES;
    if (lines.some((l) => l.toUpperCase().includes(END_TEXT))) return at;
  }
}

interface RawTrace {
  index: number;
  channel: number;
  samples: Float64Array;
  sampleInterval: number;
  delay: number;
  source: RecordPoint;
  receiver: RecordPoint;
  coordinateUnits: number;
  hasElevation: boolean;
  stack: number | null;
  markedDead: boolean;
  keywords: Record<string, string>;
  acquired: string | null;
  /** Offset of its trace header. */
  at: number;
  next: number;
}

interface FileLayout {
  format: number;
  fixedLength: boolean;
  binarySamples: number;
  binaryInterval: number;
  headerBytes: number;
}

function readTrace(r: ByteReader, at: number, index: number, file: FileLayout): RawTrace {
  const no = index + 1;
  const f = (field: keyof typeof TRACE, size: 2 | 4) => (size === 2 ? r.i16(at + TRACE[field], `trace ${no}'s ${field}`) : r.i32(at + TRACE[field], `trace ${no}'s ${field}`));
  const ownSamples = r.u16(at + TRACE.samples, `trace ${no}'s sample count`);
  const n = file.fixedLength || ownSamples === 0 ? file.binarySamples : ownSamples;
  if (n === 0) throw new RecordFormatError(at + TRACE.samples, `trace ${no}: expected a sample count in its header or in the binary header`);
  if (n > MAX_TRACE_SAMPLES) throw new RecordFormatError(at + TRACE.samples, `trace ${no} claims ${n} samples; at most ${MAX_TRACE_SAMPLES} are accepted`);
  const ownInterval = r.u16(at + TRACE.sampleInterval, `trace ${no}'s sample interval`) * 1e-6;
  const interval = ownInterval || file.binaryInterval;
  const problem = outOfRange(interval, SAMPLE_INTERVAL_RANGE);
  if (problem) throw new RecordFormatError(at + TRACE.sampleInterval, `trace ${no}: the sample interval ${problem}`);
  const delay = applyScalar(f('delay', 2), f('timeScalar', 2)) / 1000;
  const delayProblem = outOfRange(delay, RECORD_DELAY_RANGE);
  if (delayProblem) throw new RecordFormatError(at + TRACE.delay, `trace ${no}: the delay recording time ${delayProblem}`);

  const cs = f('coordinateScalar', 2), es = f('elevationScalar', 2);
  const coordinate = (field: keyof typeof TRACE) => applyScalar(f(field, 4), cs);
  const elevation = (field: keyof typeof TRACE) => applyScalar(f(field, 4), es);
  const dataAt = at + file.headerBytes;
  const samples = decodeSegySamples(r, dataAt, n, file.format, no);
  const keywords: Record<string, string> = {};
  for (const name of ['sequenceInLine', 'sequenceInFile', 'fieldRecord', 'channel', 'sourcePoint', 'offset', 'sourceX', 'sourceY', 'groupX', 'groupY', 'receiverElevation', 'sourceElevation', 'sourceDepth'] as const) {
    keywords[name] = String(f(name, 4));
  }
  for (const name of ['identification', 'verticalSum', 'elevationScalar', 'coordinateScalar', 'coordinateUnits', 'delay', 'timeScalar'] as const) keywords[name] = String(f(name, 2));
  const channel = f('channel', 4);
  const sum = f('verticalSum', 2);
  const receiverZ = elevation('receiverElevation'), sourceZ = elevation('sourceElevation');
  return {
    index,
    channel: channel > 0 ? channel : no,
    samples,
    sampleInterval: interval,
    delay,
    source: { x: coordinate('sourceX'), y: coordinate('sourceY'), z: sourceZ },
    receiver: { x: coordinate('groupX'), y: coordinate('groupY'), z: receiverZ },
    coordinateUnits: f('coordinateUnits', 2),
    hasElevation: receiverZ !== 0 || sourceZ !== 0,
    stack: sum > 0 ? sum : null,
    markedDead: f('identification', 2) === 2,
    keywords,
    acquired: traceDate(f('year', 2), f('dayOfYear', 2), f('hour', 2), f('minute', 2), f('second', 2)),
    at,
    next: dataAt + n * SEGY_SAMPLE_BYTES[file.format],
  };
}

/** Positions in metres; none at all when the file's coordinates are all zero or are angles (units 2–4). */
function placeTraces(raw: RawTrace[], feet: boolean): RecordTrace[] {
  const k = feet ? FEET : 1;
  const lengths = raw.every((t) => t.coordinateUnits <= 1);
  const anyXY = raw.some((t) => t.source.x || t.source.y || t.receiver.x || t.receiver.y);
  const anyZ = raw.some((t) => t.hasElevation);
  const scale = (p: RecordPoint, t: RawTrace, what: string): RecordPoint => {
    const out = { x: p.x * k, y: (p.y ?? 0) * k, z: anyZ ? (p.z ?? 0) * k : null };
    const problem = outOfRange(out.x, X_RANGE) ?? outOfRange(out.y, X_RANGE) ?? (out.z === null ? null : outOfRange(out.z, Z_RANGE));
    if (problem) throw new RecordFormatError(t.at, `trace ${t.index + 1}: the ${what} position ${problem}`);
    return out;
  };
  return raw.map((t) => ({
    index: t.index,
    channel: t.channel,
    samples: t.samples,
    descale: 1,
    sampleInterval: t.sampleInterval,
    delay: t.delay,
    receiver: lengths && anyXY ? scale(t.receiver, t, 'receiver') : null,
    source: lengths && anyXY ? scale(t.source, t, 'source') : null,
    stack: t.stack,
    markedDead: t.markedDead,
    keywords: t.keywords,
  }));
}

function traceDate(year: number, day: number, hour: number, minute: number, second: number): string | null {
  if (year < 1900 || year > 9999 || day < 1 || day > 366) return null;
  const d = new Date(Date.UTC(year, 0, day, hour, minute, second));
  return Number.isNaN(d.getTime()) ? null : d.toISOString().slice(0, 19);
}
