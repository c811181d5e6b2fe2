/**
 * SEG-2 files built byte by byte in this test from the published layout (Pullan, S. E., 1990,
 * "Recommended standard for seismic (/radar) data files in the personal computer environment",
 * Geophysics 55(9), 1260–1271; offsets below from its figures, from memory): file descriptor block
 * 0–1 id 0x3A55, 2–3 revision, 4–5 trace pointer sub-block size M, 6–7 trace count N, 8 string
 * terminator size, 9–10 terminator, 11 line terminator size, 12–13 line terminator, pointers from 32,
 * strings from 32 + M; trace descriptor block 0–1 id 0x4422, 2–3 block size X, 4–7 data size, 8–11
 * samples, 12 format code, strings from 32, data from X. Each string: 2-byte offset to the next,
 * text, terminator; offset 0 ends the list.
 */
import { describe, expect, it } from 'vitest';
import { readSeg2, RecordFormatError, writeSeg2 } from '../../../shared/records';

interface Spec {
  le: boolean;
  term: number[];
  line: number[];
  fileStrings: string[];
  traces: { strings: string[]; code: number; n: number; data: number[] }[];
}

/** Independent of the reader and writer: plain byte pushes. */
function build(spec: Spec): Uint8Array {
  const out: number[] = [];
  const u16 = (v: number) => (spec.le ? [v & 0xff, v >> 8] : [v >> 8, v & 0xff]);
  const u32 = (v: number) => (spec.le ? [v & 0xff, (v >> 8) & 0xff, (v >> 16) & 0xff, v >>> 24] : [v >>> 24, (v >> 16) & 0xff, (v >> 8) & 0xff, v & 0xff]);
  const strings = (list: string[]) => {
    const b: number[] = [];
    for (const s of list) {
      const body = [...s].map((c) => c.charCodeAt(0)).concat(spec.term);
      if ((2 + body.length) % 2) body.push(0x20); // odd length padded with a blank after the terminator
      b.push(...u16(2 + body.length), ...body);
    }
    b.push(0, 0);
    return b;
  };
  const m = 4 * spec.traces.length;
  out.push(...u16(0x3a55), ...u16(1), ...u16(m), ...u16(spec.traces.length));
  out.push(spec.term.length, spec.term[0], spec.term[1] ?? 0, spec.line.length, spec.line[0] ?? 0, spec.line[1] ?? 0);
  while (out.length < 32) out.push(0);
  const pointerAt = out.length;
  for (let i = 0; i < m; i++) out.push(0);
  out.push(...strings(spec.fileStrings));
  for (const [i, t] of spec.traces.entries()) {
    while (out.length % 4) out.push(0);
    const at = out.length;
    out.splice(pointerAt + 4 * i, 4, ...u32(at));
    const s = strings(t.strings);
    let x = 32 + s.length;
    while (x % 4) x++;
    out.push(...u16(0x4422), ...u16(x), ...u32(t.data.length), ...u32(t.n), t.code);
    while (out.length < at + 32) out.push(0);
    out.push(...s);
    while (out.length < at + x) out.push(0);
    out.push(...t.data);
  }
  return Uint8Array.from(out);
}

/** Sample bytes via DataView (the JavaScript engine's own int/IEEE encoders). */
function sampleBytes(code: number, values: number[], le: boolean): number[] {
  const size = [0, 2, 4, 0, 4, 8][code];
  const b = new DataView(new ArrayBuffer(values.length * size));
  values.forEach((v, i) => {
    if (code === 1) b.setInt16(i * 2, v, le);
    if (code === 2) b.setInt32(i * 4, v, le);
    if (code === 4) b.setFloat32(i * 4, v, le);
    if (code === 5) b.setFloat64(i * 8, v, le);
  });
  return [...new Uint8Array(b.buffer)];
}

const VALUES: Record<number, number[]> = {
  1: [0, 1, -1, 32767, -32768, 1234, -4321, 7],
  2: [0, 1, -1, 2147483647, -2147483648, 123456789, -987654, 7],
  4: [0, 1.5, -2.25, 3.4028234663852886e38, -1.1754943508222875e-38, 0.1 as number, 1e-3, 7],
  5: [0, 1.5, -2.25, 1.7976931348623157e308, 5e-324, 0.1, Math.PI, -7],
};
const f32 = (v: number) => new Float32Array([v])[0];

describe('SEG-2 reader against files built from the published layout', () => {
  for (const le of [true, false]) {
    for (const code of [1, 2, 4, 5]) {
      it(`format ${code}, ${le ? 'little' : 'big'}-endian, two-byte string terminator and CR LF lines: samples and keywords exact`, () => {
        const bytes = build({
          le,
          term: [0x3b, 0x3b], // ";;" — any one or two bytes may end a string
          line: [0x0d, 0x0a],
          fileStrings: ['ACQUISITION_DATE 07/JAN/2013', 'ACQUISITION_TIME 10:30:41', 'UNITS FEET', 'NOTE first line\r\nsecond line', 'CLIENT_REF Q-17'],
          traces: [1, 2].map((ch) => ({
            strings: [`CHANNEL_NUMBER ${ch}`, 'SAMPLE_INTERVAL 0.00025', 'DELAY -0.002', 'DESCALING_FACTOR 2.5e-3', `RECEIVER_LOCATION ${10 * ch}`, 'SOURCE_LOCATION -5 0 100', 'STACK 4', 'CUSTOM_WORD  some value'],
            code,
            n: 8,
            data: sampleBytes(code, VALUES[code], le),
          })),
        });
        const rec = readSeg2(bytes);
        expect(rec.byteOrder).toBe(le ? 'little' : 'big');
        expect(rec.traces).toHaveLength(2);
        const t = rec.traces[1];
        expect(Array.from(t.samples)).toEqual(code === 4 ? VALUES[4].map(f32) : VALUES[code]);
        expect(t.channel).toBe(2);
        expect(t.sampleInterval).toBe(0.00025);
        expect(t.delay).toBe(-0.002);
        expect(t.descale).toBe(0.0025);
        expect(t.stack).toBe(4);
        // UNITS FEET: 0.3048 m per foot (international foot, exact by definition).
        expect(t.receiver).toEqual({ x: 20 * 0.3048, y: null, z: null });
        expect(t.source).toEqual({ x: -5 * 0.3048, y: 0, z: 100 * 0.3048 });
        expect(t.keywords.CUSTOM_WORD).toBe('some value'); // unknown keywords kept
        expect(rec.keywords.CLIENT_REF).toBe('Q-17');
        expect(rec.notes).toEqual(['first line', 'second line']);
        expect(rec.acquired).toBe('2013-01-07T10:30:41');
      });
    }
    it(`format 3 (20-bit), ${le ? 'little' : 'big'}-endian: exponent nibbles and one's-complement mantissas`, () => {
      // One group: exponents word 0x3210 → samples 0..3 have exponents 0, 1, 2, 3 (low nibble first);
      // mantissas 100, −5 (one's complement 0xFFFA = −6 as two's), 32767, −1 (0xFFFE).
      const words = [0x3210, 100, -6 & 0xffff, 32767, -2 & 0xffff];
      const data = words.flatMap((w) => (le ? [w & 0xff, w >> 8] : [w >> 8, w & 0xff]));
      const bytes = build({ le, term: [0], line: [], fileStrings: [], traces: [{ strings: ['SAMPLE_INTERVAL 0.001'], code: 3, n: 4, data }] });
      expect(Array.from(readSeg2(bytes).traces[0].samples)).toEqual([100, -5 * 2, 32767 * 4, -1 * 8]);
    });
  }
});

describe('our SEG-2 writer', () => {
  for (const format of [1, 2, 3, 4, 5] as const) {
    it(`format ${format}: read back exactly, and laid out as the standard says`, () => {
      const samples = [0, 5, -7, 1000, -32000, 12, 3, -1];
      const bytes = writeSeg2(
        [{ samples, channel: 3, sampleInterval: 0.0005, delay: -0.01, receiver: { x: 12.5, y: null, z: null }, source: { x: 0, y: null, z: null }, keywords: [['GEOPHONE_TYPE', '14 Hz']] }],
        { format, littleEndian: false, keywords: [['NOTE', 'invented test record']] },
      );
      const v = new DataView(bytes.buffer);
      expect(v.getUint16(0, false)).toBe(0x3a55); // file descriptor block id
      expect(v.getUint16(6, false)).toBe(1); // N
      const p = v.getUint32(32, false); // first trace pointer
      expect(v.getUint16(p, false)).toBe(0x4422);
      expect(v.getUint16(p + 2, false) % 4).toBe(0);
      expect(v.getUint32(p + 8, false)).toBe(8);
      expect(bytes[p + 12]).toBe(format);
      const rec = readSeg2(bytes);
      expect(Array.from(rec.traces[0].samples)).toEqual(samples);
      expect(rec.traces[0]).toMatchObject({ channel: 3, sampleInterval: 0.0005, delay: -0.01, receiver: { x: 12.5 }, source: { x: 0 } });
      expect(rec.traces[0].keywords.GEOPHONE_TYPE).toBe('14 Hz');
    });
  }
});

describe('malformed and hostile SEG-2 files', () => {
  const good = () => writeSeg2([{ samples: [1, 2, 3, 4], channel: 1, sampleInterval: 0.001 }], { format: 2 });
  const error = (bytes: Uint8Array): RecordFormatError => {
    try {
      readSeg2(bytes);
    } catch (err) {
      if (err instanceof RecordFormatError) return err;
      throw err;
    }
    throw new Error('read without an error');
  };
  it('names the offset for a wrong block id', () => {
    const b = good();
    b[0] = 0x12;
    expect(error(b).message).toMatch(/^byte 0: expected the SEG-2 file descriptor block id 0x3A55/);
  });
  it('refuses a trace pointer past the end', () => {
    const b = good();
    new DataView(b.buffer).setUint32(32, 0x7fffffff, true);
    expect(error(b).message).toMatch(/^byte 32: trace pointer 1 is 2147483647/);
  });
  it('refuses a truncated data block with the offset', () => {
    const b = good();
    const e = error(b.subarray(0, b.length - 3));
    expect(e.message).toMatch(/the data block of trace 1 .* but the file ends/);
  });
  it('refuses a huge sample count before allocating', () => {
    const b = good();
    const p = new DataView(b.buffer).getUint32(32, true);
    new DataView(b.buffer).setUint32(p + 8, 0xffffffff, true);
    expect(error(b).message).toMatch(/claims 4294967295 samples/);
  });
  it('refuses a trace count the pointer block cannot hold', () => {
    const b = good();
    new DataView(b.buffer).setUint16(6, 65535, true);
    expect(error(b).message).toMatch(/^byte 6: /);
  });
  it('refuses a string that runs past its block, and a non-number SAMPLE_INTERVAL', () => {
    const b = good();
    const p = new DataView(b.buffer).getUint32(32, true);
    const v = new DataView(b.buffer);
    v.setUint16(p + 32, 60000, true);
    expect(error(b).message).toMatch(/says it is 60000 bytes long/);
    const c = writeSeg2([{ samples: [1, 2, 3, 4], channel: 1, sampleInterval: 0.001, keywords: [['X', '1']] }]);
    const text = new TextDecoder('latin1').decode(c);
    const at = text.indexOf('SAMPLE_INTERVAL 0.001');
    c.set(new TextEncoder().encode('SAMPLE_INTERVAL abcde'), at);
    expect(error(c).message).toMatch(/trace 1: SAMPLE_INTERVAL must be a number \(got "abcde"\)/);
  });
  it('reads every cut of a file without hanging: an error or a record, never anything else', () => {
    const b = writeSeg2([1, 2, 3].map((ch) => ({ samples: [1, 2, 3, 4, 5, 6, 7, 8], channel: ch, sampleInterval: 0.001 })), { format: 3 });
    for (let cut = 0; cut < b.length; cut++) {
      expect(() => readSeg2(b.subarray(0, cut))).toThrow(RecordFormatError);
    }
    // Random bytes after a valid id: never an exception other than RecordFormatError.
    let seed = 7;
    for (let k = 0; k < 300; k++) {
      const junk = new Uint8Array(256).map(() => ((seed = (seed * 1103515245 + 12345) >>> 0) >>> 24));
      junk[0] = 0x55;
      junk[1] = 0x3a;
      try {
        readSeg2(junk);
      } catch (err) {
        expect(err).toBeInstanceOf(RecordFormatError);
      }
    }
  });
});
