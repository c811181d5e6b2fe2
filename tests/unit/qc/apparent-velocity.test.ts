/**
 * Least-squares line on hand-worked points. Ordinary least squares: slope = Σ(x−x̄)(t−t̄)/Σ(x−x̄)²,
 * intercept = t̄ − slope·x̄, r² = 1 − SSres/SStot (Bevington & Robinson 2003, "Data Reduction and
 * Error Analysis for the Physical Sciences", 3rd ed., chapter on least-squares fit to a straight line — from memory).
 */
import { describe, expect, it } from 'vitest';
import { fitApparentVelocity } from '../../../shared/qc';
import { pick } from './make-pick';

describe('fitApparentVelocity', () => {
  it('two picks: (10 m, 20 ms), (20 m, 30 ms) → 1 ms/m = 1000 m/s, intercept 10 ms, r² = 1', () => {
    const fit = fitApparentVelocity([pick(0, 'S', 0, 10, 20), pick(1, 'S', 0, 20, 30)], 0, 100)!;
    expect(fit.slope).toBeCloseTo(0.001, 12);
    expect(fit.velocity).toBeCloseTo(1000, 6);
    expect(fit.intercept).toBeCloseTo(0.01, 12);
    expect(fit).toMatchObject({ n: 2, r2: 1, xMin: 10, xMax: 20 });
  });

  it('three scattered picks (0, 0), (10, 10), (20, 30) ms: slope 1.5 ms/m, intercept −1/600 s, r² = 27/28, RMS √(1/180000) s', () => {
    // Hand-worked: x̄ = 10, t̄ = 1/75 s; Sxx = 200, Sxt = 0.3 → slope 0.0015 s/m (666.67 m/s);
    // residuals (1/600, −1/300, 1/600) s → SSres = 1/60000, SStot = 42/90000.
    const fit = fitApparentVelocity([pick(0, 'S', 0, 0, 0), pick(1, 'S', 0, 10, 10), pick(2, 'S', 0, 20, 30)], 0, 20)!;
    expect(fit.slope).toBeCloseTo(0.0015, 12);
    expect(fit.velocity).toBeCloseTo(2000 / 3, 6);
    expect(fit.intercept).toBeCloseTo(-1 / 600, 12);
    expect(fit.r2).toBeCloseTo(27 / 28, 12);
    expect(fit.rmsMs).toBeCloseTo(1000 * Math.sqrt(1 / 180000), 9);
  });

  it('a reverse branch has a negative slope and a positive velocity', () => {
    const fit = fitApparentVelocity([pick(0, 'S', 60, 40, 20), pick(1, 'S', 60, 50, 10)], 30, 60)!;
    expect(fit.slope).toBeCloseTo(-0.001, 12);
    expect(fit.velocity).toBeCloseTo(1000, 6);
  });

  it('uses only picks inside the window, not excluded ones, and accepts the bounds either way round', () => {
    const picks = [
      pick(0, 'S', 0, 5, 99), pick(1, 'S', 0, 10, 20), pick(2, 'S', 0, 15, 999, { excluded: true }),
      pick(3, 'S', 0, 20, 30), pick(4, 'S', 0, 25, 1),
    ];
    const fit = fitApparentVelocity(picks, 10, 20)!;
    expect(fit.n).toBe(2);
    expect(fit.velocity).toBeCloseTo(1000, 6);
    expect(fitApparentVelocity(picks, 20, 10)).toEqual(fit);
  });

  it('null for fewer than two picks, picks all at one x, a flat line and an empty or NaN window', () => {
    expect(fitApparentVelocity([], 0, 10)).toBeNull();
    expect(fitApparentVelocity([pick(0, 'S', 0, 5, 10)], 0, 10)).toBeNull();
    expect(fitApparentVelocity([pick(0, 'S', 0, 5, 10), pick(1, 'S', 0, 5, 12)], 0, 10)).toBeNull();
    expect(fitApparentVelocity([pick(0, 'S', 0, 5, 10), pick(1, 'S', 0, 8, 10)], 0, 10)).toBeNull();
    expect(fitApparentVelocity([pick(0, 'S', 0, 5, 10), pick(1, 'S', 0, 8, 12)], 50, 60)).toBeNull();
    expect(fitApparentVelocity([pick(0, 'S', 0, 5, 10), pick(1, 'S', 0, 8, 12)], NaN, 60)).toBeNull();
  });

  it('skips non-finite picks and never returns NaN, even when huge numbers overflow the sums', () => {
    const fit = fitApparentVelocity([pick(0, 'S', 0, 10, 20), pick(1, 'S', 0, 15, NaN), pick(2, 'S', 0, 20, 30)], -Infinity, Infinity)!;
    expect(fit.n).toBe(2);
    const huge = fitApparentVelocity([pick(0, 'S', 0, -1e200, 1), pick(1, 'S', 0, 1e200, 2)], -Infinity, Infinity);
    expect(huge).toBeNull(); // Σ(x−x̄)² overflows to Infinity: no fit rather than NaN
  });

  it('refuses picks of two shots with a clear message', () => {
    expect(() => fitApparentVelocity([pick(0, 'A', 0, 10, 20), pick(1, 'B', 0, 20, 30)], 0, 100)).toThrow(/one shot; got A and B/);
  });
});
