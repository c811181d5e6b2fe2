/**
 * Small synthetic models for the eikonal reference tests. Velocities are point samples at the
 * nodes; a node exactly on an interface takes the layer below (as shared/model/rasterise.ts does).
 */
import type { Grid } from '../../../shared/grid';

export interface TestModel {
  grid: Grid;
  velocity: Float32Array;
  active: Uint8Array;
}

/** Square-cell grid of width × depth metres at spacing h, top at z = 0. */
export function makeGrid(width: number, depth: number, h: number): Grid {
  return { x0: 0, dx: h, nx: Math.round(width / h) + 1, z0: 0, dz: h, nz: Math.round(depth / h) + 1 };
}

/** Velocity from a function of (x, depth) sampled at every node; all ground. */
export function sampleModel(grid: Grid, v: (x: number, depth: number) => number): TestModel {
  const { nx, nz, dx, dz, x0, z0 } = grid;
  const velocity = new Float32Array(nx * nz);
  for (let iz = 0; iz < nz; iz++) for (let ix = 0; ix < nx; ix++) velocity[iz * nx + ix] = v(x0 + ix * dx, -(z0 - iz * dz));
  return { grid, velocity, active: new Uint8Array(nx * nz).fill(1) };
}

const ON = 1e-6;

/** Two layers: v1 above depth(x), v2 from it down (a node on the interface is in the lower layer). */
export function twoLayers(grid: Grid, v1: number, v2: number, depthAt: (x: number) => number): TestModel {
  return sampleModel(grid, (x, d) => (d >= depthAt(x) - ON * grid.dz ? v2 : v1));
}

/** Largest relative difference between a and b over the given pairs. */
export function maxRel(pairs: [number, number][]): number {
  let m = 0;
  for (const [a, b] of pairs) m = Math.max(m, Math.abs(a - b) / Math.abs(b));
  return m;
}
