import type { Grid } from '../../../../shared/grid';
import { nodeX, nodeZ } from '../../../../shared/grid';

/** Plain arrays for plotly from the API's typed grids (air NaN → null, so it is left blank). */

export function gridAxes(grid: Grid): { xs: number[]; zs: number[] } {
  return {
    xs: Array.from({ length: grid.nx }, (_, ix) => round6(nodeX(grid, ix))),
    zs: Array.from({ length: grid.nz }, (_, iz) => round6(nodeZ(grid, iz))),
  };
}

/** Rows of the grid (iz outer, as stored), each value multiplied by `scale` (e.g. 1000 for s → ms). */
export function gridRows(values: Float32Array, grid: Grid, scale = 1): (number | null)[][] {
  const rows: (number | null)[][] = new Array(grid.nz);
  for (let iz = 0; iz < grid.nz; iz++) {
    const row: (number | null)[] = new Array(grid.nx);
    for (let ix = 0; ix < grid.nx; ix++) {
      const v = values[iz * grid.nx + ix]!;
      row[ix] = Number.isFinite(v) ? v * scale : null;
    }
    rows[iz] = row;
  }
  return rows;
}

/** Many polylines in one trace: plotly breaks a line at null, which draws far faster than one trace each. */
export function joinPolylines(lines: readonly (readonly number[])[]): { x: (number | null)[]; y: (number | null)[] } {
  const x: (number | null)[] = [];
  const y: (number | null)[] = [];
  for (const flat of lines) {
    for (let i = 0; i + 1 < flat.length; i += 2) {
      x.push(flat[i]!);
      y.push(flat[i + 1]!);
    }
    x.push(null);
    y.push(null);
  }
  return { x, y };
}

/** Height (px) of a section plot whose drawing area is `plotWidth` px wide at vertical exaggeration `ve`. */
export function sectionHeight(grid: Grid, plotWidth: number, ve: number, chrome: number, min = 240, max = 900): number {
  const xSpan = (grid.nx - 1) * grid.dx;
  const zSpan = (grid.nz - 1) * grid.dz;
  if (!(xSpan > 0) || !(zSpan > 0)) return min;
  return Math.round(Math.min(max, Math.max(min, plotWidth * (zSpan / xSpan) * ve + chrome)));
}

function round6(v: number): number {
  return Math.round(v * 1e6) / 1e6;
}
