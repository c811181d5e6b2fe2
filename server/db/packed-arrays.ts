/**
 * Typed arrays as bytea: the array's bytes (little-endian on every platform Node runs on here),
 * raw-deflated at level 1 — fast, and a velocity grid shrinks by about half.
 */
import { deflateRawSync, inflateRawSync } from 'node:zlib';

type Packable = Float32Array | Float64Array | Int32Array;

export function pack(a: Packable): Buffer {
  return deflateRawSync(new Uint8Array(a.buffer, a.byteOffset, a.byteLength), { level: 1 });
}

// inflateRawSync returns a Buffer that may share a pool and start unaligned: copy into a fresh buffer.
const bytes = (b: Buffer): ArrayBuffer => new Uint8Array(inflateRawSync(b)).buffer;

export const unpackFloat32 = (b: Buffer): Float32Array => new Float32Array(bytes(b));
export const unpackFloat64 = (b: Buffer): Float64Array => new Float64Array(bytes(b));
export const unpackInt32 = (b: Buffer): Int32Array => new Int32Array(bytes(b));
