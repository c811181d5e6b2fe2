/**
 * The grid as a person thinks of it (x from, x to, top, depth, one spacing dx = dz) and the
 * node grid the file stores. Node counts are rounded up, so the grid always reaches xEnd and
 * the full depth.
 */
import type { Grid } from '../../grid';

export interface GridSpec {
  /** m along the line */
  xStart: number;
  xEnd: number;
  /** Elevation of the top row, m. */
  top: number;
  /** Top row to bottom row, m. */
  depth: number;
  /** dx = dz, m. */
  spacing: number;
}

export function gridFromSpec(s: GridSpec): Grid {
  const nx = Math.ceil((s.xEnd - s.xStart) / s.spacing - 1e-9) + 1;
  const nz = Math.ceil(s.depth / s.spacing - 1e-9) + 1;
  return { x0: s.xStart, dx: s.spacing, nx, z0: s.top, dz: s.spacing, nz };
}

export function specFromGrid(g: Grid): GridSpec {
  return { xStart: g.x0, xEnd: round(g.x0 + (g.nx - 1) * g.dx), top: g.z0, depth: round((g.nz - 1) * g.dz), spacing: g.dx };
}

/** Problems with the numbers themselves (before any node count), keyed by field. */
export function checkGridSpec(s: GridSpec): Partial<Record<keyof GridSpec, string>> {
  const out: Partial<Record<keyof GridSpec, string>> = {};
  for (const k of ['xStart', 'xEnd', 'top', 'depth', 'spacing'] as const) if (!Number.isFinite(s[k])) out[k] = 'must be a number';
  if (!out.spacing && !(s.spacing > 0)) out.spacing = 'must be > 0 m';
  if (!out.depth && !(s.depth > 0)) out.depth = 'must be > 0 m';
  if (!out.xEnd && !out.xStart && !(s.xEnd > s.xStart)) out.xEnd = 'must be greater than x from';
  return out;
}

/** Round away binary tails (0.30000000000000004 → 0.3) for display and for derived grid edges. */
export const round = (v: number): number => +v.toFixed(9);
