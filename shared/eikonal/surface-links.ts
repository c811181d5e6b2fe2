/**
 * Straight links along the ground surface (issue 14). Ground nodes under topography form a
 * staircase, and a wave that runs round a valley bottom or a hill foot follows it, late by up to
 * a cell. After a node p near the surface is accepted, each other node q near the surface within
 * LINK_RADIUS cells that p sees through ground of one slowness gets the candidate
 * T_p + |pq|·s — the shortest-path (graph) update of Moser (1991), "Shortest path calculation of
 * seismic rays", Geophysics 56, 59–67 (from memory), used only in the band next to the surface.
 * A candidate is always causal (≥ T_p) and an upper bound on the true time (a real ground path).
 */
import type { Grid } from '../grid';
import type { KernelHeap } from './kernel';
import { DONE, FAR, KIND, PROVISIONAL, TRIAL } from './node-state';
import { segmentInGround, uniformAlong } from './surface-start';
import type { Point } from './types';

export const LINK_RADIUS = 8; // cells (measured: 4 → hill max 0.07 ms, 6 → 0.04, 8 → 0.024)
const BAND = 3; // cells: a node this close to an air node is "near the surface"

/** The march's node arrays and heap (node-state.ts, kernel.ts), and what the links need of the scheme. */
export interface LinkState {
  F: Float64Array;
  state: Uint8Array;
  safe: Float64Array;
  heap: KernelHeap;
  xs: number;
  zs: number;
  factored: boolean;
}

export function surfaceLinks(grid: Grid, slowness: Float64Array, active: Uint8Array, surface: readonly Point[], st: LinkState): ((p: number) => void) | undefined {
  const { nx, nz, x0, dx, z0, dz } = grid;
  const near = new Uint8Array(nx * nz);
  let any = false;
  for (let iz = 0; iz < nz; iz++) for (let ix = 0; ix < nx; ix++) {
    if (active[iz * nx + ix]) continue;
    for (let jz = Math.max(0, iz - BAND); jz <= Math.min(nz - 1, iz + BAND); jz++)
      for (let jx = Math.max(0, ix - BAND); jx <= Math.min(nx - 1, ix + BAND); jx++)
        if (active[jz * nx + jx]) (near[jz * nx + jx] = 1), (any = true);
  }
  if (!any) return undefined;
  const stride = nx + 2;
  return (pb: number) => {
    const { F, state, heap, safe, xs, zs, factored } = st;
    const row = Math.floor((pb + 0.5) / stride);
    const piz = row - 1;
    const pix = pb - row * stride - 1;
    if (!near[piz * nx + pix]) return;
    const sp = slowness[piz * nx + pix];
    const P = { x: x0 + pix * dx, z: z0 - piz * dz };
    const Tp = F[3 * pb];
    for (let qiz = Math.max(0, piz - LINK_RADIUS); qiz <= Math.min(nz - 1, piz + LINK_RADIUS); qiz++) {
      for (let qix = Math.max(0, pix - LINK_RADIUS); qix <= Math.min(nx - 1, pix + LINK_RADIUS); qix++) {
        const qi = qiz * nx + qix;
        if (!near[qi] || (Math.abs(qix - pix) <= 1 && Math.abs(qiz - piz) <= 1)) continue; // neighbours: the march's own stencil
        if (slowness[qi] !== sp) continue; // cheap first test of "one slowness" (uniformAlong checks the whole segment)
        const qb = (qiz + 1) * stride + qix + 1;
        const kind = state[qb] & KIND;
        if (kind === DONE || kind > DONE) continue;
        const Q = { x: x0 + qix * dx, z: z0 - qiz * dz };
        const t = Tp + Math.hypot(Q.x - P.x, Q.z - P.z) * sp;
        if (!(t < F[3 * qb]) && (state[qb] & PROVISIONAL) === 0) continue;
        if (!segmentInGround(surface, P, Q) || !uniformAlong(grid, slowness, active, P, Q, sp)) continue;
        if (kind === FAR && factored) F[3 * qb + 1] = Math.hypot(Q.x - xs, Q.z - zs);
        let st2 = state[qb];
        let key = F[3 * qb];
        if ((st2 & PROVISIONAL) !== 0) {
          if (t < safe[qb]) safe[qb] = t;
          if (t <= key) (key = t), (st2 &= ~PROVISIONAL);
        } else if (t < key) key = t;
        if (key !== F[3 * qb]) {
          F[3 * qb] = key;
          heap.update(qb, key);
        }
        state[qb] = (st2 & ~KIND) | TRIAL;
      }
    }
  };
}
