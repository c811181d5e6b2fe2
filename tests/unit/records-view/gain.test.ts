/**
 * Display gains: AGC divides each sample by the RMS in a window around it (common practice, no
 * source), so a sinusoid of any amplitude comes out with RMS 1 (amplitude √2) and a trace whose
 * amplitude steps by 100× is evened out; normalisation scales peaks to 1.
 */
import { describe, expect, it } from 'vitest';
import { agcInPlace, maxAbs, normalise } from '../../../src/lib/traces/gain';

const sine = (n: number, amp: (i: number) => number) => Float32Array.from({ length: n }, (_, i) => amp(i) * Math.sin((2 * Math.PI * i) / 40));

describe('AGC', () => {
  it('brings a sinusoid to unit RMS whatever its amplitude (window of whole periods)', () => {
    for (const a of [1e-3, 1, 5e4]) {
      const x = sine(2000, () => a);
      agcInPlace(x, 200);
      expect(maxAbs(x.subarray(400, 1600))).toBeCloseTo(Math.SQRT2, 2);
    }
  });

  it('evens out an amplitude step of 100× away from the step', () => {
    const x = sine(4000, (i) => (i < 2000 ? 0.01 : 1));
    agcInPlace(x, 200);
    expect(maxAbs(x.subarray(1000, 1800)) / maxAbs(x.subarray(2200, 3000))).toBeCloseTo(1, 2);
  });

  it('leaves a dead (all-zero) trace at zero, with no NaN', () => {
    const x = new Float32Array(500);
    agcInPlace(x, 50);
    expect([...x].every((v) => v === 0)).toBe(true);
  });
});

describe('normalise', () => {
  it('each trace to peak 1, or every trace by the record peak', () => {
    const a = Float32Array.from([0, 2, -4]), b = Float32Array.from([1, -1, 0.5]);
    normalise([a, b], 'trace');
    expect([...a]).toEqual([0, 0.5, -1]);
    expect([...b]).toEqual([1, -1, 0.5]);
    const c = Float32Array.from([0, 2, -4]), d = Float32Array.from([1, -1, 0.5]);
    normalise([c, d], 'record');
    expect([...d]).toEqual([0.25, -0.25, 0.125]);
  });
});
