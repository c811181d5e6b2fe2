import { describe, expect, it } from 'vitest';
import type { Grid } from '../../../shared/grid';
import { contourLevels, isolines } from '../../../src/workers/isolines';

const grid: Grid = { x0: 0, dx: 1, nx: 61, z0: 0, dz: 1, nz: 41 };

describe('wavefront contours (marching squares)', () => {
  it('a plane wave T = x / v gives straight contours at x = T·v exactly (linear interpolation is exact for a linear field)', () => {
    const v = 1500;
    const T = new Float64Array(grid.nx * grid.nz);
    for (let iz = 0; iz < grid.nz; iz++) for (let ix = 0; ix < grid.nx; ix++) T[iz * grid.nx + ix] = ix / v;
    const levels = [10.3 / v, 33.75 / v];
    const [a, b] = isolines(grid, T, levels);
    expect(a.length / 4).toBe(grid.nz - 1); // one segment per cell row
    for (let k = 0; k < a.length; k += 2) expect(a[k]).toBeCloseTo(10.3, 4);
    for (let k = 0; k < b.length; k += 2) expect(b[k]).toBeCloseTo(33.75, 4);
  });

  it('a point source T = r / v gives contours on circles r = T·v to within a small fraction of a cell', () => {
    const v = 2000;
    const T = new Float64Array(grid.nx * grid.nz);
    for (let iz = 0; iz < grid.nz; iz++) for (let ix = 0; ix < grid.nx; ix++) T[iz * grid.nx + ix] = Math.hypot(ix - 30, iz - 20) / v;
    const r = 12.5;
    const [seg] = isolines(grid, T, [r / v]);
    expect(seg.length).toBeGreaterThan(4 * 40);
    let worst = 0;
    for (let k = 0; k < seg.length; k += 2) worst = Math.max(worst, Math.abs(Math.hypot(seg[k] - 30, -seg[k + 1] - 20) - r));
    // Chord error of linear interpolation across a cell is at most ~dx²/(8r) (≈ 0.01 m here).
    expect(worst).toBeLessThan(0.05);
  });

  it('cells touching air (Infinity) draw nothing', () => {
    const T = new Float64Array(grid.nx * grid.nz).fill(Infinity);
    expect(isolines(grid, T, [0.01])[0].length).toBe(0);
  });

  it('contour steps are 1, 2, 2.5 or 5 × 10^k ms, below the largest time', () => {
    expect(contourLevels(0.06)).toMatchObject({ stepMs: 5 });
    expect(contourLevels(0.06).levels).toHaveLength(11);
    expect(contourLevels(0.0235).stepMs).toBe(2);
    expect(contourLevels(0).levels).toEqual([]);
    expect(contourLevels(Infinity).levels).toEqual([]);
  });
});
