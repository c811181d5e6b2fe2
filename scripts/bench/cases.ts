/**
 * Benchmark cases: a model on a grid, a source, and the exact time at each measured node
 * (NaN = not measured). Velocities are sampled at the nodes the way the model rasteriser does
 * (shared/model/rasterise.ts): point samples, a node exactly on an interface belongs to the
 * layer below.
 */
import type { Grid } from '../../shared/grid';
import { parseModelFile, rasteriseModel } from '../../shared/model';
import type { Point } from '../../shared/eikonal';
import { dippingSurfaceTime, gradientRayMaxDepth, gradientTime, homogeneousTime, twoLayerSurfaceTime } from './exact';

export interface BenchCase {
  name: string;
  grid: Grid;
  velocity: Float32Array;
  active: Uint8Array;
  source: Point;
  /** Exact first-arrival time at node (ix, iz), or NaN when the node is not measured. */
  exact: (ix: number, iz: number) => number;
  /** Cases built by the layered rasteriser: its cell slownesses, passed to the solver as the product does. */
  cellSlowness?: Float32Array;
}

/** Width of the homogeneous and gradient models (m); spacing = WIDTH / (nx − 1), square cells. */
export const WIDTH_M = 200;
export const HOMOGENEOUS_V = 1500;
export const GRADIENT_V0 = 500;
export const GRADIENT_G = 25; // 1/s: 500 m/s at the top, 1500 m/s at 40 m depth

/** Source a little off the nodes and below the top, so the source treatment is exercised. */
function offNodeSource(grid: Grid): Point {
  return { x: grid.x0 + 0.5 * WIDTH_M + 0.37 * grid.dx, z: grid.z0 - 0.41 * grid.dz };
}

function squareGrid(nx: number, nz: number): Grid {
  const h = WIDTH_M / (nx - 1);
  return { x0: 0, dx: h, nx, z0: 0, dz: h, nz };
}

/** Nodes farther than two cells from the source (the benchmark contract, FORMATS.md §3). */
function farFromSource(grid: Grid, s: Point, ix: number, iz: number): boolean {
  const x = grid.x0 + ix * grid.dx;
  const z = grid.z0 - iz * grid.dz;
  return Math.hypot(x - s.x, z - s.z) > 2 * Math.max(grid.dx, grid.dz);
}

export function homogeneousCase(nx: number, nz: number): BenchCase {
  const grid = squareGrid(nx, nz);
  const source = offNodeSource(grid);
  return {
    name: `homogeneous-${nx}x${nz}`,
    grid,
    velocity: new Float32Array(nx * nz).fill(HOMOGENEOUS_V),
    active: new Uint8Array(nx * nz).fill(1),
    source,
    exact: (ix, iz) =>
      farFromSource(grid, source, ix, iz) ? homogeneousTime(HOMOGENEOUS_V, source.x, source.z, ix * grid.dx, -iz * grid.dz) : NaN,
  };
}

export function gradientCase(nx: number, nz: number): BenchCase {
  const grid = squareGrid(nx, nz);
  const source = offNodeSource(grid);
  const velocity = new Float32Array(nx * nz);
  for (let iz = 0; iz < nz; iz++) velocity.fill(GRADIENT_V0 + GRADIENT_G * iz * grid.dz, iz * nx, (iz + 1) * nx);
  const bottom = (nz - 1) * grid.dz;
  return {
    name: `gradient-${nx}x${nz}`,
    grid,
    velocity,
    active: new Uint8Array(nx * nz).fill(1),
    source,
    exact: (ix, iz) => {
      if (!farFromSource(grid, source, ix, iz)) return NaN;
      const x = ix * grid.dx;
      const z = -iz * grid.dz;
      // Only nodes whose exact (circular) ray stays inside the grid can be compared.
      if (gradientRayMaxDepth(GRADIENT_V0, GRADIENT_G, source.x, source.z, x, z) > bottom) return NaN;
      return gradientTime(GRADIENT_V0, GRADIENT_G, source.x, source.z, x, z);
    },
  };
}

export const TWO_LAYER = { v1: 500, v2: 2000, depth: 10, spacing: 0.5, width: 200, bottom: 30 };

/** Flat refractor (brief's case): 500 over 2000 m/s, 10 m deep, 0.5 m spacing, receivers on the surface. */
export function twoLayerCase(depth: number = TWO_LAYER.depth, sourceX = 0): BenchCase {
  const { v1, v2, spacing: h, width, bottom } = TWO_LAYER;
  const nx = Math.round(width / h) + 1;
  const nz = Math.round(bottom / h) + 1;
  const grid: Grid = { x0: 0, dx: h, nx, z0: 0, dz: h, nz };
  const velocity = new Float32Array(nx * nz);
  const eps = 1e-6 * h;
  for (let iz = 0; iz < nz; iz++) velocity.fill(iz * h >= depth - eps ? v2 : v1, iz * nx, (iz + 1) * nx);
  const source = { x: sourceX, z: 0 };
  return {
    name: depth === TWO_LAYER.depth ? `two-layer-${nx}x${nz}` : `two-layer-${depth}m-${nx}x${nz}`,
    grid,
    velocity,
    active: new Uint8Array(nx * nz).fill(1),
    source,
    exact: (ix, iz) =>
      iz === 0 && farFromSource(grid, source, ix, iz) ? twoLayerSurfaceTime(v1, v2, depth, ix * h - source.x) : NaN,
  };
}

/**
 * Two layers (TWO_LAYER velocities, 0.5 m cells) built as a layered model file through the
 * rasteriser, refractor depthAtX0 at x = 0 dipping dipDeg (deepening to +x), with its cell
 * slownesses: point samples alone would put a refractor between rows (e.g. 10.2 m) on the next
 * row down. Flat: source at x = 0, 30 m deep grid; dipping: source mid-line, 40 m deep.
 */
export function twoLayerModelCase(depthAtX0 = 10.2, dipDeg = 0): BenchCase {
  const { v1, v2, spacing: h, width } = TWO_LAYER;
  const dip = (dipDeg * Math.PI) / 180;
  const nx = Math.round(width / h) + 1;
  const nz = Math.round((dipDeg ? DIPPING.bottom : TWO_LAYER.bottom) / h) + 1;
  const parsed = parseModelFile({
    format: 'timefield-model/1',
    grid: { x0: 0, dx: h, nx, z0: 0, dz: h, nz },
    layers: [
      { name: 'slow', base: [[0, -depthAtX0], [width, -depthAtX0 - width * Math.tan(dip)]], v_top: v1, v_base: v1 },
      { name: 'fast', v_top: v2, v_base: v2 },
    ],
  });
  if (!parsed.ok) throw new Error(`bench model is invalid: ${JSON.stringify(parsed.issues)}`);
  const raster = rasteriseModel(parsed.model);
  const source = { x: dipDeg ? width / 2 : 0, z: 0 };
  const surfaceTime = (x: number): number =>
    dipDeg ? dippingSurfaceTime(v1, v2, depthAtX0, dip, source.x, x) : twoLayerSurfaceTime(v1, v2, depthAtX0, x - source.x);
  return {
    name: dipDeg ? `dipping-${dipDeg}deg-${depthAtX0}m-${nx}x${nz}` : `two-layer-${depthAtX0}m-${nx}x${nz}`,
    grid: raster.grid,
    velocity: raster.velocity,
    active: raster.active,
    cellSlowness: raster.cellSlowness,
    source,
    exact: (ix, iz) => (iz === 0 && farFromSource(raster.grid, source, ix, iz) ? surfaceTime(ix * h) : NaN),
  };
}

export const DIPPING = { v1: 500, v2: 2000, depthAtX0: 8, dipDeg: 5, spacing: 0.5, width: 200, bottom: 40 };

/** Plane refractor dipping 5° (deepening to +x), source mid-line: up-dip and down-dip receivers. */
export function dippingCase(): BenchCase {
  const { v1, v2, depthAtX0, dipDeg, spacing: h, width, bottom } = DIPPING;
  const dip = (dipDeg * Math.PI) / 180;
  const nx = Math.round(width / h) + 1;
  const nz = Math.round(bottom / h) + 1;
  const grid: Grid = { x0: 0, dx: h, nx, z0: 0, dz: h, nz };
  const velocity = new Float32Array(nx * nz);
  const eps = 1e-6 * h;
  for (let iz = 0; iz < nz; iz++) {
    for (let ix = 0; ix < nx; ix++) {
      const interfaceDepth = depthAtX0 + ix * h * Math.tan(dip);
      velocity[iz * nx + ix] = iz * h >= interfaceDepth - eps ? v2 : v1;
    }
  }
  const source = { x: width / 2, z: 0 };
  return {
    name: `dipping-${nx}x${nz}`,
    grid,
    velocity,
    active: new Uint8Array(nx * nz).fill(1),
    source,
    exact: (ix, iz) =>
      iz === 0 && farFromSource(grid, source, ix, iz) ? dippingSurfaceTime(v1, v2, depthAtX0, dip, source.x, ix * h) : NaN,
  };
}

/** The sizes the benchmark contract requires (FORMATS.md §3). */
export const SIZES: [number, number][] = [
  [200, 50],
  [500, 100],
  [1000, 200],
  [2000, 400],
];
