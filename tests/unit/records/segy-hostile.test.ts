/**
 * Malformed and hostile SEG-Y files (issue 12, item 1): every one gets a RecordFormatError naming the
 * byte offset and what was expected, never a hang or another exception. Offsets from SEG-Y rev 1 /
 * rev 2.0 (SEG Technical Standards Committee, 2002 and 2017), counted from 0 here.
 */
import { describe, expect, it } from 'vitest';
import { readSegy, RecordFormatError, writeSegy } from '../../../shared/records';

const good = () => writeSegy([1, 2].map((c) => ({ samples: [1, 2, 3, 4], channel: c })), { sampleInterval: 0.001, format: 5 });
const view = (b: Uint8Array) => new DataView(b.buffer, b.byteOffset, b.byteLength);
function error(bytes: Uint8Array): RecordFormatError {
  try {
    readSegy(bytes);
  } catch (err) {
    if (err instanceof RecordFormatError) return err;
    throw err;
  }
  throw new Error('read without an error');
}

describe('malformed and hostile SEG-Y files', () => {
  it('an unknown sample format code (bytes 3225–3226)', () => {
    const b = good();
    view(b).setInt16(3224, 4); // 4: fixed point with gain, obsolete
    expect(error(b).message).toMatch(/^byte 3224: expected a data sample format code/);
  });
  it('more extended textual headers than the file holds (bytes 3505–3506)', () => {
    const b = good();
    view(b).setInt16(3504, 30000);
    expect(error(b).message).toMatch(/30000 extended textual headers .* the file ends/);
  });
  it('−1 extended textual headers without ((SEG: EndText)) ends at the file end, not in a loop', () => {
    const b = good();
    view(b).setInt16(3504, -1);
    expect(error(b).message).toMatch(/ending with \(\(SEG: EndText\)\)/);
  });
  it('a trace header claiming 65535 samples', () => {
    const b = good();
    view(b).setInt16(3502, 0); // not fixed length: the trace's own count is used
    view(b).setUint16(3600 + 114, 65535);
    expect(error(b).message).toMatch(/^byte 3840: expected the 65535 samples of trace 1/);
  });
  it('a sample interval of 0 everywhere', () => {
    const b = good();
    view(b).setUint16(3216, 0);
    view(b).setUint16(3600 + 116, 0);
    expect(error(b).message).toMatch(/^byte 3716: trace 1: the sample interval must be between/);
  });
  it('a NaN sample', () => {
    const b = good();
    view(b).setFloat32(3600 + 240 + 8, Number.NaN);
    expect(error(b).message).toMatch(/^byte 3848: trace 1: sample 3 is not a finite number/);
  });
  it('a coordinate beyond the accepted range', () => {
    const b = good();
    view(b).setInt16(3600 + 70, 10000); // scalar ×10000
    view(b).setInt32(3600 + 80, 2_000_000_000);
    expect(error(b).message).toMatch(/trace 1: the receiver position must be between/);
  });
  it('every cut of a file inside a header or a trace is refused, random bytes never throw anything else', () => {
    const b = good();
    for (let cut = 0; cut < b.length; cut++) {
      // A cut right after trace 1 (3600 + 240 + 4·4 bytes) is a whole one-trace file.
      if (cut === 3856) expect(readSegy(b.subarray(0, cut)).traces).toHaveLength(1);
      else expect(() => readSegy(b.subarray(0, cut))).toThrow(RecordFormatError);
    }
    let seed = 11;
    for (let k = 0; k < 200; k++) {
      const junk = b.slice();
      for (let i = 3200; i < junk.length; i++) if (((seed = (seed * 1103515245 + 12345) >>> 0) >>> 28) === 0) junk[i] = seed & 0xff;
      try {
        readSegy(junk);
      } catch (err) {
        expect(err).toBeInstanceOf(RecordFormatError);
      }
    }
  });
});
