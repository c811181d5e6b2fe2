/**
 * Fast marching for |∇T| = s (s = 1/v) on the node grid, first-order upwind or mixed second
 * order, with the factored source treatment (source.ts) and cell slownesses at contrasts
 * (cells.ts). Nodes are accepted in time order from an indexed heap (heap.ts); each newly
 * accepted node updates its four neighbours with the candidates that involve it: the edge
 * towards it (one axis) and the two cells on either side (two axes); a node keeps the least
 * causal candidate. Sethian (1999), "Level Set Methods and Fast Marching Methods", ch. 8.
 *
 * Mixed second order: an axis uses the second-order difference when the next node beyond the
 * neighbour is accepted, earlier than the neighbour, and no contrast lies along the three
 * nodes; otherwise first order (Rickett & Fomel 1999, SEP Report 100).
 */
import type { Grid } from '../grid';
import { cellSlowness, type CellSlowness, CONTRAST_RATIO, DEFAULT_INTERFACE_RULE, type InterfaceRule } from './cells';
import { IndexedMinHeap } from './heap';
import { startTimes } from './source';
import { solveOneAxis, solveTwoAxes } from './stencil';
import type { Point, SolveOptions, VelocityField } from './types';
import { validateSolveInput } from './validate';

/** Knobs beyond the public options, for the benchmark's measurements. Defaults are the chosen ones. */
export interface MarchOptions extends SolveOptions {
  /** Factored (source-singularity-free) updates; false = plain scheme with the same start. */
  factored?: boolean;
  rule?: InterfaceRule;
  contrastRatio?: number;
  /** Radius (m) around the source inside which one-axis updates keep the factored source term. */
  tauRadius?: number;
}

/** Default of MarchOptions.tauRadius: a few metres, fixed in metres so it does not shrink with the grid. */
export const TAU_RADIUS_M = 1000;

const DONE = 2;
const AIR = 3;
const TRIAL = 1;

/**
 * Reusable solver for one grid: keeps its buffers between shots so a line of many shots
 * allocates once. Not safe to share between threads (each worker makes its own).
 */
export class TravelTimeSolver {
  readonly grid: Grid;
  private slow: Float64Array;
  private u: Float64Array;
  private state: Uint8Array;
  private heap: IndexedMinHeap;
  private cells: CellSlowness | undefined;

  constructor(grid: Grid) {
    this.grid = { ...grid };
    const n = grid.nx * grid.nz;
    this.slow = new Float64Array(n);
    this.u = new Float64Array(n);
    this.state = new Uint8Array(n);
    this.heap = new IndexedMinHeap(n);
  }

  /** Travel times (s) from `source`; Infinity at air nodes and ground not connected to the source. */
  solve(velocity: VelocityField, active: Uint8Array, source: Point, options: MarchOptions = {}, out?: Float64Array): Float64Array {
    const grid = this.grid;
    validateSolveInput(grid, velocity, active, source);
    const { nx, nz, dx, dz, x0, z0 } = grid;
    const n = nx * nz;
    const order = options.order ?? 2;
    const factored = options.factored ?? true;
    const ratio = options.contrastRatio ?? CONTRAST_RATIO;
    const T = out && out.length === n ? out : new Float64Array(n);
    const S = this.slow;
    const U = this.u;
    const state = this.state;
    for (let i = 0; i < n; i++) {
      S[i] = active[i] ? 1 / velocity[i] : Infinity;
      state[i] = active[i] ? 0 : AIR;
    }
    T.fill(Infinity);
    this.cells = cellSlowness(grid, S, active, options.rule ?? DEFAULT_INTERFACE_RULE, ratio, this.cells);
    const cellS = this.cells.value;
    const cellC = this.cells.contrast;
    const ncx = nx - 1;
    const heap = this.heap;
    heap.clear();

    const xs = source.x;
    const zs = source.z;
    const start = startTimes(grid, S, active, source);
    for (let k = 0; k < start.nodes.length; k++) {
      const i = start.nodes[k];
      T[i] = start.times[k];
      heap.pushOrDecrease(i, T[i]);
      state[i] = TRIAL;
    }
    const s0 = start.slowness;
    const second = order === 2;
    const halfDx = factored ? 0.5 * dx * (1 + 1e-9) : -1;
    const halfDz = factored ? 0.5 * dz * (1 + 1e-9) : -1;

    // Axis coefficients (α, β) of neighbour nb of node q, written to ca/cb. nb2 = node beyond nb or −1.
    let ca = 0;
    let cb = 0;
    const axis = (nb: number, nb2: number, d: number, eTerm: number, rq: number, sq: number): void => {
      if (second && nb2 >= 0 && state[nb2] === DONE && T[nb2] <= T[nb]) {
        const s1 = S[nb];
        const s2 = S[nb2];
        const lo = Math.min(sq, s1, s2);
        const hi = Math.max(sq, s1, s2);
        if (hi <= lo * ratio) {
          ca = eTerm + 1.5 / d;
          cb = (rq * (2 * U[nb] - 0.5 * U[nb2])) / d;
          return;
        }
      }
      ca = eTerm + 1 / d;
      cb = (rq * U[nb]) / d;
    };

    while (heap.size > 0) {
      const p = heap.pop();
      state[p] = DONE;
      const pix = p % nx;
      const piz = (p - pix) / nx;
      if (factored) {
        const r = Math.hypot(x0 + pix * dx - xs, z0 - piz * dz - zs);
        U[p] = r > 0 ? T[p] / r : s0;
      } else {
        U[p] = T[p];
      }
      const Tp = T[p];
      for (let dir = 0; dir < 4; dir++) {
        // Neighbour q of p; `alongX` when q and p share a row.
        let qix = pix;
        let qiz = piz;
        if (dir === 0) qix--;
        else if (dir === 1) qix++;
        else if (dir === 2) qiz--;
        else qiz++;
        if (qix < 0 || qix >= nx || qiz < 0 || qiz >= nz) continue;
        const q = qiz * nx + qix;
        const st = state[q];
        if (st === DONE || st === AIR) continue;
        const alongX = dir < 2;
        const xq = x0 + qix * dx;
        const zq = z0 - qiz * dz;
        let rq = 1;
        let ex = 0;
        let ez = 0;
        if (factored) {
          const ox = xq - xs;
          const oz = zq - zs;
          rq = Math.sqrt(ox * ox + oz * oz);
          const inv2 = 1 / (rq * rq);
          ex = ox * inv2;
          ez = oz * inv2;
        }
        const sq = S[q];
        const step = p - q; // index offset from q to p
        const pBeyond = alongX ? (pix + (pix - qix) >= 0 && pix + (pix - qix) < nx ? p + step : -1) : piz + (piz - qiz) >= 0 && piz + (piz - qiz) < nz ? p + step : -1;
        // Signed spacing q − p along the axis (z is elevation: a deeper row is lower).
        const dP = alongX ? (qix - pix) * dx : (piz - qiz) * dz;
        axis(p, pBeyond, dP, alongX ? ex : ez, rq, sq);
        const aP = ca;
        const bP = cb;

        // Edge candidate (one axis), slowness of the faster side when a contrast cell borders the edge.
        let sEdge = sq;
        if (alongX) {
          const cx = qix < pix ? qix : pix;
          const cUp = qiz > 0 ? (qiz - 1) * ncx + cx : -1;
          const cDn = qiz < nz - 1 ? qiz * ncx + cx : -1;
          if ((cUp >= 0 && cellC[cUp]) || (cDn >= 0 && cellC[cDn])) {
            sEdge = Math.min(cUp >= 0 ? cellS[cUp] : Infinity, cDn >= 0 ? cellS[cDn] : Infinity);
          }
        } else {
          const cz = qiz < piz ? qiz : piz;
          const cL = qix > 0 ? cz * ncx + qix - 1 : -1;
          const cR = qix < nx - 1 ? cz * ncx + qix : -1;
          if ((cL >= 0 && cellC[cL]) || (cR >= 0 && cellC[cR])) {
            sEdge = Math.min(cL >= 0 ? cellS[cL] : Infinity, cR >= 0 ? cellS[cR] : Infinity);
          }
        }
        // One-axis candidate. A node within half a cell of the grid line through the source has no
        // upwind neighbour across that line (the line is nearer the source than either), so the
        // missing axis keeps the factored source term with ∂τ taken as 0 — exact in uniform ground.
        // Elsewhere the plain update (∂T = 0 across) is used: it never undershoots, and along a
        // refractor edge it is the head wave's own update.
        const nearAxis = alongX ? Math.abs(zq - zs) <= halfDz : Math.abs(xq - xs) <= halfDx;
        let best = sEdge === sq && nearAxis ? solveTwoAxes(aP, bP, alongX ? ez : ex, 0, sEdge) : solveOneAxis(aP, bP, sEdge);
        if (!(best >= Tp)) best = Tp + sEdge * (alongX ? dx : dz);

        // Cell candidates (two axes): p with each accepted perpendicular neighbour b of q.
        for (let side = -1; side <= 1; side += 2) {
          let b: number;
          let bBeyond: number;
          let dB: number;
          let cell: number;
          if (alongX) {
            const biz = qiz + side;
            if (biz < 0 || biz >= nz) continue;
            b = q + side * nx;
            if (state[b] !== DONE) continue;
            const b2z = biz + side;
            bBeyond = b2z >= 0 && b2z < nz ? b + side * nx : -1;
            dB = side * dz; // q − b in elevation: b deeper (side +1) means q is higher
            cell = (side < 0 ? biz : qiz) * ncx + (qix < pix ? qix : pix);
          } else {
            const bix = qix + side;
            if (bix < 0 || bix >= nx) continue;
            b = q + side;
            if (state[b] !== DONE) continue;
            const b2x = bix + side;
            bBeyond = b2x >= 0 && b2x < nx ? b + side : -1;
            dB = -side * dx;
            cell = (qiz < piz ? qiz : piz) * ncx + (side < 0 ? bix : qix);
          }
          axis(b, bBeyond, dB, alongX ? ez : ex, rq, sq);
          const sCell = cellC[cell] ? cellS[cell] : sq;
          const t = alongX ? solveTwoAxes(aP, bP, ca, cb, sCell) : solveTwoAxes(ca, cb, aP, bP, sCell);
          if (t < best && t >= Tp && t >= T[b]) best = t;
        }

        if (best < T[q]) {
          T[q] = best;
          heap.pushOrDecrease(q, best);
          if (st !== TRIAL) state[q] = TRIAL;
        }
      }
    }
    return T;
  }
}

/** Travel times (s) from `source` on `grid`; Infinity at air nodes. Throws EikonalInputError on bad input. */
export function solveTravelTimes(
  grid: Grid,
  velocity: VelocityField,
  active: Uint8Array,
  source: Point,
  options?: SolveOptions,
): Float64Array {
  return new TravelTimeSolver(grid).solve(velocity, active, source, options);
}
