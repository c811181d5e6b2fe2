/**
 * Input checks shared by every solve, so a bad model fails with a sentence, never a hang or a NaN.
 * Velocities are checked on ground nodes only: air nodes carry no waves and their values are ignored.
 */
import { type Grid, nodeX, nodeZ } from '../grid';
import { MAX_GRID_NODES } from '../limits';
import { EikonalInputError } from './errors';
import type { Point, VelocityField } from './types';
import { locateSourceCell } from './source';

const fmt = (n: number): string => n.toLocaleString('en-US');
const m = (v: number): string => `${+v.toFixed(3)} m`;

export function validateGrid(grid: Grid): void {
  const { x0, dx, nx, z0, dz, nz } = grid;
  if (![x0, dx, z0, dz].every(Number.isFinite)) throw new EikonalInputError('grid origin and spacing must be finite numbers');
  if (!(dx > 0) || !(dz > 0)) throw new EikonalInputError(`grid spacing must be positive (dx = ${dx}, dz = ${dz})`);
  if (!Number.isInteger(nx) || !Number.isInteger(nz) || nx < 2 || nz < 2) {
    throw new EikonalInputError(`grid needs at least 2 × 2 nodes with whole counts (nx = ${nx}, nz = ${nz})`);
  }
  if (nx * nz > MAX_GRID_NODES) {
    throw new EikonalInputError(`grid has ${fmt(nx * nz)} nodes (nx × nz = ${nx} × ${nz}); the limit is ${fmt(MAX_GRID_NODES)}`);
  }
}

/** Returns the number of ground nodes (counted on the way, so a solve need not count them again). */
export function validateSolveInput(grid: Grid, velocity: VelocityField, active: Uint8Array, source: Point): number {
  validateGrid(grid);
  const n = grid.nx * grid.nz;
  if (velocity.length !== n) {
    throw new EikonalInputError(`velocity has ${fmt(velocity.length)} values; the grid needs nx × nz = ${fmt(n)}`);
  }
  if (active.length !== n) throw new EikonalInputError(`ground mask has ${fmt(active.length)} values; the grid needs nx × nz = ${fmt(n)}`);
  let ground = 0;
  for (let i = 0; i < n; i++) {
    if (!active[i]) continue;
    ground++;
    const v = velocity[i];
    if (!(v > 0) || !Number.isFinite(v)) {
      const ix = i % grid.nx;
      const iz = (i - ix) / grid.nx;
      throw new EikonalInputError(
        `velocity at node (ix ${ix}, iz ${iz}; x ${m(nodeX(grid, ix))}, z ${m(nodeZ(grid, iz))}) is ${v} m/s; velocities must be positive finite numbers`,
      );
    }
  }
  if (ground === 0) throw new EikonalInputError('the model has no ground nodes (every node is air)');
  if (!source || !Number.isFinite(source.x) || !Number.isFinite(source.z)) {
    throw new EikonalInputError(`source position must be finite numbers (x = ${source?.x}, z = ${source?.z})`);
  }
  // locateSourceCell throws the "outside the grid" and "in the air" messages.
  locateSourceCell(grid, active, source);
  return ground;
}

/** Known cell slownesses: one per cell, each positive and finite or NaN (unknown). */
export function validateCellSlowness(grid: Grid, cells: Float32Array | Float64Array): void {
  const count = (grid.nx - 1) * (grid.nz - 1);
  if (cells.length !== count) {
    throw new EikonalInputError(`cell slowness has ${fmt(cells.length)} values; the grid has (nx − 1) × (nz − 1) = ${fmt(count)} cells`);
  }
  for (let c = 0; c < count; c++) {
    const s = cells[c];
    if (Number.isNaN(s) || (s > 0 && s < Infinity)) continue;
    throw new EikonalInputError(`cell slowness ${c} is ${s} s/m; it must be positive and finite, or NaN for unknown`);
  }
}
