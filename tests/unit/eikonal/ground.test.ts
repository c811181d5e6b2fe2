/**
 * Waves travel only through the ground. With an air notch cut into uniform ground, the first
 * arrival behind the notch must go around its tip: the shortest path in a uniform medium
 * around a corner is the two straight legs via the corner (Fermat's principle; common practice,
 * no source needed beyond that). Ground cut off from the source stays at Infinity.
 */
import { describe, expect, it } from 'vitest';
import { solveTravelTimes, TravelTimeSolver } from '../../../shared/eikonal';

const V = 1000;
const grid = { x0: 0, dx: 0.25, nx: 121, z0: 0, dz: 0.25, nz: 61 }; // 30 m × 15 m

function notched(): Uint8Array {
  // Air notch: x in [14.5, 15.5], from the surface down to 8 m depth.
  const a = new Uint8Array(grid.nx * grid.nz).fill(1);
  for (let iz = 0; iz < grid.nz; iz++) {
    for (let ix = 0; ix < grid.nx; ix++) {
      const x = ix * grid.dx;
      if (x >= 14.5 && x <= 15.5 && iz * grid.dz <= 8) a[iz * grid.nx + ix] = 0;
    }
  }
  return a;
}

describe('ground surface and air', () => {
  const active = notched();
  const v = new Float32Array(grid.nx * grid.nz).fill(V);
  const src = { x: 5, z: 0 };
  const T = solveTravelTimes(grid, v, active, src);

  it('air nodes stay Infinity; every ground node gets a finite time', () => {
    for (let i = 0; i < T.length; i++) expect(Number.isFinite(T[i])).toBe(active[i] === 1);
  });

  it('behind the notch the time follows the path around its tip (within 1 %), never shorter than that', () => {
    // Last ground node below the notch tip: x = 14.5 or 15.5 corners at depth 8.25 (first ground row under the notch).
    const tipL = { x: 14.5, z: -8.25 };
    const tipR = { x: 15.5, z: -8.25 };
    for (const rx of [20, 25, 29]) {
      const around = Math.hypot(tipL.x - src.x, tipL.z - src.z) + (tipR.x - tipL.x) + Math.hypot(rx - tipR.x, tipR.z);
      const t = T[Math.round(rx / grid.dx)];
      expect(t).toBeGreaterThan((around / V) * 0.99);
      expect(t).toBeLessThan((around / V) * 1.01);
      expect(t).toBeGreaterThan((rx - src.x) / V * 1.1); // much later than the straight line through the air
    }
  });

  it('ground cut off from the source is never reached', () => {
    const a = new Uint8Array(grid.nx * grid.nz).fill(1);
    for (let iz = 0; iz < grid.nz; iz++) a[iz * grid.nx + 60] = 0; // a full-depth air column at x = 15 m
    const t = solveTravelTimes(grid, v, a, src);
    expect(t[grid.nx - 1]).toBe(Infinity);
    expect(Number.isFinite(t[10])).toBe(true);
  });

  it('a reused solver gives the same field as a fresh solve', () => {
    const solver = new TravelTimeSolver(grid);
    solver.solve(v, active, { x: 27, z: -3.3 });
    const again = solver.solve(v, active, src);
    expect(Array.from(again)).toEqual(Array.from(T));
  });
});
