/**
 * The depth of an iso-velocity where an inversion resolves it: the first crossing (iso-depth.ts) kept
 * only above the depth of investigation and at a node crossed by enough ray. Used by the inversion
 * report's tables and the depth-to-rock exports alike.
 */
import { nodeX, type Grid } from '../grid';
import { isoVelocityDepth, type IsoDepth } from './iso-depth';
import type { RasterModel } from './rasterise';

export const BELOW_DOI = 'not resolved: below the DOI';
export const UNCOVERED = 'not resolved: too little ray coverage';
export const NO_RAYS = 'not resolved: no ray reaches here';
export const NOT_REACHED_ABOVE_DOI = 'not reached above the DOI';
export const OUTSIDE_GRID = 'outside the section';

export type IsoDepthStatus = 'resolved' | typeof BELOW_DOI | typeof UNCOVERED | typeof NO_RAYS | typeof NOT_REACHED_ABOVE_DOI | typeof OUTSIDE_GRID;

export interface RaySupport {
  grid: Grid;
  raster: RasterModel;
  /** 1 ground, 0 air, per node. */
  active: ArrayLike<number>;
  /** Whether node i carries enough ray. */
  covered(i: number): boolean;
  /** DOI elevation at x (m), NaN where no ray passes. */
  doiAt(x: number): number;
}

/** Depth of the first v* crossing at x and whether the inversion resolves it there. */
export function resolvedIsoDepth(s: RaySupport, velocity: number, x: number): { result: IsoDepth | null; status: IsoDepthStatus } {
  const { grid } = s;
  if (!(x >= grid.x0 && x <= nodeX(grid, grid.nx - 1))) return { result: null, status: OUTSIDE_GRID };
  const result = isoVelocityDepth(s.raster, velocity, x);
  const doi = s.doiAt(x);
  if (!Number.isFinite(doi)) return { result, status: NO_RAYS };
  if (result.elevation === null) return { result, status: NOT_REACHED_ABOVE_DOI };
  // A crossing within a thousandth of a node row of the DOI counts as on it.
  if (result.elevation < doi - 1e-3 * grid.dz) return { result, status: BELOW_DOI };
  // The node nearest to the crossing must be covered (the surface node when it lies in the air above the first row).
  const ix = Math.round((x - grid.x0) / grid.dx);
  let iz = Math.min(grid.nz - 1, Math.max(0, Math.round((grid.z0 - result.elevation) / grid.dz)));
  while (iz < grid.nz - 1 && !s.active[iz * grid.nx + ix]) iz++;
  if (!s.covered(iz * grid.nx + ix)) return { result, status: UNCOVERED };
  return { result, status: 'resolved' };
}

/** Air nodes take the velocity of the first ground node below them (a column of air keeps NaN), as iso-depth.ts expects. */
export function airFilled(grid: Grid, velocity: Float32Array): Float32Array {
  const out = Float32Array.from(velocity);
  for (let ix = 0; ix < grid.nx; ix++) {
    let below = Number.NaN;
    for (let iz = grid.nz - 1; iz >= 0; iz--) {
      const i = iz * grid.nx + ix;
      if (Number.isNaN(out[i])) out[i] = below;
      else below = out[i];
    }
  }
  return out;
}

/** DOI elevation at x from per-column values, linear between columns; NaN where either column has no ray. */
export function doiBetweenColumns(grid: Grid, doi: ArrayLike<number>, x: number): number {
  const f = Math.min(grid.nx - 1, Math.max(0, (x - grid.x0) / grid.dx));
  const ix = Math.min(grid.nx - 2, Math.floor(f));
  const w = f - ix;
  // At a node column only that column counts (its neighbour may have no ray).
  if (w < 1e-9) return doi[ix];
  if (w > 1 - 1e-9) return doi[ix + 1];
  return (1 - w) * doi[ix] + w * doi[ix + 1];
}

/** What resolvedIsoDepth needs, from a section's arrays (velocity NaN in the air). */
export function raySupport(grid: Grid, velocity: Float32Array, coverage: ArrayLike<number>, doi: ArrayLike<number>, threshold: number, surfaceZ: (x: number) => number): RaySupport {
  const active = Uint8Array.from(velocity, (v) => (Number.isNaN(v) ? 0 : 1));
  return {
    grid,
    active,
    raster: { grid, velocity: airFilled(grid, velocity), active, surfaceZ },
    covered: (i) => active[i] === 1 && coverage[i] >= threshold,
    doiAt: (x) => doiBetweenColumns(grid, doi, x),
  };
}
