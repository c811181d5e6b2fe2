import { describe, expect, it } from 'vitest';
import { contourLevels, defaultContourInterval, finiteMax, MAX_CONTOURS, niceStep, usableIntervals } from '../../../src/components/run/section/contourLevels';

// Contour intervals from the 1–2–5 series, the usual choice for round chart and map labels
// (common practice, no source).

describe('niceStep', () => {
  it.each([
    [3.2, 5],
    [0.07, 0.1],
    [1, 1],
    [1.01, 2],
    [11, 20],
    [0.26, 0.5],
    [47, 50],
    [51, 100],
  ])('rounds %s up to %s', (rough, nice) => {
    expect(niceStep(rough)).toBe(nice);
  });

  it('falls back to 1 for nonsense instead of returning NaN', () => {
    expect(niceStep(0)).toBe(1);
    expect(niceStep(-3)).toBe(1);
    expect(niceStep(Number.NaN)).toBe(1);
  });
});

describe('contourLevels', () => {
  it('draws k·interval from the first interval up to the latest time, never the shot instant itself', () => {
    expect(contourLevels(58.2, 5)).toEqual({ start: 5, end: 55, size: 5, count: 11 });
    expect(contourLevels(55, 5)).toEqual({ start: 5, end: 55, size: 5, count: 11 });
  });

  it('keeps decimal intervals exact (no 0.30000000000000004 labels)', () => {
    const levels = contourLevels(1.05, 0.1)!;
    expect(levels.count).toBe(10);
    expect(levels.end).toBe(1);
  });

  it('refuses intervals that would draw nothing or a smear of lines', () => {
    expect(contourLevels(4, 5)).toBeNull();
    expect(contourLevels(100, 100 / (MAX_CONTOURS + 5))).toBeNull();
    expect(contourLevels(Number.NaN, 5)).toBeNull();
    expect(contourLevels(50, 0)).toBeNull();
  });

  it('offers only intervals that give at least three and at most MAX_CONTOURS wavefronts', () => {
    const offered = usableIntervals(54.8);
    expect(offered).toEqual([1, 2, 5, 10]);
    for (const s of offered) {
      const n = contourLevels(54.8, s)!.count;
      expect(n).toBeGreaterThanOrEqual(3);
      expect(n).toBeLessThanOrEqual(MAX_CONTOURS);
    }
  });

  it('chooses a default of about a dozen wavefronts', () => {
    expect(defaultContourInterval(54.8)).toBe(5);
    expect(defaultContourInterval(9)).toBe(1);
  });
});

describe('finiteMax', () => {
  it('skips air (NaN) nodes', () => {
    expect(finiteMax(new Float32Array([Number.NaN, 0.01, 0.054, Number.NaN]))).toBeCloseTo(0.054, 6);
  });
});
