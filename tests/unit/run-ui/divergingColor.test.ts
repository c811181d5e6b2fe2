import { describe, expect, it } from 'vitest';
import { divergingColor, RDBU_9, symmetricLimit } from '../../../src/components/run/misfit/divergingColor';

/**
 * References: ColorBrewer's 9-class RdBu scheme (Brewer, Harrower & Penn State, colorbrewer2.org, 2002):
 * #b2182b … #f7f7f7 … #2166ac. Relative luminance as WCAG 2.1 defines it (W3C, 2018, "relative
 * luminance": sRGB linearised, 0.2126 R + 0.7152 G + 0.0722 B). A diverging scale centred on zero must
 * be lightest at zero and grow darker with |residual| on both sides.
 */
function luminance(hex: string): number {
  const lin = (c: number) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
  const [r, g, b] = [1, 3, 5].map((i) => lin(parseInt(hex.slice(i, i + 2), 16) / 255));
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
}

describe('divergingColor', () => {
  it('is ColorBrewer RdBu: neutral at zero, red for late picks, blue for early ones', () => {
    expect(RDBU_9).toEqual(['#2166ac', '#4393c3', '#92c5de', '#d1e5f0', '#f7f7f7', '#fddbc7', '#f4a582', '#d6604d', '#b2182b']);
    expect(divergingColor(0, 2)).toBe('#f7f7f7');
    expect(divergingColor(2, 2)).toBe('#b2182b');
    expect(divergingColor(-2, 2)).toBe('#2166ac');
  });

  it('clips beyond the limit instead of running off the scale', () => {
    expect(divergingColor(50, 2)).toBe(divergingColor(2, 2));
    expect(divergingColor(-50, 2)).toBe(divergingColor(-2, 2));
  });

  it('darkens steadily away from zero on both sides', () => {
    for (const side of [1, -1]) {
      let previous = luminance(divergingColor(0, 1)!);
      for (let k = 1; k <= 20; k++) {
        const l = luminance(divergingColor((side * k) / 20, 1)!);
        expect(l).toBeLessThan(previous);
        previous = l;
      }
    }
  });

  it('has no colour for a missing value or a useless limit', () => {
    expect(divergingColor(Number.NaN, 1)).toBeNull();
    expect(divergingColor(1, 0)).toBeNull();
  });
});

describe('symmetricLimit', () => {
  it('covers 95 % of the values with a round number, so one wild pick does not wash out the rest', () => {
    const values = [...Array.from({ length: 99 }, (_, i) => ((i % 2 ? 1 : -1) * (i + 1)) / 100), 25]; // |v| up to 0.99, one 25
    expect(symmetricLimit(values)).toBe(1);
  });

  it('has a floor and a default', () => {
    expect(symmetricLimit([0, 0.001])).toBe(0.1);
    expect(symmetricLimit([])).toBe(1);
    expect(symmetricLimit([Number.NaN])).toBe(1);
  });
});
