/**
 * A real SEG-2 file from a recording instrument (fixtures/records/seg2-real/, a copy of ../shared/data/seg2-real/, from the test data of a
 * general-purpose open-source seismology library, LGPL-3.0, its io/seg2/tests/data/
 * 20130107_103041000.CET.3c.cont.0.*): the published reference values equal stored sample ×
 * DESCALING_FACTOR × 1000 (that library's test compares with relative and absolute tolerance 1e-7).
 */
import { readFileSync } from 'node:fs';
import { gunzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { readRecord, scaledSamples } from '../../../shared/records';

const dir = new URL('../../../fixtures/records/seg2-real/', import.meta.url);

describe('a real instrument SEG-2 file', () => {
  const rec = readRecord(new Uint8Array(readFileSync(new URL('three-component-int32.sg2', dir))), 'x.sg2');
  const reference = gunzipSync(readFileSync(new URL('three-component-int32.reference.txt.gz', dir)))
    .toString('utf8')
    .trim()
    .split('\n')
    .map((l) => l.trim().split(/\s+/).map(Number));

  it('has three traces of 2000 samples at 1 ms, format 2, no positions', () => {
    expect(rec.traces).toHaveLength(3);
    for (const t of rec.traces) {
      expect(t.samples).toHaveLength(2000);
      expect(t.sampleInterval).toBe(0.001);
      expect(t.receiver).toBeNull();
      expect(t.source).toBeNull();
    }
    expect(rec.traces[0].descale).toBeCloseTo(2.17378e-5, 12);
  });

  it('matches the published reference sample for sample (relative 1e-7)', () => {
    expect(reference).toHaveLength(2000);
    rec.traces.forEach((t, c) => {
      const scaled = scaledSamples(t);
      for (let i = 0; i < 2000; i++) {
        const want = reference[i][c];
        expect(Math.abs(scaled[i] * 1000 - want)).toBeLessThanOrEqual(1e-7 + 1e-7 * Math.abs(want));
      }
    });
  });

  it('keeps every keyword, the note and the acquisition time', () => {
    for (const k of ['ACQUISITION_DATE', 'ACQUISITION_TIME', 'UNITS', 'INSTRUMENT', 'TRIGGER_SOURCE', 'NOTE']) expect(rec.keywords).toHaveProperty(k);
    expect(rec.traces[0].keywords).toHaveProperty('DESCALING_FACTOR', '2.17378e-05');
    expect(rec.acquired).toBe('2013-01-07T10:30:41');
    expect(rec.notes.length).toBeGreaterThan(0);
  });
});
