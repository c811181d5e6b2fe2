/**
 * Travel-time gradient at a node from its neighbours: central differences where both sides
 * hold a finite time, one-sided where only one does, 0 along an axis with neither.
 * Used to extrapolate times a fraction of a cell past the ground surface (interpolate.ts)
 * and to start rays in cells that have air corners (rays.ts). Returns ∂T/∂x and ∂T/∂depth
 * (depth = −z, i.e. along increasing iz), both in s/m.
 */
import type { Grid } from '../grid';

export function nodeGradient(grid: Grid, times: Float64Array, ix: number, iz: number, out: { gx: number; gd: number }): void {
  const { nx, nz, dx, dz } = grid;
  const i = iz * nx + ix;
  const t = times[i];
  const l = ix > 0 ? times[i - 1] : Infinity;
  const r = ix < nx - 1 ? times[i + 1] : Infinity;
  const u = iz > 0 ? times[i - nx] : Infinity;
  const d = iz < nz - 1 ? times[i + nx] : Infinity;
  out.gx = oneAxis(l, t, r, dx);
  out.gd = oneAxis(u, t, d, dz);
}

export function oneAxis(before: number, at: number, after: number, h: number): number {
  const fb = Number.isFinite(before);
  const fa = Number.isFinite(after);
  if (fb && fa) return (after - before) / (2 * h);
  if (fa) return (after - at) / h;
  if (fb) return (at - before) / h;
  return 0;
}
