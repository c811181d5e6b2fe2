/**
 * Where the source sits and the travel times that start the march.
 *
 * The source may lie anywhere in the ground, not only on a node. The active corners of the
 * cell that holds it get straight-ray times, T = r · (s_source + s_corner)/2 (trapezoid rule on
 * the straight segment, which is exact in a uniform cell). Every later node is solved in
 * factored form, T = τ · s₀ · r (fmm.ts), which removes the point-source singularity:
 * Fomel, Luo & Zhao (2009), "Fast sweeping method for the factored eikonal equation",
 * J. Comput. Phys. 228, 6440–6455; in a fast-marching order as Treister & Haber (2016),
 * "A fast marching algorithm for the factored eikonal equation", J. Comput. Phys. 324, 210–225.
 *
 * On sloping ground a ground node beside the source can be nearer to it than any of its ground
 * neighbours (the next node up the slope, with air on the source's side): the march, which only
 * moves outward from earlier nodes, would reach it late (measured: 0.45 ms late at 0.5 m on a
 * 10° slope). So every ground node next to the air within four cells of the source that sees it
 * through the ground also starts with its straight-ray time.
 */
import { type Grid, nodeX, nodeZ } from '../grid';
import { EikonalInputError } from './errors';
import type { Point } from './types';

export interface SourceCell {
  /** Lower-left index of the cell holding the source (ix, iz of its upper-left node). */
  cx: number;
  cz: number;
  /** Fractional position inside that cell, 0..1 in x and in iz. */
  ux: number;
  uz: number;
}

const EDGE_TOLERANCE = 1e-9; // in cells: a source on the grid border counts as inside

export function locateSourceCell(grid: Grid, active: Uint8Array, source: Point): SourceCell {
  const { x0, dx, nx, z0, dz, nz } = grid;
  const fx = (source.x - x0) / dx;
  const fz = (z0 - source.z) / dz;
  if (!(fx >= -EDGE_TOLERANCE && fx <= nx - 1 + EDGE_TOLERANCE && fz >= -EDGE_TOLERANCE && fz <= nz - 1 + EDGE_TOLERANCE)) {
    throw new EikonalInputError(
      `source at x ${source.x} m, z ${source.z} m is outside the model grid ` +
        `(x ${x0} to ${nodeX(grid, nx - 1)} m, z ${nodeZ(grid, nz - 1)} to ${z0} m)`,
    );
  }
  const cx = Math.min(nx - 2, Math.max(0, Math.floor(fx)));
  const cz = Math.min(nz - 2, Math.max(0, Math.floor(fz)));
  const i = cz * nx + cx;
  if (!active[i] && !active[i + 1] && !active[i + nx] && !active[i + nx + 1]) {
    throw new EikonalInputError(`source at x ${source.x} m, z ${source.z} m is in the air, above the ground surface`);
  }
  return { cx, cz, ux: Math.min(1, Math.max(0, fx - cx)), uz: Math.min(1, Math.max(0, fz - cz)) };
}

export interface SourceStart {
  /** Node indices given a starting time (active corners of the source cell). */
  nodes: number[];
  times: number[];
  /** Slowness at the source point (s/m), bilinear over the active corners. */
  slowness: number;
  /**
   * Velocity gradient across the source cell (1/s; x, and z as elevation), or 0 when the cell
   * touches air or straddles a contrast (no smooth local medium to describe).
   */
  gradX: number;
  gradZ: number;
}

/** Straight-ray times to the active corners of the source cell. `slowness` is per node (s/m). */
export function startTimes(grid: Grid, slowness: Float64Array, active: Uint8Array, source: Point, contrastRatio: number, nearSurface = true): SourceStart {
  const { cx, cz, ux, uz } = locateSourceCell(grid, active, source);
  const nx = grid.nx;
  const base = cz * nx + cx;
  const corners = [base, base + 1, base + nx, base + nx + 1];
  const weights = [(1 - ux) * (1 - uz), ux * (1 - uz), (1 - ux) * uz, ux * uz];
  let sw = 0;
  let ss = 0;
  for (let k = 0; k < 4; k++) {
    if (!active[corners[k]]) continue;
    sw += weights[k];
    ss += weights[k] * slowness[corners[k]];
  }
  // A source exactly on an air corner's side of a cell: fall back to the plain mean of the ground corners.
  let s0 = sw > 1e-12 ? ss / sw : NaN;
  if (!(s0 > 0)) {
    let cnt = 0;
    ss = 0;
    for (const c of corners) if (active[c]) (ss += slowness[c]), cnt++;
    s0 = ss / cnt;
  }
  const nodes: number[] = [];
  const times: number[] = [];
  for (const c of corners) {
    if (!active[c]) continue;
    const ix = c % nx;
    const iz = (c - ix) / nx;
    const r = Math.hypot(nodeX(grid, ix) - source.x, nodeZ(grid, iz) - source.z);
    nodes.push(c);
    times.push((r * (s0 + slowness[c])) / 2);
  }
  if (nearSurface) addSurfaceNeighbours(grid, slowness, active, source, s0, nodes, times);
  let gradX = 0;
  let gradZ = 0;
  if (corners.every((c) => active[c])) {
    const [s00, s10, s01, s11] = corners.map((c) => slowness[c]);
    const lo = Math.min(s00, s10, s01, s11);
    const hi = Math.max(s00, s10, s01, s11);
    if (hi <= lo * contrastRatio) {
      gradX = (1 / s10 - 1 / s00 + 1 / s11 - 1 / s01) / (2 * grid.dx);
      gradZ = -(1 / s01 - 1 / s00 + 1 / s11 - 1 / s10) / (2 * grid.dz); // rows go down; z is up
    }
  }
  return { nodes, times, slowness: s0, gradX, gradZ };
}

/** Ground nodes next to the air within four cells of the source that see it through the ground: straight-ray times. */
function addSurfaceNeighbours(grid: Grid, slowness: Float64Array, active: Uint8Array, source: Point, s0: number, nodes: number[], times: number[]): void {
  const { nx, nz, dx, dz } = grid;
  const reach = 4 * Math.max(dx, dz);
  const cx = Math.round((source.x - grid.x0) / dx);
  const cz = Math.round((grid.z0 - source.z) / dz);
  const top = new Map<number, number>(); // column → elevation of its top ground node
  const topOf = (ix: number): number => {
    let z = top.get(ix);
    if (z === undefined) {
      let iz = 0;
      while (iz < nz && !active[iz * nx + ix]) iz++;
      z = iz < nz ? nodeZ(grid, iz) : -Infinity;
      top.set(ix, z);
    }
    return z;
  };
  // A point is in the ground when it lies no higher than a cell above the top ground nodes on either side of it.
  const inGround = (x: number, z: number): boolean => {
    const f = (x - grid.x0) / dx;
    const a = Math.max(0, Math.min(nx - 1, Math.floor(f))), b = Math.max(0, Math.min(nx - 1, Math.ceil(f)));
    return z <= Math.min(topOf(a), topOf(b)) + dz + 1e-9;
  };
  for (let iz = Math.max(0, cz - 4); iz <= Math.min(nz - 1, cz + 4); iz++) {
    for (let ix = Math.max(0, cx - 4); ix <= Math.min(nx - 1, cx + 4); ix++) {
      const c = iz * nx + ix;
      if (!active[c] || nodes.includes(c)) continue;
      const nextToAir = (ix > 0 && !active[c - 1]) || (ix < nx - 1 && !active[c + 1]) || (iz > 0 && !active[c - nx]) || iz === 0;
      if (!nextToAir) continue;
      const x = nodeX(grid, ix), z = nodeZ(grid, iz);
      const r = Math.hypot(x - source.x, z - source.z);
      if (r > reach) continue;
      let seen = true;
      for (let k = 1; k < 8 && seen; k++) seen = inGround(source.x + ((x - source.x) * k) / 8, source.z + ((z - source.z) * k) / 8);
      if (!seen) continue;
      nodes.push(c);
      times.push((r * (s0 + slowness[c])) / 2);
    }
  }
}
