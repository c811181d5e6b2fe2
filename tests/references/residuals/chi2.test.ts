/**
 * χ² per datum of picks scattered by exactly their stated uncertainty has expectation 1 and
 * standard deviation sqrt(2/N) (χ² with N degrees of freedom has mean N, variance 2N:
 * Bevington & Robinson 2003, "Data Reduction and Error Analysis for the Physical Sciences",
 * 3rd ed., chapter on the χ² distribution — from memory). RMS of N(0, σ²) residuals → σ.
 * Deterministic: seeded generator, Box–Muller transform (Box & Muller 1958, Ann. Math. Statist. 29, 610–611).
 */
import { describe, expect, it } from 'vitest';
import { computeResiduals, residualStats } from '../../../shared/residuals';

function gaussian(seed: number): () => number {
  let s = seed >>> 0;
  const uniform = () => {
    // mulberry32 (common practice, no source)
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

describe('χ² per datum of correctly weighted noise', () => {
  const N = 20000;
  const noise = gaussian(20310402);
  const inputs = Array.from({ length: N }, (_, i) => {
    const sigma = (i % 2 ? 0.5 : 2) / 1000; // mixed pick qualities, s
    const computed = 0.01 + i * 1e-6;
    return { shotId: 'S', receiverX: i, receiverZ: 0, computed, observed: computed + sigma * noise(), sigma };
  });
  const s = residualStats(computeResiduals(inputs));

  it('is 1 within 5 standard deviations (sqrt(2/N) = 0.01)', () => {
    expect(Math.abs(s.chi2! - 1)).toBeLessThan(5 * Math.sqrt(2 / N));
  });

  it('RMS equals the root-mean-square sigma, sqrt((2² + 0.5²)/2) = 1.4577 ms, within 2 %', () => {
    expect(s.rms! * 1000).toBeGreaterThan(1.4577 * 0.98);
    expect(s.rms! * 1000).toBeLessThan(1.4577 * 1.02);
  });

  it('doubling every sigma divides χ² by four', () => {
    const wide = residualStats(computeResiduals(inputs.map((p) => ({ ...p, sigma: 2 * p.sigma }))));
    expect(wide.chi2! * 4).toBeCloseTo(s.chi2!, 10);
  });
});
