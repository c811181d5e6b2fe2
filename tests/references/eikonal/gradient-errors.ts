/** The constant-gradient test model and its error against the arccosh formula (Fomel, Luo & Zhao 2009, J. Comput. Phys. 228). */
import { solveTravelTimes } from '../../../shared/eikonal';
import { gradientRayMaxDepth, gradientTime } from '../../../scripts/bench/exact';
import { makeGrid, sampleModel } from './models';

export const V0 = 500;
export const G = 25;
export const WIDTH = 40;
export const DEPTH = 12;

/** Mean and max relative error over nodes more than `exclude` metres from the source. */
export function gradientErrors(h: number, order: 1 | 2, src: { x: number; z: number }, exclude: number) {
  const grid = makeGrid(WIDTH, DEPTH, h);
  const m = sampleModel(grid, (_x, d) => V0 + G * d);
  const T = solveTravelTimes(grid, m.velocity, m.active, src, { order });
  let sum = 0;
  let n = 0;
  let max = 0;
  for (let iz = 0; iz < grid.nz; iz++) {
    for (let ix = 0; ix < grid.nx; ix++) {
      const x = ix * h;
      const z = -iz * h;
      if (Math.hypot(x - src.x, z - src.z) <= exclude) continue;
      if (gradientRayMaxDepth(V0, G, src.x, src.z, x, z) > DEPTH) continue;
      const exact = gradientTime(V0, G, src.x, src.z, x, z);
      const e = Math.abs(T[iz * grid.nx + ix] - exact) / exact;
      sum += e;
      n++;
      max = Math.max(max, e);
    }
  }
  return { mean: sum / n, max, n };
}

