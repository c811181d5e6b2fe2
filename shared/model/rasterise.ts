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
 * Consequence: an interface is resolved to the row spacing dz. With the current solver an
 * interface between two node rows acts as if it lay on the lower row (tests/references/model).
 */
import { nodeX, nodeZ, type Grid } from '../grid';
import type { ModelFile, ModelLayer } from '../schemas/model';
import { evalPolyline } from './polyline';

export interface RasterModel {
  grid: Grid;
  /** m/s per node, row-major iz outer. */
  velocity: Float32Array;
  /** 1 ground, 0 air. */
  active: Uint8Array;
  /** Ground elevation (m) at x: the surface polyline, or z0 when the file has none. */
  surfaceZ(x: number): number;
}

export function rasteriseModel(model: ModelFile): RasterModel {
  const { x0, dx, nx, z0, dz, nz } = model.grid;
  const grid: Grid = { x0, dx, nx, z0, dz, nz };
  const surface = model.surface;
  const surfaceZ = surface ? (x: number) => evalPolyline(surface, x) : () => z0;
  const velocity = new Float32Array(nx * nz);
  const active = new Uint8Array(nx * nz);
  const eps = 1e-6 * dz;

  if (model.velocity) velocity.set(model.velocity);
  for (let ix = 0; ix < nx; ix++) {
    const x = nodeX(grid, ix);
    const zSurf = surfaceZ(x);
    if (model.layers) fillLayerColumn(grid, model.layers, ix, zSurf, eps, velocity);
    for (let iz = 0; iz < nz; iz++) active[iz * nx + ix] = nodeZ(grid, iz) <= zSurf + eps ? 1 : 0;
  }
  for (const edit of model.edits ?? []) {
    const i = edit.iz * nx + edit.ix;
    if (active[i]) velocity[i] = edit.v;
  }
  fillAirFromBelow(grid, active, velocity);
  return { grid, velocity, active, surfaceZ };
}

/** Velocities of one column ix from the layer list; nodes above the surface get extrapolated values, overwritten later. */
function fillLayerColumn(grid: Grid, layers: ModelLayer[], ix: number, zSurf: number, eps: number, velocity: Float32Array): void {
  const x = nodeX(grid, ix);
  const zBottom = nodeZ(grid, grid.nz - 1);
  const last = layers.length - 1;
  // tops[k], bases[k]: clipped interfaces of layer k at this x.
  const tops = new Float64Array(layers.length);
  const bases = new Float64Array(layers.length);
  let top = zSurf;
  for (let k = 0; k <= last; k++) {
    const base = layers[k].base;
    const b = k < last && base ? Math.min(evalPolyline(base, x), top) : zBottom;
    tops[k] = top;
    bases[k] = b;
    top = b;
  }
  let k = 0;
  for (let iz = 0; iz < grid.nz; iz++) {
    const z = nodeZ(grid, iz);
    while (k < last && z <= bases[k] + eps) k++; // on an interface → layer below
    const thickness = tops[k] - bases[k];
    const frac = thickness > eps ? Math.min(1, Math.max(0, (tops[k] - z) / thickness)) : 0;
    const { v_top, v_base } = layers[k];
    velocity[iz * grid.nx + ix] = v_top + (v_base - v_top) * frac;
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
