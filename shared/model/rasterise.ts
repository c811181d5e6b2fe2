/**
 * Rasterise a validated model file onto its grid (FORMATS.md §1).
 *
 * Sampling rules (ours; the format leaves them open):
 * - Point sampling: each node takes the velocity at its own (x, z); no cell averaging.
 * - Ground: a node is ground (active = 1) when z ≤ surface(x); a node exactly on the surface
 *   is ground, so surface receivers always sit on active nodes' level.
 * - Interfaces: a node exactly on a layer base belongs to the layer BELOW it.
 *   Layer k owns surface-or-clipped-base(k−1) ≥ z > clipped-base(k).
 * - Pinch-out: clipped-base(k) = min(base_k(x), clipped-base(k−1)), with clipped-base(−1) = surface(x).
 * - Gradient: v = v_top + (v_base − v_top)·(top − z)/(top − base), with top/base the clipped
 *   interfaces at this x (last layer: base = grid bottom), evaluated at the node's z.
 *   A layer of zero thickness at some x has no nodes there; if one node exactly fills a
 *   zero-thickness last layer it takes v_top.
 * - "On" means within 1e-6·dz, so rounding in z0 − iz·dz does not flip a node across a line.
 * - Air (z > surface): active = 0; velocity copied from the topmost ground node of the
 *   column, so interpolation across the surface stays finite. Solvers ignore those values.
 * - Edits ({ix, iz, v}) are painted after the layers (or raw grid), on ground nodes only.
 * - Cells an interface crosses also get a slowness from samples inside the cell (cellSlowness,
 *   cell-slowness.ts), which the solver uses at contrasts: the node values alone place an interface
 *   between two rows only to within dz.
 */
import { nodeX, nodeZ, type Grid } from '../grid';
import type { ModelFile, ModelLayer } from '../schemas/model';
import { interfaceCellSlowness } from './cell-slowness';
import { layerColumnAt, layerIndexAt, layerVelocityAt, newLayerColumn } from './layer-column';
import { evalPolyline } from './polyline';

export interface RasterModel {
  grid: Grid;
  /** m/s per node, row-major iz outer. */
  velocity: Float32Array;
  /** 1 ground, 0 air. */
  active: Uint8Array;
  /** Ground elevation (m) at x: the surface polyline, or z0 when the file has none. */
  surfaceZ(x: number): number;
  /**
   * Layered models only: slowness (s/m) of each cell a layer interface crosses, from samples
   * inside the cell (cell-slowness.ts); NaN for other cells. Index cz·(nx−1)+cx. The solver uses
   * it where it sees a velocity contrast, so an interface between node rows acts where it is drawn.
   */
  cellSlowness?: Float32Array;
  /** The surface polyline as points, when the file has one (the solver's start region follows it: SolveOptions.surface). */
  surface?: { x: number; z: number }[];
}

export function rasteriseModel(model: ModelFile): RasterModel {
  const { x0, dx, nx, z0, dz, nz } = model.grid;
  const grid: Grid = { x0, dx, nx, z0, dz, nz };
  const surface = model.surface;
  const surfaceZ = surface ? (x: number) => evalPolyline(surface, x) : () => z0;
  const velocity = new Float32Array(nx * nz);
  const active = new Uint8Array(nx * nz);
  const eps = 1e-6 * dz;

  const layerOf = new Int32Array(model.layers ? nx * nz : 0);

  if (model.velocity) velocity.set(model.velocity);
  for (let ix = 0; ix < nx; ix++) {
    const x = nodeX(grid, ix);
    const zSurf = surfaceZ(x);
    if (model.layers) fillLayerColumn(grid, model.layers, ix, zSurf, eps, velocity, layerOf);
    for (let iz = 0; iz < nz; iz++) active[iz * nx + ix] = nodeZ(grid, iz) <= zSurf + eps ? 1 : 0;
  }
  for (const edit of model.edits ?? []) {
    const i = edit.iz * nx + edit.ix;
    if (!active[i]) continue;
    velocity[i] = edit.v;
    if (model.layers) layerOf[i] = -1; // painted: no longer the layered model's value
  }
  fillAirFromBelow(grid, active, velocity);
  const cellSlowness = model.layers ? interfaceCellSlowness(grid, model.layers, surfaceZ, layerOf, active) : undefined;
  return { grid, velocity, active, surfaceZ, cellSlowness, ...(surface ? { surface: surface.map(([x, z]) => ({ x, z })) } : {}) };
}

/**
 * Velocities of one column ix from the layer list, and each node's layer index; nodes above the
 * surface get extrapolated values, overwritten later.
 */
function fillLayerColumn(grid: Grid, layers: ModelLayer[], ix: number, zSurf: number, eps: number, velocity: Float32Array, layerOf: Int32Array): void {
  const col = newLayerColumn(layers.length);
  layerColumnAt(layers, nodeX(grid, ix), zSurf, nodeZ(grid, grid.nz - 1), col);
  let k = 0;
  for (let iz = 0; iz < grid.nz; iz++) {
    const z = nodeZ(grid, iz);
    k = layerIndexAt(col, z, eps, k);
    const i = iz * grid.nx + ix;
    velocity[i] = layerVelocityAt(layers[k], col, k, z, eps);
    layerOf[i] = k;
  }
}

/** Air nodes copy the topmost ground velocity of their column (ground is contiguous down to the bottom). */
function fillAirFromBelow(grid: Grid, active: Uint8Array, velocity: Float32Array): void {
  const { nx, nz } = grid;
  for (let ix = 0; ix < nx; ix++) {
    let first = 0;
    while (first < nz && !active[first * nx + ix]) first++;
    if (first === 0 || first === nz) continue; // no air, or (rejected by the rules) no ground
    const v = velocity[first * nx + ix];
    for (let iz = 0; iz < first; iz++) velocity[iz * nx + ix] = v;
  }
}
