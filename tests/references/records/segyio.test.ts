/**
 * SEG-Y files written by Debian's python3-segyio (a general-purpose SEG-Y library; `npm test`
 * installs it) read back identically: samples (IBM, IEEE, int16, int32; both byte orders), the
 * trace headers' channel, coordinates and elevations with their scalars, delay, sample interval,
 * dead-trace code, feet, and the EBCDIC textual header. Our SEG-Y writer is checked the other way:
 * segyio reads what we write. Python is used by this test only; nothing in the product needs it.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { readSegy, writeSegy } from '../../../shared/records';

const script = fileURLToPath(new URL('segyio-fixtures.py', import.meta.url));
const PYTHON = '/usr/bin/python3'; // Debian's, where python3-segyio is installed
const dir = mkdtempSync(join(tmpdir(), 'timefield-segyio-'));

interface SegyioTrace { channel: number; sx: number; gx: number; scalco: number; gelev: number; selev: number; scalel: number; delrt: number; ns: number; dt: number; trid: number; samples: number[] }
interface SegyioView { units?: number; format: number; interval_us: number; text: string[]; traces: SegyioTrace[] }

function python(...args: string[]): string {
  const r = spawnSync(PYTHON, [script, ...args], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`python3-segyio is needed for this test (apt-get install python3-segyio): ${r.stderr || r.error}`);
  return r.stdout;
}

let manifest: Record<string, SegyioView>;
beforeAll(() => {
  python(dir);
  manifest = JSON.parse(readFileSync(join(dir, 'manifest.json'), 'utf8'));
});

// SEG-Y scalar rule (rev 1, bytes 69–72): negative divides, positive multiplies.
const scaled = (v: number, s: number) => (s < 0 ? v / -s : s > 0 ? v * s : v);

describe('SEG-Y written by python3-segyio', () => {
  for (const name of ['ibm-big', 'ieee-big', 'ieee-little', 'int16-big', 'int32-big']) {
    it(`${name}: samples, headers and text as segyio reads them`, () => {
      const want = manifest[name];
      const rec = readSegy(new Uint8Array(readFileSync(join(dir, `${name}.sgy`))));
      expect(rec.byteOrder).toBe(name.endsWith('little') ? 'little' : 'big');
      expect(rec.keywords.SAMPLE_FORMAT).toBe(String(want.format));
      expect(rec.notes.slice(0, 2)).toEqual(want.text.slice(0, 2)); // EBCDIC decoded
      const k = want.units === 2 ? 0.3048 : 1; // measurement system 2: feet (0.3048 m, exact)
      expect(rec.traces).toHaveLength(want.traces.length);
      rec.traces.forEach((t, i) => {
        const w = want.traces[i];
        // segyio hands every format back as float32; ours keeps the exact value (IBM fits float32 here).
        expect(Array.from(t.samples, Math.fround)).toEqual(w.samples);
        expect(t.channel).toBe(w.channel);
        expect(t.sampleInterval).toBeCloseTo(w.dt * 1e-6, 12);
        expect(t.delay).toBeCloseTo(w.delrt / 1000, 12);
        expect(t.markedDead).toBe(w.trid === 2);
        expect(t.source!.x).toBeCloseTo(scaled(w.sx, w.scalco) * k, 9);
        expect(t.receiver!.x).toBeCloseTo(scaled(w.gx, w.scalco) * k, 9);
        expect(t.receiver!.z).toBeCloseTo(scaled(w.gelev, w.scalel) * k, 9);
        expect(t.source!.z).toBeCloseTo(scaled(w.selev, w.scalel) * k, 9);
      });
    });
  }

  it('a truncated segyio file is refused with the offset of the missing trace', () => {
    const bytes = new Uint8Array(readFileSync(join(dir, 'ibm-big.sgy')));
    expect(() => readSegy(bytes.subarray(0, bytes.length - 10))).toThrow(/^byte \d+: expected the 50 samples of trace 4/);
    expect(() => readSegy(bytes.subarray(0, 3000))).toThrow(/^byte 0: expected the 3200-byte textual header/);
  });
});

describe('our SEG-Y writer, read by python3-segyio', () => {
  for (const format of [1, 5] as const) {
    it(`format ${format}: segyio reads our samples, channels, positions and delay`, () => {
      const traces = [0, 1, 2].map((c) => ({
        samples: Array.from({ length: 20 }, (_, i) => Math.fround(Math.sin(i + c) * 10 ** (c - 1))),
        channel: c + 1,
        source: { x: -1.5, y: null, z: 101.25 },
        receiver: { x: 2 * c + 0.25, y: null, z: 100.5 + c },
        delay: 0.004,
      }));
      const path = join(dir, `ours-${format}.sgy`);
      writeFileSync(path, writeSegy(traces, { sampleInterval: 0.0005, format, text: ['C 1 INVENTED RECORD FOR A TEST'] }));
      const seen: SegyioView = JSON.parse(python('--read', path));
      expect(seen.format).toBe(format);
      expect(seen.interval_us).toBe(500);
      expect(seen.text[0]).toBe('C 1 INVENTED RECORD FOR A TEST');
      seen.traces.forEach((w, i) => {
        // IBM keeps 24 bits of fraction, normalised by hex digits: at least 21 significant bits.
        w.samples.forEach((v, j) => expect(Math.abs(v - traces[i].samples[j])).toBeLessThanOrEqual(Math.abs(traces[i].samples[j]) * 2 ** -20));
        expect(w.channel).toBe(i + 1);
        expect(scaled(w.gx, w.scalco)).toBeCloseTo(traces[i].receiver.x, 9);
        expect(scaled(w.sx, w.scalco)).toBeCloseTo(-1.5, 9);
        expect(scaled(w.gelev, w.scalel)).toBeCloseTo(traces[i].receiver.z, 9);
        expect(w.delrt).toBe(4);
        expect(w.ns).toBe(20);
      });
    });
  }
});
