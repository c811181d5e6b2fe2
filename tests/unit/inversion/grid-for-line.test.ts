/**
 * The automatic start's grid (issue 11 item 5: "grid spacing defaulting to something sensible for the
 * station spacing"; the rule stated for this work: half the median station spacing, taken to a round
 * spacing, coarsened until nx ≤ 600).
 */
import { describe, expect, it } from 'vitest';
import { gridForLine, MAX_DEFAULT_NX, medianStationSpacing } from '../../../shared/inversion/grid-for-line';
import { evalPolyline } from '../../../shared/model/polyline';

const spread = (n: number, step: number, z: (x: number) => number = () => 100) => Array.from({ length: n }, (_, i) => ({ x: i * step, z: z(i * step) }));
const xEnd = (g: { x0: number; dx: number; nx: number }) => g.x0 + (g.nx - 1) * g.dx;

describe('gridForLine', () => {
  it('takes half the median station spacing down to a round spacing: 2.5 m geophones give 1 m cells', () => {
    const stations = spread(48, 2.5);
    expect(medianStationSpacing(stations)).toBe(2.5);
    const { grid, spacing } = gridForLine({ stations, shotXs: [-5, 58.75, 122.5] });
    expect(spacing).toBe(1); // 2.5 / 2 = 1.25 → next round spacing at or below: 1
    expect(grid.dx).toBe(1);
    expect(grid.dz).toBe(1);
    // Every station and shot inside the grid, a margin beyond, and ground below the top row.
    expect(grid.x0).toBeLessThan(-5);
    expect(xEnd(grid)).toBeGreaterThan(122.5);
    expect(grid.z0).toBeGreaterThan(100);
    // About a quarter spread below the lowest station (117.5 m / 4 ≈ 29 m; shared/model/edit/defaults.ts).
    expect(grid.z0 - (grid.nz - 1) * grid.dz).toBeLessThanOrEqual(100 - 117.5 / 4);
  });

  it(`coarsens the default until the grid has at most ${MAX_DEFAULT_NX} nodes along the line`, () => {
    const stations = spread(2001, 0.5); // 1 km at 0.5 m: half is 0.25 m, which would need > 4 000 columns
    const { grid, spacing } = gridForLine({ stations });
    expect(grid.nx).toBeLessThanOrEqual(MAX_DEFAULT_NX);
    expect(spacing).toBe(2); // 0.25, 0.5 and 1 m all give more than 600 columns over 1.1 km
    expect(gridForLine({ stations }, 1).grid.nx).toBeGreaterThan(MAX_DEFAULT_NX);
  });

  it('honours a given spacing and lays the ground surface through the stations', () => {
    const stations = spread(25, 4, (x) => 50 + 0.1 * x);
    const { grid, surface, spacing } = gridForLine({ stations }, 0.75);
    expect(spacing).toBe(0.75);
    expect(grid.dx).toBe(0.75);
    expect(surface[0][0]).toBe(grid.x0);
    expect(surface.at(-1)![0]).toBeCloseTo(xEnd(grid), 6);
    for (const s of stations) expect(evalPolyline(surface, s.x)).toBeCloseTo(s.z, 9);
    expect(grid.z0).toBeGreaterThanOrEqual(Math.max(...stations.map((s) => s.z)));
  });
});
