/**
 * A plain fast-marching solver kept only as a yardstick for the benchmark: first-order upwind
 * update from the least accepted neighbour on each axis, indexed binary heap, source on a node
 * (Sethian 1999, "Level Set Methods and Fast Marching Methods", ch. 8). It has none of the
 * engine's accuracy features, so its times are not compared with anything; timed in the same
 * process beside the engine, it turns a wall time on a noisy machine into a stable cost ratio.
 */
import type { Grid } from '../../shared/grid';
import { IndexedMinHeap } from './plain-heap';

const DONE = 2;

export class PlainMarcher {
  private readonly T: Float64Array;
  private readonly S: Float64Array;
  private readonly state: Uint8Array;
  private readonly heap: IndexedMinHeap;

  constructor(private readonly grid: Grid, velocity: Float32Array) {
    const n = grid.nx * grid.nz;
    this.T = new Float64Array(n);
    this.S = new Float64Array(n);
    for (let i = 0; i < n; i++) this.S[i] = 1 / velocity[i];
    this.state = new Uint8Array(n);
    this.heap = new IndexedMinHeap(n);
  }

  /** Travel times from node `source` (square cells assumed, as in the benchmark grids). */
  solve(source: number): Float64Array {
    const { nx, nz } = this.grid;
    const { T, state, heap } = this;
    T.fill(Infinity);
    state.fill(0);
    heap.clear();
    T[source] = 0;
    heap.pushOrDecrease(source, 0);
    while (heap.size > 0) {
      const p = heap.pop();
      state[p] = DONE;
      const iz = Math.floor((p + 0.5) / nx);
      const ix = p - iz * nx;
      for (let d = 0; d < 4; d++) {
        const q = d === 0 ? (ix > 0 ? p - 1 : -1) : d === 1 ? (ix < nx - 1 ? p + 1 : -1) : d === 2 ? (iz > 0 ? p - nx : -1) : iz < nz - 1 ? p + nx : -1;
        if (q < 0 || state[q] === DONE) continue;
        const t = this.update(q);
        if (t < T[q]) {
          T[q] = t;
          heap.pushOrDecrease(q, t);
        }
      }
    }
    return T;
  }

  private update(q: number): number {
    const { nx, nz, dx: h } = this.grid;
    const { T, S, state } = this;
    const iz = Math.floor((q + 0.5) / nx);
    const ix = q - iz * nx;
    let a = Infinity;
    let b = Infinity;
    if (ix > 0 && state[q - 1] === DONE) a = T[q - 1];
    if (ix < nx - 1 && state[q + 1] === DONE && T[q + 1] < a) a = T[q + 1];
    if (iz > 0 && state[q - nx] === DONE) b = T[q - nx];
    if (iz < nz - 1 && state[q + nx] === DONE && T[q + nx] < b) b = T[q + nx];
    const s = S[q] * h;
    const lo = a < b ? a : b;
    const hi = a < b ? b : a;
    if (hi - lo >= s) return lo + s;
    return 0.5 * (lo + hi + Math.sqrt(2 * s * s - (hi - lo) * (hi - lo)));
  }
}
