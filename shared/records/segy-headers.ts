/**
 * Byte offsets (0-based, from the start of the file or of the 240-byte trace header) of the SEG-Y
 * fields Timefield reads. Source: SEG-Y rev 1 (2002) and rev 2.0 (2017) data exchange format,
 * SEG Technical Standards Committee; the standard counts bytes from 1 (3217–3218 here is 3216).
 */
export const TEXT_HEADER_BYTES = 3200;
export const BINARY_HEADER_AT = 3200;
export const TRACE_HEADER_BYTES = 240;

export const BIN = {
  tracesPerEnsemble: 3212, // i16
  sampleInterval: 3216, // u16, µs
  samplesPerTrace: 3220, // u16
  format: 3224, // i16
  measurementSystem: 3254, // i16: 1 metres, 2 feet
  extSamplesPerTrace: 3268, // i32 (rev 2)
  extSampleInterval: 3272, // f64, µs (rev 2)
  byteOrderConstant: 3296, // u32 0x01020304 in the file's byte order (rev 2)
  majorRevision: 3500, // u8
  minorRevision: 3501, // u8
  fixedLength: 3502, // i16
  extendedTextHeaders: 3504, // i16; −1: variable, ended by a ((SEG: EndText)) stanza
  extraTraceHeaders: 3506, // i32 (rev 2): additional 240-byte trace headers per trace
  firstTraceAt: 3520, // u64 (rev 2), 0 when not given
  trailerStanzas: 3528, // i32 (rev 2)
} as const;

export const TRACE = {
  sequenceInLine: 0, // i32
  sequenceInFile: 4, // i32
  fieldRecord: 8, // i32
  channel: 12, // i32, trace number within the original field record
  sourcePoint: 16, // i32
  identification: 28, // i16: 1 seismic, 2 dead
  verticalSum: 30, // i16
  offset: 36, // i32
  receiverElevation: 40, // i32
  sourceElevation: 44, // i32, surface elevation at the source
  sourceDepth: 48, // i32
  elevationScalar: 68, // i16
  coordinateScalar: 70, // i16
  sourceX: 72, // i32
  sourceY: 76,
  groupX: 80,
  groupY: 84,
  coordinateUnits: 88, // i16: 1 length, 2 arc seconds, 3 degrees, 4 DMS
  delay: 108, // i16, delay recording time, ms
  samples: 114, // u16
  sampleInterval: 116, // u16, µs
  year: 156,
  dayOfYear: 158,
  hour: 160,
  minute: 162,
  second: 164,
  timeScalar: 214, // i16, applies to the times in bytes 95–114
} as const;

/** SEG-Y scalars: positive multiplies, negative divides, 0 means 1. */
export const applyScalar = (value: number, scalar: number): number => (scalar > 0 ? value * scalar : scalar < 0 ? value / -scalar : value);
