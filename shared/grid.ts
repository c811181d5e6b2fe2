/**
 * The regular 2-D grid shared by models, travel-time fields and rays (FORMATS.md §1).
 * Node (ix, iz) sits at x = x0 + ix·dx, z = z0 − iz·dz (z is elevation, up positive);
 * arrays are row-major with iz outer: value[iz * nx + ix].
 */
export interface Grid {
  x0: number;
  dx: number;
  nx: number;
  z0: number;
  dz: number;
  nz: number;
}

export const nodeX = (g: Grid, ix: number): number => g.x0 + ix * g.dx;
export const nodeZ = (g: Grid, iz: number): number => g.z0 - iz * g.dz;
export const nodeIndex = (g: Grid, ix: number, iz: number): number => iz * g.nx + ix;
export const nodeCount = (g: Grid): number => g.nx * g.nz;

/** Fractional grid coordinates of a point (may lie outside [0, n−1]). */
export const gridCoords = (g: Grid, x: number, z: number): { fx: number; fz: number } => ({
  fx: (x - g.x0) / g.dx,
  fz: (g.z0 - z) / g.dz,
});

/** True when the point lies inside the grid's rectangle (edges included). */
export function insideGrid(g: Grid, x: number, z: number): boolean {
  const { fx, fz } = gridCoords(g, x, z);
  const eps = 1e-9;
  return fx >= -eps && fx <= g.nx - 1 + eps && fz >= -eps && fz <= g.nz - 1 + eps;
}
