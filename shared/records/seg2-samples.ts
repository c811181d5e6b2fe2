import type { ByteReader } from './bytes';
import { RecordFormatError } from './errors';

/**
 * SEG-2 data format codes (Pullan 1990, trace descriptor block byte 12): 1 = 16-bit integer,
 * 2 = 32-bit integer, 3 = 20-bit floating point (SEG-D), 4 = 32-bit IEEE float, 5 = 64-bit IEEE float,
 * all in the file's byte order.
 */
export type Seg2FormatCode = 1 | 2 | 3 | 4 | 5;

/** Bytes taken by `n` samples of a format (format 3 packs 4 samples in 10 bytes). */
export function seg2DataBytes(code: Seg2FormatCode, n: number): number {
  switch (code) {
    case 1:
      return 2 * n;
    case 2:
    case 4:
      return 4 * n;
    case 3:
      return (n / 4) * 10;
    case 5:
      return 8 * n;
  }
}

export const isSeg2FormatCode = (c: number): c is Seg2FormatCode => c >= 1 && c <= 5 && Number.isInteger(c);

/**
 * Decodes `n` samples at `offset`. Format 3: groups of five 16-bit words; the first holds four 4-bit
 * exponents (the first sample's in the low 4 bits), the next four the mantissas as one's-complement
 * 16-bit integers; sample = mantissa · 2^exponent (in counts). Pullan (1990) defines the format by
 * reference to SEG-D's 20-bit format; the nibble order and one's complement follow the files real
 * instruments write, as read by a general-purpose open-source seismology library checked against a
 * published reference file (from its source, not from the standard).
 */
export function decodeSeg2Samples(r: ByteReader, offset: number, n: number, code: Seg2FormatCode, traceNo: number): Float64Array {
  r.need(offset, seg2DataBytes(code, n), `the data block of trace ${traceNo}`);
  const out = new Float64Array(n);
  const v = r.view, le = r.littleEndian;
  switch (code) {
    case 1:
      for (let i = 0; i < n; i++) out[i] = v.getInt16(offset + 2 * i, le);
      break;
    case 2:
      for (let i = 0; i < n; i++) out[i] = v.getInt32(offset + 4 * i, le);
      break;
    case 4:
      for (let i = 0; i < n; i++) out[i] = v.getFloat32(offset + 4 * i, le);
      break;
    case 5:
      for (let i = 0; i < n; i++) out[i] = v.getFloat64(offset + 8 * i, le);
      break;
    case 3:
      if (n % 4 !== 0) throw new RecordFormatError(offset, `trace ${traceNo}: data format 3 needs a multiple of 4 samples (got ${n})`);
      for (let g = 0; g < n / 4; g++) {
        const base = offset + 10 * g;
        const exponents = v.getUint16(base, le);
        for (let k = 0; k < 4; k++) {
          const m = v.getInt16(base + 2 + 2 * k, le);
          const mantissa = m < 0 ? m + 1 : m; // one's complement → value
          out[4 * g + k] = mantissa * 2 ** ((exponents >>> (4 * k)) & 0xf);
        }
      }
      break;
  }
  return out;
}

/** Encodes samples for our writer (values are rounded for the integer formats; format 3 picks the smallest exponent that fits). */
export function encodeSeg2Samples(samples: ArrayLike<number>, code: Seg2FormatCode, littleEndian: boolean): Uint8Array {
  const n = samples.length;
  if (code === 3 && n % 4 !== 0) throw new RangeError('data format 3 needs a multiple of 4 samples');
  const bytes = new Uint8Array(seg2DataBytes(code, n));
  const v = new DataView(bytes.buffer);
  const le = littleEndian;
  const whole = (x: number, lo: number, hi: number) => {
    const r = Math.round(x);
    if (!(r >= lo && r <= hi)) throw new RangeError(`sample ${x} does not fit data format ${code}`);
    return r;
  };
  switch (code) {
    case 1:
      for (let i = 0; i < n; i++) v.setInt16(2 * i, whole(samples[i], -32768, 32767), le);
      break;
    case 2:
      for (let i = 0; i < n; i++) v.setInt32(4 * i, whole(samples[i], -2147483648, 2147483647), le);
      break;
    case 4:
      for (let i = 0; i < n; i++) v.setFloat32(4 * i, samples[i], le);
      break;
    case 5:
      for (let i = 0; i < n; i++) v.setFloat64(8 * i, samples[i], le);
      break;
    case 3:
      for (let g = 0; g < n / 4; g++) {
        let exponents = 0;
        for (let k = 0; k < 4; k++) {
          const x = whole(samples[4 * g + k], -32767 * 2 ** 15, 32767 * 2 ** 15);
          let e = 0;
          while (Math.abs(Math.round(x / 2 ** e)) > 32767) e++;
          const m = Math.round(x / 2 ** e);
          exponents |= e << (4 * k);
          v.setInt16(10 * g + 2 + 2 * k, m < 0 ? m - 1 : m, le); // value → one's complement
        }
        v.setUint16(10 * g, exponents, le);
      }
      break;
  }
  return bytes;
}
