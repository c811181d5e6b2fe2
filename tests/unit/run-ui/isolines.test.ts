import { describe, expect, it } from 'vitest';
import type { Grid } from '../../../shared/grid';
import { isolineSegments, labelPoint } from '../../../src/components/run/section/isolines';

/**
 * Reference: in uniform ground of velocity v the first-arrival time from a point source is
 * t = r / v (straight rays; the eikonal equation |∇t| = 1/v with constant v), so every wavefront is a
 * circle of radius v·t. Marching squares with linear interpolation along cell edges
 * (Lorensen & Cline, SIGGRAPH 1987) must put its points on that circle to within the interpolation
 * error of a linear fit to r over one cell, which is below dx²/(8r) for a cell at distance r.
 */
const grid: Grid = { x0: 0, dx: 0.5, nx: 121, z0: 30, dz: 0.5, nz: 61 };
const v = 1500; // m/s
const src = { x: 30, z: 15 };
const times = new Float32Array(grid.nx * grid.nz);
for (let iz = 0; iz < grid.nz; iz++)
  for (let ix = 0; ix < grid.nx; ix++) {
    const x = grid.x0 + ix * grid.dx;
    const z = grid.z0 - iz * grid.dz;
    times[iz * grid.nx + ix] = Math.hypot(x - src.x, z - src.z) / v;
  }

describe('isolineSegments', () => {
  it('puts every point of a wavefront on the analytic circle r = v·t', () => {
    for (const tMs of [2, 5, 9]) {
      const seg = isolineSegments(times, grid, tMs / 1000);
      const r = (v * tMs) / 1000;
      expect(seg.length).toBeGreaterThan(40);
      for (let i = 0; i < seg.length; i += 2) {
        const dist = Math.hypot(seg[i]! - src.x, seg[i + 1]! - src.z);
        // float32 times and linear interpolation: well under a tenth of a cell
        expect(Math.abs(dist - r)).toBeLessThan(grid.dx / 10);
      }
    }
  });

  it('draws a closed circle: the segment lengths add up to 2πr within 1 %', () => {
    const r = 7.5; // 5 ms at 1500 m/s
    const seg = isolineSegments(times, grid, 0.005);
    let length = 0;
    for (let i = 0; i < seg.length; i += 4) length += Math.hypot(seg[i + 2]! - seg[i]!, seg[i + 3]! - seg[i + 1]!);
    expect(Math.abs(length - 2 * Math.PI * r) / (2 * Math.PI * r)).toBeLessThan(0.01);
  });

  it('stops at air: no segment touches a cell with a NaN corner', () => {
    const withAir = times.slice();
    for (let ix = 0; ix < grid.nx; ix++) for (let iz = 0; iz < 10; iz++) withAir[iz * grid.nx + ix] = Number.NaN; // top 10 rows are air
    const seg = isolineSegments(withAir, grid, 0.01);
    expect(seg.length).toBeGreaterThan(0);
    const lowestAir = grid.z0 - 9 * grid.dz; // z of the last air row
    for (let i = 1; i < seg.length; i += 2) expect(seg[i]!).toBeLessThanOrEqual(lowestAir - grid.dz + 1e-9);
  });

  it('splits a saddle cell by its mean value, giving two segments', () => {
    const g: Grid = { x0: 0, dx: 1, nx: 2, z0: 1, dz: 1, nz: 2 };
    // a=1 (top-left), b=0 (top-right), c=1 (bottom-right), d=0 (bottom-left): mean 0.5
    const above = isolineSegments(new Float32Array([1, 0, 0, 1]), g, 0.4); // mean above the level
    const below = isolineSegments(new Float32Array([1, 0, 0, 1]), g, 0.6);
    expect(above).toHaveLength(8);
    expect(below).toHaveLength(8);
    expect(above).not.toEqual(below);
  });

  it('returns nothing for a level outside the field', () => {
    expect(isolineSegments(times, grid, 1)).toEqual([]);
  });
});

describe('labelPoint', () => {
  it('picks the point of the wavefront on the 30° line away from the shot', () => {
    const seg = isolineSegments(times, grid, 0.008); // r = 12 m
    const at = labelPoint(seg, src, 60)!;
    const expected = { x: src.x + 12 * Math.cos(Math.PI / 6), z: src.z - 12 * Math.sin(Math.PI / 6) };
    expect(Math.hypot(at.x - expected.x, at.z - expected.z)).toBeLessThan(grid.dx);
  });

  it('has no point for an empty level', () => {
    expect(labelPoint([], src, 60)).toBeNull();
  });
});
