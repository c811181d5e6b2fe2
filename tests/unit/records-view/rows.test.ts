/**
 * Resampling a trace onto screen rows: extremes kept when many samples share a row (a one-sample
 * spike must not vanish when zoomed out), linear interpolation when zoomed in, time shifts for
 * reduced time applied exactly, rows outside the recording empty. Hand-computed values.
 */
import { describe, expect, it } from 'vitest';
import { traceRows } from '../../../src/lib/traces/rows';

describe('traceRows', () => {
  it('keeps a one-sample spike visible at 10 samples per row', () => {
    const x = new Float32Array(1000);
    x[537] = 1;
    const r = traceRows(x, 0.25, 0, 0, { t0: 0, t1: 250, rows: 100 });
    const row = r.max.findIndex((v) => v === 1);
    // Sample 537 at 134.25 ms; rows are 2.5 ms tall, so row 53.
    expect(row).toBe(53);
    expect([...r.max].filter((v) => v > 0)).toHaveLength(1);
  });

  it('interpolates linearly between samples when zoomed in', () => {
    const x = Float32Array.from([0, 1, 2, 3, 4]);
    // Samples every 1 ms; rows of 0.5 ms from 0 to 4 ms: centres at 0.25, 0.75, … ms.
    const r = traceRows(x, 1, 0, 0, { t0: 0, t1: 4, rows: 8 });
    expect([...r.mid]).toEqual([0.25, 0.75, 1.25, 1.75, 2.25, 2.75, 3.25, 3.75]);
  });

  it('applies the delay and the reduced-time shift, and leaves rows outside the recording empty', () => {
    const x = Float32Array.from([0, 10, 20, 30]);
    // First sample at −1 ms; display time = time − 2 ms, so display 0 ms reads record 2 ms = sample 3.
    const r = traceRows(x, 1, -1, 2, { t0: -0.5, t1: 0.5, rows: 1 });
    expect(r.mid[0]).toBe(30);
    const outside = traceRows(x, 1, -1, 0, { t0: 10, t1: 20, rows: 2 });
    expect(Number.isNaN(outside.mid[0])).toBe(true);
  });
});
