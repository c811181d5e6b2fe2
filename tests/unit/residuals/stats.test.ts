/**
 * Residual statistics against a hand-worked example. Definitions (shared/residuals/stats.ts):
 * RMS = sqrt(Σr²/N) (common practice, no source); χ² per datum = Σ(r/σ)²/N
 * (χ² of Bevington & Robinson 2003, "Data Reduction and Error Analysis for the Physical Sciences", 3rd ed., over N).
 */
import { describe, expect, it } from 'vitest';
import { computeResiduals, formatResidualCsv, residualStats, runStats, type ResidualInput } from '../../../shared/residuals';

const ms = (v: number) => v / 1000;
// Four picks, two shots, three receiver positions. Residuals (ms): +1, −2, +0.5, 0; sigmas (ms): 1, 2, 0.5, 1.
const inputs: ResidualInput[] = [
  { shotId: 'S1', receiverX: 10, receiverZ: 100, observed: ms(11), computed: ms(10), sigma: ms(1) },
  { shotId: 'S1', receiverX: 20, receiverZ: 100, observed: ms(18), computed: ms(20), sigma: ms(2) },
  { shotId: 'S2', receiverX: 10, receiverZ: 100, observed: ms(5.5), computed: ms(5), sigma: ms(0.5) },
  { shotId: 'S2', receiverX: 30, receiverZ: 99.5, observed: ms(7), computed: ms(7), sigma: ms(1) },
];

describe('residuals: hand-worked example', () => {
  const residuals = computeResiduals(inputs);

  it('residual = observed − computed, normalised by sigma', () => {
    expect(residuals.map((r) => +(r.residual * 1000).toFixed(9))).toEqual([1, -2, 0.5, 0]);
    expect(residuals.map((r) => +r.normalised.toFixed(9))).toEqual([1, -1, 1, 0]);
  });

  it('run statistics', () => {
    const s = residualStats(residuals);
    expect(s.count).toBe(4);
    // RMS = sqrt((1 + 4 + 0.25 + 0)/4) = sqrt(1.3125) = 1.1456439237 ms
    expect(s.rms! * 1000).toBeCloseTo(1.1456439237, 9);
    // χ²/N = (1 + 1 + 1 + 0)/4 = 0.75
    expect(s.chi2!).toBeCloseTo(0.75, 12);
    expect(s.maxAbs! * 1000).toBeCloseTo(2, 12);
    // mean = (1 − 2 + 0.5 + 0)/4 = −0.125 ms
    expect(s.mean! * 1000).toBeCloseTo(-0.125, 12);
  });

  it('per shot and per receiver x', () => {
    const { shots, receivers } = runStats(residuals);
    // S1: rms = sqrt((1+4)/2) = 1.5811388301 ms; χ² = (1+1)/2 = 1. S2: rms = sqrt(0.25/2) = 0.3535533906 ms; χ² = 0.5
    expect(shots.map((s) => [s.shotId, s.count, +(s.rms! * 1000).toFixed(10), +s.chi2!.toFixed(12)])).toEqual([
      ['S1', 2, 1.5811388301, 1],
      ['S2', 2, 0.3535533906, 0.5],
    ]);
    // x=10: residuals +1, +0.5 → rms sqrt(1.25/2) = 0.7905694150 ms, max 1; x=20: 2; x=30: 0
    expect(receivers.map((r) => [r.receiverX, r.count, +(r.rms! * 1000).toFixed(10), +(r.maxAbs! * 1000).toFixed(9)])).toEqual([
      [10, 2, 0.790569415, 1],
      [20, 1, 2, 2],
      [30, 1, 0, 0],
    ]);
  });

  it('empty set gives nulls, not NaN', () => {
    expect(residualStats([])).toEqual({ count: 0, rms: null, chi2: null, maxAbs: null, mean: null });
  });

  it('refuses non-finite times and non-positive sigma', () => {
    expect(() => computeResiduals([{ ...inputs[0], computed: Infinity }])).toThrow(/times must be finite/);
    expect(() => computeResiduals([{ ...inputs[0], sigma: 0 }])).toThrow(/sigma must be > 0/);
  });

  it('writes the residual CSV with the exact columns, ms at the edge', () => {
    expect(formatResidualCsv(residuals)).toBe(
      'shot_id,receiver_x,receiver_z,observed_ms,computed_ms,residual_ms\n' +
        'S1,10,100,11,10,1\nS1,20,100,18,20,-2\nS2,10,100,5.5,5,0.5\nS2,30,99.5,7,7,0\n',
    );
  });
});
