import type { ByteReader } from './bytes';
import { RecordFormatError } from './errors';

export interface Seg2String {
  /** Keyword, upper case (the standard's keywords are upper case; some writers are not). */
  key: string;
  value: string;
  /** Offset of the string's 2-byte length field. */
  offset: number;
}

/** A latin-1 view of bytes, so any byte survives as one character. */
const latin1 = (bytes: Uint8Array): string => {
  let s = '';
  for (let i = 0; i < bytes.length; i += 8192) s += String.fromCharCode(...bytes.subarray(i, i + 8192));
  return s;
};

/**
 * The free-format strings of a file or trace descriptor block (Pullan 1990): each string starts with
 * a 2-byte offset to the next one (counted from its own first byte, so ≥ 2), then the text, ended by
 * the file's string terminator (1 or 2 bytes); an offset of 0 ends the list. The text is a keyword, one
 * or more blanks, and the value. Reads stop at `end` (the block's end), so a bad offset cannot leave it.
 */
export function readSeg2Strings(r: ByteReader, start: number, end: number, terminator: Uint8Array, where: string): Seg2String[] {
  const strings: Seg2String[] = [];
  let at = start;
  while (at + 2 <= end) {
    const size = r.u16(at, `the length of a string in ${where}`);
    if (size === 0) return strings;
    if (size < 2 || at + size > end) {
      throw new RecordFormatError(at, `a string in ${where} says it is ${size} bytes long, but ${size < 2 ? 'a string takes at least the 2 bytes of its length' : `only ${end - at} bytes are left in the block`}`);
    }
    const body = r.bytes.subarray(at + 2, at + size);
    const text = latin1(body.subarray(0, terminatorAt(body, terminator)));
    const match = /^\s*(\S+)(?:[ \t]+([\s\S]*?))?\s*$/.exec(text);
    if (match) strings.push({ key: match[1].toUpperCase(), value: match[2] ?? '', offset: at });
    at += size;
  }
  return strings; // the block ended without a 0 offset: what was read is kept (common in the field)
}

/** Index of the first terminator in `body`, or its length when there is none (the string then fills its space). */
function terminatorAt(body: Uint8Array, terminator: Uint8Array): number {
  outer: for (let i = 0; i + terminator.length <= body.length; i++) {
    for (let k = 0; k < terminator.length; k++) if (body[i + k] !== terminator[k]) continue outer;
    return i;
  }
  return body.length;
}

/** Bytes of a string list as our writer lays it out: each string padded to an even length, then a 0 offset. */
export function encodeSeg2Strings(strings: [string, string][], terminator: Uint8Array, littleEndian: boolean): Uint8Array {
  const parts: Uint8Array[] = [];
  for (const [key, value] of strings) {
    const text = `${key} ${value}`;
    let size = 2 + text.length + terminator.length;
    if (size % 2) size++;
    if (size > 0xffff) throw new RangeError(`string ${key} is too long for SEG-2`);
    const b = new Uint8Array(size);
    new DataView(b.buffer).setUint16(0, size, littleEndian);
    for (let i = 0; i < text.length; i++) {
      const c = text.charCodeAt(i);
      if (c > 0xff) throw new RangeError(`string ${key} has a character outside latin-1`);
      b[2 + i] = c;
    }
    b.set(terminator, 2 + text.length);
    parts.push(b);
  }
  parts.push(new Uint8Array(2)); // offset 0: end of the list
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let o = 0;
  for (const p of parts) {
    out.set(p, o);
    o += p.length;
  }
  return out;
}
