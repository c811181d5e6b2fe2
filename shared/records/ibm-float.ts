/**
 * IBM System/360 single-precision hexadecimal floating point (SEG-Y sample format 1):
 * sign bit, 7-bit exponent of 16 in excess-64, 24-bit fraction; value = (−1)^s · 0.f · 16^(e−64).
 * Source: SEG-Y rev 1 (SEG Technical Standards Committee, 2002), appendix on data sample formats;
 * IBM System/360 Principles of Operation (floating-point data format). From memory.
 */
export function ibmToNumber(word: number): number {
  const sign = word >>> 31 ? -1 : 1;
  const exponent = (word >>> 24) & 0x7f;
  const fraction = word & 0x00ffffff;
  if (fraction === 0) return 0;
  return sign * (fraction / 0x1000000) * Math.pow(16, exponent - 64);
}

/**
 * The nearest IBM word to `value` (truncating the fraction, as the format has no rounding rule).
 * Values beyond the range (≈ 7.2e75) saturate; those below ≈ 5.4e-79 become zero.
 */
export function numberToIbm(value: number): number {
  if (value === 0 || !Number.isFinite(value)) return 0;
  const sign = value < 0 ? 0x80000000 : 0;
  let v = Math.abs(value);
  let exponent = 64;
  while (v >= 1 && exponent < 127) {
    v /= 16;
    exponent++;
  }
  while (v < 1 / 16 && exponent > 0) {
    v *= 16;
    exponent--;
  }
  if (v >= 1) return (sign | 0x7fffffff) >>> 0;
  const fraction = Math.floor(v * 0x1000000);
  if (fraction === 0) return 0;
  return (sign | (exponent << 24) | fraction) >>> 0;
}
