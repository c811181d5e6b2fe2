import type { Grid } from '../../../shared/grid';

/**
 * The section arrives as JSON arrays with null in the air; drawing code wants typed arrays with NaN
 * there (the run section's convention), and plotly wants rows.
 */

/** null → NaN, as a Float32Array (velocities, coverage). */
export function toFloat32(values: readonly (number | null)[]): Float32Array {
  const out = new Float32Array(values.length);
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    out[i] = v === null || v === undefined ? Number.NaN : v;
  }
  return out;
}

/** A copy of `values` with the masked nodes set to NaN (contours then stop where the rays stop). */
export function withoutMasked(values: Float32Array, mask: Uint8Array): Float32Array {
  const out = Float32Array.from(values);
  for (let i = 0; i < mask.length; i++) if (mask[i]) out[i] = Number.NaN;
  return out;
}

/** Row-major node values as plotly heatmap rows (top row first), null for air and for masked nodes. */
export function heatmapRows(values: readonly (number | null)[], grid: Grid, mask?: Uint8Array, scale = 1): (number | null)[][] {
  const rows: (number | null)[][] = [];
  for (let iz = 0; iz < grid.nz; iz++) {
    const row: (number | null)[] = new Array(grid.nx);
    for (let ix = 0; ix < grid.nx; ix++) {
      const i = iz * grid.nx + ix;
      const v = values[i];
      row[ix] = v === null || v === undefined || !Number.isFinite(v) || (mask && mask[i]) ? null : v * scale;
    }
    rows.push(row);
  }
  return rows;
}

/** Node x positions and elevations of a grid, for chart axes. */
export function gridAxes(grid: Grid): { xs: number[]; zs: number[] } {
  return {
    xs: Array.from({ length: grid.nx }, (_, ix) => +(grid.x0 + ix * grid.dx).toFixed(6)),
    zs: Array.from({ length: grid.nz }, (_, iz) => +(grid.z0 - iz * grid.dz).toFixed(6)),
  };
}

/**
 * The depth-of-investigation line as polylines (m): one run of consecutive columns that have a value,
 * broken where a column has none (no ray passes there).
 */
export function doiPolylines(doi: readonly (number | null)[], grid: Grid): [number, number][][] {
  const runs: [number, number][][] = [];
  let current: [number, number][] = [];
  doi.forEach((z, ix) => {
    if (z === null || z === undefined || !Number.isFinite(z)) {
      if (current.length) runs.push(current);
      current = [];
      return;
    }
    current.push([grid.x0 + ix * grid.dx, z]);
  });
  if (current.length) runs.push(current);
  return runs;
}

/**
 * The colour range of a section: the velocities of ground that at least one ray crossed. Ground no ray
 * reached keeps whatever the smoothing left there, often far outside what the picks support; letting
 * it set the range would wash out the part of the section that carries information (it is drawn at the
 * end colours instead). Falls back to all ground when no node has coverage. Null without ground.
 */
export function coveredRange(velocity: ArrayLike<number>, coverage: ArrayLike<number>): { min: number; max: number } | null {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let pass = 0; pass < 2 && !(min <= max); pass++) {
    for (let i = 0; i < velocity.length; i++) {
      const v = velocity[i]!;
      if (!Number.isFinite(v) || (pass === 0 && !(coverage[i]! > 0))) continue;
      if (v < min) min = v;
      if (v > max) max = v;
    }
  }
  return min <= max ? { min, max } : null;
}
