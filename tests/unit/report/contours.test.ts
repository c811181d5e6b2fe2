/**
 * Contour lines (worker/report/contours.ts) against fields whose isolines are known exactly.
 * 1. T = r/v around a point (uniform ground, the eikonal solution for a point source): the level t
 *    is the circle of radius v·t. Marching squares with linear interpolation along cell edges puts
 *    each vertex on an edge between two nodes; on a circle sampled at spacing h the error of linear
 *    interpolation of r is at most h²/(8·r) (second-derivative bound of linear interpolation,
 *    elementary numerical analysis).
 * 2. A field linear in x: every isoline is a vertical straight line, found exactly.
 */
import { describe, expect, it } from 'vitest';
import type { Grid } from '../../../shared/grid';
import { contourLines } from '../../../shared/geometry/contour-lines';

function field(grid: Grid, f: (x: number, z: number) => number): Float64Array {
  const out = new Float64Array(grid.nx * grid.nz);
  for (let iz = 0; iz < grid.nz; iz++) for (let ix = 0; ix < grid.nx; ix++) out[iz * grid.nx + ix] = f(grid.x0 + ix * grid.dx, grid.z0 - iz * grid.dz);
  return out;
}

describe('contourLines', () => {
  const grid: Grid = { x0: 0, dx: 0.5, nx: 81, z0: 40, dz: 0.5, nz: 81 };
  const v = 1500;
  const src = { x: 20.2, z: 19.9 };
  const T = field(grid, (x, z) => Math.hypot(x - src.x, z - src.z) / v);

  it('a point source in uniform ground gives one closed circle per level, of radius v·t', () => {
    for (const t of [0.004, 0.008, 0.012]) {
      const lines = contourLines(T, grid, t);
      expect(lines).toHaveLength(1);
      const line = lines[0];
      const r = v * t;
      for (let i = 0; i < line.length; i += 2) {
        expect(Math.abs(Math.hypot(line[i] - src.x, line[i + 1] - src.z) - r)).toBeLessThan((0.5 * 0.5) / (8 * r) + 1e-9);
      }
      // Closed: the chain returns to its first point.
      expect(line[line.length - 2]).toBeCloseTo(line[0], 12);
      expect(line[line.length - 1]).toBeCloseTo(line[1], 12);
      // Every crossed cell edge appears once: about 2πr/h · (4/π) vertices for a circle on a square grid.
      expect(line.length / 2).toBeGreaterThan((8 * r) / 0.5 * 0.9);
    }
  });

  it('a field linear in x gives straight vertical lines at the exact x', () => {
    const g: Grid = { x0: -3, dx: 1, nx: 12, z0: 5, dz: 0.7, nz: 9 };
    const lines = contourLines(field(g, (x) => 2 * x + 1), g, 4.3); // x = 1.65
    expect(lines).toHaveLength(1);
    for (let i = 0; i < lines[0].length; i += 2) expect(lines[0][i]).toBeCloseTo(1.65, 12);
    const zs = lines[0].filter((_, i) => i % 2 === 1);
    expect(Math.max(...zs) - Math.min(...zs)).toBeCloseTo((g.nz - 1) * g.dz, 12); // runs top to bottom
  });

  it('stops at air (NaN) and splits a line the air cuts in two', () => {
    const g: Grid = { x0: 0, dx: 1, nx: 10, z0: 9, dz: 1, nz: 10 };
    const values = field(g, (x) => x);
    for (let ix = 0; ix < g.nx; ix++) values[4 * g.nx + ix] = Number.NaN; // node row z = 5 is air
    const lines = contourLines(values, g, 4.5);
    expect(lines).toHaveLength(2);
    // The cells either side of the air row (z 4 to 6) are skipped: one line above, one below.
    const zs = lines.map((l) => l.filter((_, i) => i % 2 === 1));
    expect(zs.map((z) => [Math.min(...z), Math.max(...z)]).sort((a, b) => a[0] - b[0])).toEqual([[0, 4], [6, 9]]);
  });

  it('draws nothing for a level outside the field', () => {
    expect(contourLines(T, grid, 1)).toEqual([]);
  });
});
