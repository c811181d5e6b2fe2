/**
 * The border of the painted cells, as segments in model metres (x1, z1, x2, z2, …): every side of
 * a painted node's cell that faces an unpainted node or the grid edge. Drawn over the heatmap so
 * painting stays visible even where its velocity matches the layer around it.
 */
import type { Grid } from '../../../shared/grid';
import type { ModelEdit } from '../../../shared/model';

export function paintedOutline(grid: Grid, edits: readonly ModelEdit[]): Float32Array {
  const { x0, dx, nx, z0, dz, nz } = grid;
  if (edits.length === 0) return new Float32Array(0);
  const painted = new Uint8Array(nx * nz);
  for (const e of edits) if (e.ix < nx && e.iz < nz) painted[e.iz * nx + e.ix] = 1;
  const out: number[] = [];
  const at = (ix: number, iz: number): number => (ix >= 0 && ix < nx && iz >= 0 && iz < nz ? painted[iz * nx + ix] : 0);
  for (const e of edits) {
    const { ix, iz } = e;
    if (ix >= nx || iz >= nz || painted[iz * nx + ix] !== 1) continue;
    painted[iz * nx + ix] = 2; // once per node even if listed twice
    const xl = x0 + (ix - 0.5) * dx;
    const xr = x0 + (ix + 0.5) * dx;
    const zt = z0 - (iz - 0.5) * dz;
    const zb = z0 - (iz + 0.5) * dz;
    if (!at(ix - 1, iz)) out.push(xl, zt, xl, zb);
    if (!at(ix + 1, iz)) out.push(xr, zt, xr, zb);
    if (!at(ix, iz - 1)) out.push(xl, zt, xr, zt);
    if (!at(ix, iz + 1)) out.push(xl, zb, xr, zb);
  }
  return Float32Array.from(out);
}
