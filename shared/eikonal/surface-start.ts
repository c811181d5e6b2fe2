/**
 * Straight-ray start region that follows the ground surface (issue 14). Next to a shot on
 * sloping ground the nodes just under the surface are reached through the staircase of ground
 * nodes, which runs late by up to a cell's travel time. When the solve is given the surface,
 * every ground node within START_RADIUS cells whose straight segment to the source stays in the
 * ground (never through air) and crosses only the source's own slowness gets the exact straight
 * time r·s₀. In ground of one velocity that is exact (Fermat); anywhere else the node keeps the
 * march's time. A surface-following start region: common practice, no single source.
 */
import type { Grid } from '../grid';
import type { Point } from './types';

/** Radius of the start region, in cells: wide enough that the geophones of a 1–5 m spread on 0.5 m cells sit inside it with their interpolation stencils. */
export const START_RADIUS = 14;
const EPS = 1e-9; // m
const SAME = 1e-9; // relative slowness difference still counted as the same medium

function surfaceAt(s: readonly Point[], x: number): number {
  let lo = 0;
  let hi = s.length - 1;
  if (x <= s[0].x) return s[0].z;
  if (x >= s[hi].x) return s[hi].z;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (s[mid].x <= x) lo = mid;
    else hi = mid;
  }
  return s[lo].z + ((x - s[lo].x) / (s[hi].x - s[lo].x)) * (s[hi].z - s[lo].z);
}

/** Index of the first vertex with x > `x` (binary search; the polyline is sorted in x). */
function firstAfter(s: readonly Point[], x: number): number {
  let lo = 0;
  let hi = s.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (s[mid].x <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** The segment a–b lies at or under the surface polyline (surface minus segment is linear between vertices). */
export function segmentInGround(s: readonly Point[], a: Point, b: Point): boolean {
  if (a.z > surfaceAt(s, a.x) + EPS || b.z > surfaceAt(s, b.x) + EPS) return false;
  const l = a.x <= b.x ? a : b;
  const r = a.x <= b.x ? b : a;
  for (let k = firstAfter(s, l.x); k < s.length && s[k].x < r.x; k++) {
    const v = s[k];
    if (l.z + ((v.x - l.x) / (r.x - l.x)) * (r.z - l.z) > v.z + EPS) return false;
  }
  return true;
}

/** Every node the segment passes within a cell of has the source's slowness (ground, same medium). */
export function uniformAlong(grid: Grid, slowness: Float64Array, active: Uint8Array, a: Point, b: Point, s0: number): boolean {
  const { x0, dx, nx, z0, dz, nz } = grid;
  const steps = Math.ceil(2 * Math.max(Math.abs(b.x - a.x) / dx, Math.abs(b.z - a.z) / dz)) + 1;
  for (let k = 0; k <= steps; k++) {
    const u = k / steps;
    const fx = (a.x + u * (b.x - a.x) - x0) / dx;
    const fz = (z0 - (a.z + u * (b.z - a.z))) / dz;
    const cx = Math.min(nx - 2, Math.max(0, Math.floor(fx)));
    const cz = Math.min(nz - 2, Math.max(0, Math.floor(fz)));
    for (let j = 0; j < 4; j++) {
      const i = (cz + (j >> 1)) * nx + cx + (j & 1);
      if (active[i] && Math.abs(slowness[i] - s0) > SAME * s0) return false;
    }
  }
  return true;
}

/** Ground nodes near the source with exact straight-ray times (node index, time). */
export function surfaceStart(grid: Grid, slowness: Float64Array, active: Uint8Array, source: Point, s0: number, surface: readonly Point[]): { nodes: number[]; times: number[] } {
  const { x0, dx, nx, z0, dz, nz } = grid;
  const nodes: number[] = [];
  const times: number[] = [];
  if (surface.length < 2) return { nodes, times };
  const R = START_RADIUS * Math.max(dx, dz);
  const ixLo = Math.max(0, Math.floor((source.x - R - x0) / dx));
  const ixHi = Math.min(nx - 1, Math.ceil((source.x + R - x0) / dx));
  const izLo = Math.max(0, Math.floor((z0 - source.z - R) / dz));
  const izHi = Math.min(nz - 1, Math.ceil((z0 - source.z + R) / dz));
  for (let iz = izLo; iz <= izHi; iz++) {
    for (let ix = ixLo; ix <= ixHi; ix++) {
      const i = iz * nx + ix;
      if (!active[i]) continue;
      const p = { x: x0 + ix * dx, z: z0 - iz * dz };
      const r = Math.hypot(p.x - source.x, p.z - source.z);
      if (r > R || !segmentInGround(surface, source, p) || !uniformAlong(grid, slowness, active, source, p, s0)) continue;
      nodes.push(i);
      times.push(r * s0);
    }
  }
  return { nodes, times };
}
