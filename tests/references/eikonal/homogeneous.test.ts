/**
 * Uniform ground: T = r / v exactly (straight rays; e.g. Sethian 1999, "Level Set Methods and
 * Fast Marching Methods", ch. 8, the distance-function example). The factored scheme is exact
 * in uniform ground for any source position; the plain scheme is not, which shows why the
 * source treatment is needed.
 */
import { describe, expect, it } from 'vitest';
import { solveTravelTimes, TravelTimeSolver } from '../../../shared/eikonal';
import { homogeneousTime } from '../../../scripts/bench/exact';
import { makeGrid, sampleModel } from './models';

const V = 1200;
const grid = makeGrid(40, 15, 0.5);
const model = sampleModel(grid, () => V);

function relErrors(times: Float64Array, sx: number, sz: number): { max: number; mean: number } {
  let max = 0;
  let sum = 0;
  let n = 0;
  for (let iz = 0; iz < grid.nz; iz++) {
    for (let ix = 0; ix < grid.nx; ix++) {
      const x = ix * grid.dx;
      const z = -iz * grid.dz;
      if (Math.hypot(x - sx, z - sz) <= 2 * grid.dx) continue;
      const exact = homogeneousTime(V, sx, sz, x, z);
      const e = Math.abs(times[iz * grid.nx + ix] - exact) / exact;
      max = Math.max(max, e);
      sum += e;
      n++;
    }
  }
  return { max, mean: sum / n };
}

describe('uniform ground, T = r/v', () => {
  const sources = [
    { x: 20, z: 0 }, // on a node, on the surface
    { x: 13.37, z: -4.21 }, // inside a cell, at depth
    { x: 0, z: -15 }, // grid corner
    { x: 7.25, z: -0.25 }, // cell centre
  ];
  for (const s of sources) {
    for (const order of [1, 2] as const) {
      it(`order ${order}, source (${s.x}, ${s.z}): max error < 1e-9`, () => {
        const T = solveTravelTimes(grid, model.velocity, model.active, s, { order });
        expect(relErrors(T, s.x, s.z).max).toBeLessThan(1e-9);
      });
    }
  }

  it('without the factored source treatment the same grid is visibly worse (> 1 % max)', () => {
    const s = { x: 13.37, z: -4.21 };
    const T = new TravelTimeSolver(grid).solve(model.velocity, model.active, s, { order: 2, factored: false });
    expect(relErrors(T, s.x, s.z).max).toBeGreaterThan(0.01);
  });

  it('the time at the source cell corners is the straight-ray time', () => {
    const s = { x: 13.37, z: -4.21 };
    const T = solveTravelTimes(grid, model.velocity, model.active, s);
    const ix = Math.floor(s.x / grid.dx);
    const iz = Math.floor(-s.z / grid.dz);
    expect(T[iz * grid.nx + ix]).toBeCloseTo(homogeneousTime(V, s.x, s.z, ix * grid.dx, -iz * grid.dz), 12);
  });
});
