import type { ByteReader } from './bytes';
import { RecordFormatError } from './errors';
import { ibmToNumber, numberToIbm } from './ibm-float';

/**
 * SEG-Y data sample format codes (binary header bytes 3225–3226; SEG-Y rev 2.0, SEG Technical
 * Standards Committee, 2017, table 1): 1 IBM float, 2 int32, 3 int16, 5 IEEE float32, 6 IEEE float64,
 * 8 int8, 10 uint32, 11 uint16, 16 uint8. (4, fixed point with gain, is obsolete; 7, 9, 12, 15 are
 * 24- and 64-bit integers, not written by refraction instruments — refused with a message.)
 */
export const SEGY_SAMPLE_BYTES: Record<number, number> = { 1: 4, 2: 4, 3: 2, 5: 4, 6: 8, 8: 1, 10: 4, 11: 2, 16: 1 };

export function decodeSegySamples(r: ByteReader, offset: number, n: number, code: number, traceNo: number): Float64Array {
  const size = SEGY_SAMPLE_BYTES[code];
  r.need(offset, n * size, `the ${n} samples of trace ${traceNo}`);
  const v = r.view, le = r.littleEndian;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const o = offset + i * size;
    switch (code) {
      case 1: out[i] = ibmToNumber(v.getUint32(o, le)); break;
      case 2: out[i] = v.getInt32(o, le); break;
      case 3: out[i] = v.getInt16(o, le); break;
      case 5: out[i] = v.getFloat32(o, le); break;
      case 6: out[i] = v.getFloat64(o, le); break;
      case 8: out[i] = v.getInt8(o); break;
      case 10: out[i] = v.getUint32(o, le); break;
      case 11: out[i] = v.getUint16(o, le); break;
      case 16: out[i] = v.getUint8(o); break;
    }
    if (!Number.isFinite(out[i])) throw new RecordFormatError(o, `trace ${traceNo}: sample ${i + 1} is not a finite number`);
  }
  return out;
}

/** Our writer's formats: 1 (IBM), 2, 3, 5 — big-endian as rev 1 requires. */
export function encodeSegySamples(samples: ArrayLike<number>, code: 1 | 2 | 3 | 5): Uint8Array {
  const size = SEGY_SAMPLE_BYTES[code];
  const out = new Uint8Array(samples.length * size);
  const v = new DataView(out.buffer);
  for (let i = 0; i < samples.length; i++) {
    const x = samples[i];
    if (code === 1) v.setUint32(i * size, numberToIbm(x));
    else if (code === 2) v.setInt32(i * size, Math.round(x));
    else if (code === 3) v.setInt16(i * size, Math.round(x));
    else v.setFloat32(i * size, x);
  }
  return out;
}
