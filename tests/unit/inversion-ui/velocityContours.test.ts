import { describe, expect, it } from 'vitest';
import type { Grid } from '../../../shared/grid';
import { coverageMask } from '../../../src/components/inversion/coverageMask';
import { withoutMasked } from '../../../src/components/inversion/sectionArrays';
import { contourLabelPoint, isoVelocityContours, isoVelocityLevels } from '../../../src/components/inversion/velocityContours';

// Contour levels from the 1–2–5 series, strictly inside the velocity range (common practice for
// contour maps, no source); expected values worked out by hand from that rule.

describe('isoVelocityLevels', () => {
  it.each([
    [300, 3000, [500, 1000, 1500, 2000, 2500]], // (3000 − 300) / 7 = 386 → step 500
    [400, 500, [420, 440, 460, 480]], // 100 / 7 = 14.3 → step 20
    [500, 1000, [600, 700, 800, 900]], // 71.4 → step 100; the range ends are not levels
    [350, 4200, [1000, 2000, 3000, 4000]], // 3850 / 7 = 550 rounds up to 1000 on the 1–2–5 series
  ])('%s to %s m/s', (min, max, expected) => {
    expect(isoVelocityLevels(min, max)).toEqual(expected);
  });

  it('draws nothing for an empty or reversed range', () => {
    expect(isoVelocityLevels(800, 800)).toEqual([]);
    expect(isoVelocityLevels(900, 800)).toEqual([]);
    expect(isoVelocityLevels(Number.NaN, 800)).toEqual([]);
  });
});

describe('isoVelocityContours', () => {
  // v = 400 + 100·depth (m/s) on 1 m cells: linear in depth, so linear interpolation along cell
  // edges is exact and the 1000 m/s contour lies at depth 6 m, elevation z0 − 6, at every x.
  const grid: Grid = { x0: 0, dx: 1, nx: 11, z0: 50, dz: 1, nz: 11 };
  const v = new Float32Array(grid.nx * grid.nz);
  for (let iz = 0; iz < grid.nz; iz++) for (let ix = 0; ix < grid.nx; ix++) v[iz * grid.nx + ix] = 400 + 100 * iz;

  it('puts a level of a linear gradient at its exact depth, labelled in m/s', () => {
    const { segments, labels } = isoVelocityContours(v, grid, [1000]);
    expect(segments.length).toBeGreaterThan(0);
    for (let i = 1; i < segments.length; i += 2) expect(segments[i]).toBeCloseTo(44, 9);
    expect(labels).toHaveLength(1);
    expect(labels[0]!.text).toBe('1000');
    expect(labels[0]!.z).toBeCloseTo(44, 9);
    expect(Math.abs(labels[0]!.x - 5)).toBeLessThanOrEqual(0.5); // the first level's label sits half-way along (a segment midpoint)
  });

  it('stops contours where the coverage mask starts', () => {
    // columns x ≥ 6 m have no ray
    const coverage = Array.from({ length: grid.nx * grid.nz }, (_, i) => (i % grid.nx >= 6 ? 0 : 5));
    const { segments } = isoVelocityContours(withoutMasked(v, coverageMask(coverage, 1)), grid, [1000]);
    expect(segments.length).toBeGreaterThan(0);
    for (let i = 0; i < segments.length; i += 2) expect(segments[i]).toBeLessThanOrEqual(5 + 1e-9);
  });
});

describe('contourLabelPoint', () => {
  it('takes the segment midpoint nearest the asked-for x', () => {
    const segments = [0, 10, 2, 10, 4, 9, 6, 9, 8, 8, 10, 8];
    expect(contourLabelPoint(segments, 5.2)).toEqual({ x: 5, z: 9 });
    expect(contourLabelPoint([], 5)).toBeNull();
  });
});
