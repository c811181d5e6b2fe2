import { describe, expect, it } from 'vitest';
import { convergenceSeries, convergenceWords } from '../../../src/components/inversion/convergenceTraces';

// The chart shows χ² and RMS per iteration, iteration 0 (the starting model) first, with χ² = 1 as
// the target (issue 11); the engine stops with χ² within [0.9, 1.1] (issue 11's stop rule).

const it0 = (iteration: number, chi2: number, rmsMs: number) => ({ iteration, chi2, rmsMs, smoothing: null });

describe('convergenceSeries', () => {
  it('orders iterations and drops rows without numbers', () => {
    const s = convergenceSeries([it0(2, 1.3, 0.6), it0(0, 41, 3.2), it0(1, 6.3, 1.3), it0(3, Number.NaN, 0.5)]);
    expect(s.iterations).toEqual([0, 1, 2]);
    expect(s.chi2).toEqual([41, 6.3, 1.3]);
    expect(s.rmsMs).toEqual([3.2, 1.3, 0.6]);
  });

  it('uses a log χ² axis when the values span more than a decade (the target 1 included)', () => {
    expect(convergenceSeries([it0(0, 41, 3), it0(1, 1.1, 0.5)]).chi2Log).toBe(true);
    expect(convergenceSeries([it0(0, 4, 1), it0(1, 1.1, 0.5)]).chi2Log).toBe(false);
    expect(convergenceSeries([it0(0, 0.05, 0.1)]).chi2Log).toBe(true); // 0.05 … 1
  });
});

describe('convergenceWords', () => {
  it('says whether the fit is in the target band, above it, or below it', () => {
    expect(convergenceWords(convergenceSeries([it0(0, 41, 3.2), it0(1, 1.05, 0.51)]))).toMatch(/41\.00 to 1\.05.*within the target band/);
    expect(convergenceWords(convergenceSeries([it0(0, 41, 3.2)]))).toMatch(/starting model has χ² 41\.00.*above 1/);
    expect(convergenceWords(convergenceSeries([it0(0, 41, 3.2), it0(4, 0.6, 0.4)]))).toMatch(/below 1/);
    expect(convergenceWords(convergenceSeries([]))).toMatch(/No iteration/);
  });
});
