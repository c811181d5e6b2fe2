import { describe, expect, it } from 'vitest';
import type { Grid } from '../../../shared/grid';
import { niceTicks, sampleNearest, sectionFrame } from '../../../src/components/run/section/sectionScale';
import { finiteRange, velocityPixels } from '../../../src/components/run/section/velocityColours';
import { colourAt, VELOCITY_STOPS } from '../../../shared/colour/velocity-scale';

// The demo grid (FORMATS.md §1 convention: node (ix, iz) at x = x0 + ix·dx, z = z0 − iz·dz).
const grid: Grid = { x0: -20, dx: 0.3, nx: 526, z0: 104, dz: 0.3, nz: 101 };

describe('sectionFrame', () => {
  it('draws at true scale when the exaggeration is 1: a metre across is a metre down', () => {
    const f = sectionFrame(grid, 1100, 1);
    const [x0, y0] = f.toPx(0, 100);
    const [x1] = f.toPx(10, 100);
    const [, y1] = f.toPx(0, 90);
    expect(y1 - y0).toBeCloseTo(x1 - x0, 9);
  });

  it('stretches heights by the exaggeration and nothing else', () => {
    const one = sectionFrame(grid, 1100, 1);
    const three = sectionFrame(grid, 1100, 3);
    expect(three.plot.width).toBe(one.plot.width);
    expect(three.plot.height).toBeCloseTo(3 * one.plot.height, 9);
  });

  it('maps pixels back to the same model point, elevation up', () => {
    const f = sectionFrame(grid, 900, 2);
    const [px, py] = f.toPx(37.5, 92.25);
    const back = f.toModel(px, py);
    expect(back.x).toBeCloseTo(37.5, 9);
    expect(back.z).toBeCloseTo(92.25, 9);
    expect(f.toPx(0, 100)[1]).toBeLessThan(f.toPx(0, 90)[1]); // higher ground is nearer the top
  });

  it('gives every node a cell: the plot spans half a cell beyond the first and last node', () => {
    const f = sectionFrame(grid, 1000, 1);
    expect(f.xMin).toBeCloseTo(-20.15, 9);
    expect(f.xMax).toBeCloseTo(-20 + 525.5 * 0.3, 9);
    expect(f.zMax).toBeCloseTo(104.15, 9);
  });
});

describe('niceTicks', () => {
  it('puts round values inside the range', () => {
    expect(niceTicks(-20.15, 137.65, 8)).toEqual([-20, 0, 20, 40, 60, 80, 100, 120]);
    expect(niceTicks(73.85, 104.15, 6)).toEqual([75, 80, 85, 90, 95, 100]);
    expect(niceTicks(0.1, 0.45, 4)).toEqual([0.1, 0.2, 0.3, 0.4]);
  });

  it('has none for an empty range', () => {
    expect(niceTicks(5, 5)).toEqual([]);
  });
});

describe('sampleNearest', () => {
  it('reads the nearest node and NaN outside the grid', () => {
    const g: Grid = { x0: 0, dx: 1, nx: 3, z0: 0, dz: 1, nz: 2 };
    const values = new Float32Array([1, 2, 3, 4, 5, 6]);
    expect(sampleNearest(values, g, 1.4, -0.6)).toBe(5); // ix 1, iz 1
    expect(sampleNearest(values, g, 5, 0)).toBeNaN();
  });
});

/**
 * Reference: relative luminance as WCAG 2.1 defines it (W3C, 2018). The velocity scale must get
 * steadily darker with velocity, so "darker = faster" reads the same everywhere on the section,
 * and never darker than a level at which black lines stay legible (luminance above 0.3 — our choice).
 */
function luminance([r, g, b]: readonly [number, number, number]): number {
  const lin = (c: number) => (c / 255 <= 0.04045 ? c / 255 / 12.92 : ((c / 255 + 0.055) / 1.055) ** 2.4);
  return 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
}

describe('velocity colours', () => {
  it('darken steadily from slow to fast and stay light enough for black lines', () => {
    let previous = Number.POSITIVE_INFINITY;
    for (let k = 0; k <= 50; k++) {
      const l = luminance(colourAt(VELOCITY_STOPS, k / 50));
      expect(l).toBeLessThan(previous);
      expect(l).toBeGreaterThan(0.3);
      previous = l;
    }
  });

  it('leave air transparent and colour ground opaque', () => {
    const px = velocityPixels(new Float32Array([Number.NaN, 400, 4000]), { min: 400, max: 4000 });
    expect(Array.from(px.slice(0, 4))).toEqual([0, 0, 0, 0]);
    expect(px[7]).toBe(255);
    expect(px[11]).toBe(255);
    expect(finiteRange(new Float32Array([Number.NaN, 3, 1]))).toEqual({ min: 1, max: 3 });
    expect(finiteRange(new Float32Array([Number.NaN]))).toBeNull();
  });
});
