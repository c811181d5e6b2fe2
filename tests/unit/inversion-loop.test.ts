/**
 * The inversion loop's contract (issue 11): stop rules, cancellation, resuming from a stored
 * iteration with the same outcome, velocity bounds, and the checkerboard test. The data are
 * exact constant-gradient times (t = (2/k)·asinh(kx/2v0); Slotnick 1959, from memory).
 */
import { describe, expect, it } from 'vitest';
import { inProcessModeller, invert, type InversionCheckpoint, type InversionProblem } from '../../shared/inversion';
import { DEFAULT_INVERSION_SETTINGS } from '../../shared/schemas/inversions';
import { gradientSurvey, inversionGrid } from '../references/inversion/surveys';

function problem(overrides: Partial<InversionProblem['settings']> = {}, startV = 1000): InversionProblem {
  const grid = inversionGrid(40);
  const n = grid.nx * grid.nz;
  return {
    grid,
    active: new Uint8Array(n).fill(1),
    start: new Float32Array(n).fill(startV),
    shots: gradientSurvey(500, 40, 0.0005, 3),
    settings: { ...DEFAULT_INVERSION_SETTINGS, ...overrides },
  };
}

describe('inversion loop', () => {
  it('stops at the iteration cap and reports every iteration once, in order', async () => {
    const p = problem({ maxIterations: 2 });
    const seen: number[] = [];
    const result = await invert(p, inProcessModeller(p), { onIteration: (r) => void seen.push(r.iteration) });
    expect(result.stopReason).toBe('iteration-cap');
    expect(seen).toEqual([0, 1, 2]);
    expect(result.history.map((h) => h.iteration)).toEqual([0, 1, 2]);
    expect(result.history[2].chi2).toBeLessThan(result.history[0].chi2);
  });

  it('stops when χ² reaches [0.9, 1.1]', async () => {
    const p = problem({ maxIterations: 30 });
    const result = await invert(p, inProcessModeller(p));
    expect(result.stopReason).toBe('target-misfit');
    const last = result.history[result.history.length - 1].chi2;
    expect(last).toBeGreaterThanOrEqual(0.9);
    expect(last).toBeLessThanOrEqual(1.1);
  }, 60_000);

  it('resumed from a stored iteration, ends exactly where an uninterrupted run ends', async () => {
    const p = problem({ maxIterations: 4 });
    const full = await invert(p, inProcessModeller(p));
    let stored: InversionCheckpoint | null = null;
    const controller = new AbortController();
    const first = await invert(p, inProcessModeller(p), {
      signal: controller.signal,
      onIteration: (r, checkpoint) => {
        stored = checkpoint;
        if (r.iteration === 2) controller.abort(); // the worker dies after storing iteration 2
      },
    });
    expect(first.stopReason).toBe('cancelled');
    expect(stored!.history).toHaveLength(3);
    const resumed = await invert(p, inProcessModeller(p), { resumeFrom: stored! });
    expect(resumed.history.map((h) => h.chi2)).toEqual(full.history.map((h) => h.chi2));
    expect(Array.from(resumed.velocity)).toEqual(Array.from(full.velocity));
  }, 60_000);

  it('keeps every velocity within the bounds', async () => {
    const p = problem({ maxIterations: 3, vMin: 700, vMax: 1500 });
    const result = await invert(p, inProcessModeller(p));
    for (const v of result.velocity) {
      expect(v).toBeGreaterThanOrEqual(700 * (1 - 1e-6));
      expect(v).toBeLessThanOrEqual(1500 * (1 + 1e-6));
    }
  });

  it('leaves air as air (no velocity) and gives it no coverage', async () => {
    const p = problem({ maxIterations: 1 });
    const { nx } = p.grid;
    // Air above z = −1 m from x = 50 m onwards: geophones there are moved to the ground at z = −1.
    for (let ix = 58; ix < nx; ix++) p.active[ix] = 0;
    p.shots = p.shots.filter((s) => s.source.x < 50).map((s) => ({ ...s, receivers: s.receivers.map((v, i) => (i % 2 === 1 && s.receivers[i - 1] >= 50 ? -1 : v)) }));
    const result = await invert(p, inProcessModeller(p));
    for (let ix = 58; ix < nx; ix++) {
      expect(result.velocity[ix]).toBeNaN();
      expect(result.coverage[ix]).toBe(0);
    }
  });

  it('runs the checkerboard test when asked: the pattern is ±7 % and is recovered in covered nodes', async () => {
    const p = problem({ maxIterations: 6, checkerboard: true, checkerSize: 16 }, 1000);
    const result = await invert(p, inProcessModeller(p));
    const cb = result.checkerboard!;
    expect(cb.amplitude).toBe(0.07);
    expect(cb.size).toBe(16);
    const values = new Set(Array.from(cb.truePattern).map((v) => +v.toFixed(4)));
    expect(values).toEqual(new Set([0.07, -0.07]));
    // Recovered, not just reproduced: a clearly positive correlation, below a perfect one.
    expect(cb.correlation).toBeGreaterThan(0.3);
    expect(cb.correlation).toBeLessThan(1);
  }, 120_000);
});
