import { describe, expect, it } from 'vitest';
import { coverageMask, greyMaskedPixels, MASK_RGB, maskedShare, thresholdCeiling } from '../../../src/components/inversion/coverageMask';
import { coveredRange } from '../../../src/components/inversion/sectionArrays';

// Issue 11 asks for "cells below a coverage threshold greyed, threshold adjustable": a node with
// less ray than the threshold is greyed, one with exactly the threshold or more is not, and air
// (null) is never counted as ground.

describe('coverageMask', () => {
  it('greys ground below the threshold, keeps ground at or above it, and leaves air alone', () => {
    const coverage = [null, 0, 0.5, 1, 3, Number.NaN];
    expect(Array.from(coverageMask(coverage, 1))).toEqual([0, 1, 1, 0, 0, 1]);
  });

  it('greys more ground as the threshold rises, and nothing at threshold 0', () => {
    const coverage = [0.2, 0.8, 1.5, 4, 12, null];
    const counts = [0, 1, 2, 5, 20].map((t) => Array.from(coverageMask(coverage, t)).reduce((a, b) => a + b, 0));
    expect(counts).toEqual([0, 2, 3, 4, 5]);
  });

  it('reports the greyed share of the ground only (air is not in the denominator)', () => {
    const coverage = [null, null, 0, 0.5, 2, 3, 0.1];
    expect(maskedShare(coverage, coverageMask(coverage, 1))).toBeCloseTo(3 / 5, 12);
    expect(maskedShare([null], new Uint8Array(1))).toBe(0);
  });
});

describe('greyMaskedPixels', () => {
  it('pulls masked pixels most of the way to the mask grey and leaves the others and air untouched', () => {
    // three pixels: masked dark blue, unmasked dark blue, masked air (alpha 0)
    const pixels = new Uint8ClampedArray([20, 40, 160, 255, 20, 40, 160, 255, 0, 0, 0, 0]);
    greyMaskedPixels(pixels, Uint8Array.from([1, 0, 1]));
    const masked = [pixels[0]!, pixels[1]!, pixels[2]!];
    const before = [20, 40, 160];
    for (let c = 0; c < 3; c++) {
      // at most a quarter of the original distance from the grey remains (plus rounding)
      expect(Math.abs(masked[c]! - MASK_RGB[c]!)).toBeLessThanOrEqual(0.25 * Math.abs(before[c]! - MASK_RGB[c]!) + 1);
    }
    expect(Array.from(pixels.slice(4, 8))).toEqual([20, 40, 160, 255]);
    expect(Array.from(pixels.slice(8, 12))).toEqual([0, 0, 0, 0]);
  });
});

describe('thresholdCeiling', () => {
  it('is a round number at or above the median ground coverage, never below 5 m', () => {
    expect(thresholdCeiling([0.2, 1, 3, 40, 80, null])).toBe(5); // median 3 → 5 (floor)
    expect(thresholdCeiling([10, 30, 70, null])).toBe(50); // median 30 → 1–2–5 step 50
    expect(thresholdCeiling([null, null])).toBe(5);
  });
});

describe('coveredRange', () => {
  // The colour range comes from ground at least one ray crossed (coverage > 0); ground no ray reached
  // is left to the end colours, and air (NaN) never counts.
  it('spans the covered ground only', () => {
    const v = [Number.NaN, 400, 900, 6500, 2500, 120];
    const c = [Number.NaN, 12, 3, 0, 0.4, 0];
    expect(coveredRange(v, c)).toEqual({ min: 400, max: 2500 });
  });
  it('falls back to all ground when no ray crossed any, and is null without ground', () => {
    expect(coveredRange([Number.NaN, 700, 300], [Number.NaN, 0, 0])).toEqual({ min: 300, max: 700 });
    expect(coveredRange([Number.NaN], [Number.NaN])).toBeNull();
  });
});
