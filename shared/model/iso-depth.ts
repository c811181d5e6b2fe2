/**
 * Depth to an iso-velocity surface (e.g. "top of rock" at a velocity the geophysicist sets),
 * read from a rasterised model.
 *
 * At a position x along the line:
 * - the column of node velocities at x is the linear blend of the two node columns either side
 *   (exact at node columns);
 * - walking down from the ground surface, the first node whose velocity is ≥ v* marks the
 *   crossing; its elevation is interpolated linearly between that node and the one above it
 *   (a velocity that grows linearly with depth is therefore found exactly);
 * - the ground surface takes the velocity of the first node row below it (as the rasteriser fills
 *   the air above), so if that row is already as fast as v* (rock at the surface) the depth is 0;
 * - if no node of the column reaches v*, depth and elevation are null ("not reached within the
 *   model"): the surface may lie deeper, or nowhere.
 * Only the first crossing counts: a slower layer below a faster one (a velocity inversion) does
 * not change the answer. A sharp interface between two node rows is found within one row spacing
 * dz of where it is drawn, as the rasteriser resolves it (rasterise.ts).
 * Pure: no I/O. x must lie inside the grid and v* be a finite velocity > 0, else RangeError.
 */
import { nodeZ } from '../grid';
import type { RasterModel } from './rasterise';

export interface IsoDepth {
  /** Position along the line, m. */
  x: number;
  /** Ground elevation at x (the model's surface), m. */
  groundZ: number;
  /** Depth of the first crossing below the ground surface, m; null when never reached. */
  depth: number | null;
  /** Elevation of that crossing, m; null when never reached. */
  elevation: number | null;
}

export function isoVelocityDepth(model: RasterModel, velocity: number, x: number): IsoDepth {
  const { grid } = model;
  const { x0, dx, nx, nz } = grid;
  if (!(velocity > 0) || !Number.isFinite(velocity)) throw new RangeError(`iso-velocity must be a finite velocity > 0 m/s (got ${velocity})`);
  const fx = (x - x0) / dx;
  if (!Number.isFinite(x) || fx < -1e-9 || fx > nx - 1 + 1e-9) {
    throw new RangeError(`x = ${x} m is outside the model (x ${x0} to ${x0 + (nx - 1) * dx} m)`);
  }
  const ix = Math.min(nx - 2, Math.max(0, Math.floor(fx)));
  const w = Math.min(1, Math.max(0, fx - ix));
  const v = model.velocity;
  const at = (iz: number): number => (1 - w) * v[iz * nx + ix] + w * v[iz * nx + ix + 1];

  const groundZ = model.surfaceZ(x);
  const eps = 1e-6 * grid.dz;
  // First node row at or below the ground at x; air rows above it carry copied velocities.
  let iz = 0;
  while (iz < nz && nodeZ(grid, iz) > groundZ + eps) iz++;
  if (iz === nz) return { x, groundZ, depth: null, elevation: null };
  // The ground surface takes the velocity of the first ground row (as the rasteriser's air fill does).
  let zAbove = groundZ;
  let vAbove = at(iz);
  if (vAbove >= velocity) return { x, groundZ, depth: 0, elevation: groundZ };
  for (; iz < nz; iz++) {
    const z = nodeZ(grid, iz);
    const vHere = at(iz);
    if (vHere >= velocity) {
      const f = vHere === vAbove ? 0 : (velocity - vAbove) / (vHere - vAbove);
      const elevation = zAbove - f * (zAbove - z);
      return { x, groundZ, depth: groundZ - elevation, elevation };
    }
    zAbove = z;
    vAbove = vHere;
  }
  return { x, groundZ, depth: null, elevation: null };
}

/** The same at many positions (e.g. every station, or every node column for a profile line). */
export function isoVelocityProfile(model: RasterModel, velocity: number, xs: readonly number[]): IsoDepth[] {
  return xs.map((x) => isoVelocityDepth(model, velocity, x));
}
