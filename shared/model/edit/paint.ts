/**
 * Painting cells: which grid nodes a brush or a rectangle covers, and how that becomes the
 * model's `edits` (painted cells over the layered result, shared/schemas/model.ts). Cells are
 * node indices i = iz·nx + ix. A later edit of the same node replaces the earlier one, so the
 * list never holds two values for one node.
 */
import type { Grid } from '../../grid';
import type { ModelEdit } from '../../schemas/model';

export interface XZ {
  x: number;
  z: number;
}

/** Nearest node to a point, or -1 when the point is more than half a cell outside the grid. */
export function nearestNode(grid: Grid, p: XZ): number {
  const ix = Math.round((p.x - grid.x0) / grid.dx);
  const iz = Math.round((grid.z0 - p.z) / grid.dz);
  if (!(ix >= 0 && ix < grid.nx && iz >= 0 && iz < grid.nz)) return -1;
  return iz * grid.nx + ix;
}

/** Nodes inside a disc of `radius` metres around `centre`; a brush smaller than a cell still paints the nearest node. */
export function brushCells(grid: Grid, centre: XZ, radius: number): number[] {
  const r = Math.max(0, radius);
  const { x0, dx, nx, z0, dz, nz } = grid;
  const ixLo = Math.max(0, Math.ceil((centre.x - r - x0) / dx - 1e-9));
  const ixHi = Math.min(nx - 1, Math.floor((centre.x + r - x0) / dx + 1e-9));
  const izLo = Math.max(0, Math.ceil((z0 - centre.z - r) / dz - 1e-9));
  const izHi = Math.min(nz - 1, Math.floor((z0 - centre.z + r) / dz + 1e-9));
  const out: number[] = [];
  const r2 = r * r * (1 + 1e-9);
  for (let iz = izLo; iz <= izHi; iz++) {
    const ddz = z0 - iz * dz - centre.z;
    for (let ix = ixLo; ix <= ixHi; ix++) {
      const ddx = x0 + ix * dx - centre.x;
      if (ddx * ddx + ddz * ddz <= r2) out.push(iz * nx + ix);
    }
  }
  if (out.length === 0) {
    const near = nearestNode(grid, centre);
    if (near >= 0) out.push(near);
  }
  return out;
}

/** Nodes swept by a brush moved in a straight line from `a` to `b` (steps of half a cell, so a fast stroke leaves no gaps). */
export function brushStrokeCells(grid: Grid, a: XZ, b: XZ, radius: number): number[] {
  const step = 0.5 * Math.min(grid.dx, grid.dz);
  const n = Math.max(1, Math.ceil(Math.hypot(b.x - a.x, b.z - a.z) / step));
  const seen = new Set<number>();
  for (let k = 0; k <= n; k++) {
    const t = k / n;
    for (const c of brushCells(grid, { x: a.x + (b.x - a.x) * t, z: a.z + (b.z - a.z) * t }, radius)) seen.add(c);
  }
  return [...seen];
}

/** Nodes inside the axis-aligned rectangle with corners `a` and `b` (edges included). */
export function rectangleCells(grid: Grid, a: XZ, b: XZ): number[] {
  const { x0, dx, nx, z0, dz, nz } = grid;
  const xLo = Math.min(a.x, b.x);
  const xHi = Math.max(a.x, b.x);
  const zLo = Math.min(a.z, b.z);
  const zHi = Math.max(a.z, b.z);
  const ixLo = Math.max(0, Math.ceil((xLo - x0) / dx - 1e-9));
  const ixHi = Math.min(nx - 1, Math.floor((xHi - x0) / dx + 1e-9));
  const izLo = Math.max(0, Math.ceil((z0 - zHi) / dz - 1e-9));
  const izHi = Math.min(nz - 1, Math.floor((z0 - zLo) / dz + 1e-9));
  const out: number[] = [];
  for (let iz = izLo; iz <= izHi; iz++) for (let ix = ixLo; ix <= ixHi; ix++) out.push(iz * nx + ix);
  if (out.length === 0) {
    const near = nearestNode(grid, { x: (xLo + xHi) / 2, z: (zLo + zHi) / 2 });
    if (near >= 0) out.push(near);
  }
  return out;
}

/**
 * Paint velocity `v` (m/s) on `cells`. Air nodes (active = 0) are skipped when a ground mask is
 * given: the rasteriser ignores edits there, so storing them would only hide a mistake.
 */
export function paintCells(edits: readonly ModelEdit[], grid: Grid, cells: readonly number[], v: number, active?: Uint8Array): ModelEdit[] {
  const painted = new Set<number>();
  for (const c of cells) if (!active || active[c]) painted.add(c);
  if (painted.size === 0) return edits as ModelEdit[];
  const kept = edits.filter((e) => !painted.has(e.iz * grid.nx + e.ix));
  for (const c of painted) kept.push({ ix: c % grid.nx, iz: Math.floor(c / grid.nx), v });
  return kept;
}

/** Remove the edits on `cells`: those nodes fall back to the layered (or raw-grid) value. */
export function eraseCells(edits: readonly ModelEdit[], grid: Grid, cells: readonly number[]): ModelEdit[] {
  const erased = new Set(cells);
  const kept = edits.filter((e) => !erased.has(e.iz * grid.nx + e.ix));
  return kept.length === edits.length ? (edits as ModelEdit[]) : kept;
}
