import { describe, expect, it } from 'vitest';
import { chiSquareBand, misfitVerdict } from '../../../src/components/run/summary/verdict';
import { worstByRms } from '../../../src/components/run/summary/worst';

/**
 * Reference: for N residuals drawn from N(0, σ²), χ²/N has mean 1 and standard deviation √(2/N)
 * (a χ² variable with N degrees of freedom has mean N and variance 2N; Bevington & Robinson,
 * "Data Reduction and Error Analysis for the Physical Sciences", 3rd ed., 2003 — from memory).
 * The simulation below checks that the "fits within uncertainty" band holds almost every honest
 * case, so the verdict does not cry wolf over noise alone.
 */

/** Small deterministic generator (mulberry32) and Box–Muller normals, so the check is repeatable. */
function normals(seed: number) {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

describe('chiSquareBand', () => {
  it('is 1 ± 3·√(2/N) for small pick counts and never tighter than ± 0.25', () => {
    expect(chiSquareBand(18).upper).toBeCloseTo(1 + 3 * Math.sqrt(2 / 18), 12); // = 2
    expect(chiSquareBand(18).lower).toBe(0);
    expect(chiSquareBand(336).upper).toBe(1.25); // 3·√(2/336) = 0.23 < 0.25
    expect(chiSquareBand(336).lower).toBe(0.75);
  });

  it('holds at least 99 % of honest fits (residuals drawn with the stated σ)', () => {
    const gauss = normals(20261201);
    for (const n of [20, 336, 4608]) {
      const band = chiSquareBand(n);
      let inside = 0;
      const trials = 400;
      for (let t = 0; t < trials; t++) {
        let s = 0;
        for (let i = 0; i < n; i++) s += gauss() ** 2;
        const chi2 = s / n;
        if (chi2 >= band.lower && chi2 <= band.upper) inside++;
      }
      expect(inside / trials).toBeGreaterThanOrEqual(0.99);
    }
  });

  it('flags residuals twice as large as σ claims (χ² ≈ 4) as beyond the uncertainty', () => {
    const gauss = normals(7);
    const n = 336;
    let s = 0;
    for (let i = 0; i < n; i++) s += (2 * gauss()) ** 2;
    const v = misfitVerdict({ chi2: s / n, picks: n, rmsMs: 1, worstShots: ['S3'] });
    expect(v.tone === 'caution' || v.tone === 'poor').toBe(true);
  });
});

describe('misfitVerdict', () => {
  it('says the model explains the picks when χ² per datum is about 1', () => {
    const v = misfitVerdict({ chi2: 1.03, picks: 336, rmsMs: 0.51, worstShots: ['S7'] });
    expect(v.tone).toBe('good');
    expect(v.headline).toMatch(/within their stated uncertainty/);
    expect(v.detail).toMatch(/does not make this one unique/);
  });

  it('points at the worst shots when the misfit is beyond the uncertainty', () => {
    const v = misfitVerdict({ chi2: 1.6, picks: 336, rmsMs: 0.61, worstShots: ['S7', 'S5', 'S6', 'S1'] });
    expect(v.tone).toBe('caution');
    expect(v.detail).toContain('shots S7, S5 and S6');
    expect(v.detail).not.toContain('S1');
  });

  it('says plainly when the model does not explain the picks', () => {
    const v = misfitVerdict({ chi2: 33.8, picks: 74, rmsMs: 4.8, worstShots: ['A01'] });
    expect(v.tone).toBe('poor');
    expect(v.detail).toContain('shot A01');
  });

  it('suspects overstated uncertainties when χ² is far below 1', () => {
    const v = misfitVerdict({ chi2: 0.2, picks: 336, rmsMs: 0.2, worstShots: [] });
    expect(v.tone).toBe('note');
    expect(v.detail).toMatch(/overstated/);
  });

  it('never prints NaN: a run with every pick excluded says so', () => {
    const v = misfitVerdict({ chi2: Number.NaN, picks: 0, rmsMs: Number.NaN, worstShots: [] });
    expect(`${v.headline} ${v.detail}`).not.toMatch(/NaN/);
    expect(v.headline).toMatch(/No picks/);
  });
});

describe('worstByRms', () => {
  it('orders by RMS, worst first, and skips empty entries', () => {
    const s = (shotId: string, rms_ms: number, count = 10) => ({ shotId, rms_ms, count, chi2: 1, max_abs_residual_ms: 1, mean_residual_ms: 0 });
    expect(worstByRms([s('S1', 0.4), s('S2', 0.9), s('S3', 2, 0), s('S4', 0.6)], 2).map((x) => x.shotId)).toEqual(['S2', 'S4']);
  });
});
