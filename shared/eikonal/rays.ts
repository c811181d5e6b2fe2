/**
 * Ray from a receiver back to the source by steepest descent of the travel-time field.
 *
 * Rays are the characteristics of the eikonal equation and run along −∇T back to the source
 * (Sethian 1999, "Level Set Methods and Fast Marching Methods", §8.5 "back-propagation").
 * The path is stepped cell by cell: inside a cell the direction is −∇ of the bilinear
 * interpolant at the current point, re-evaluated every half cell and clipped at the cell's
 * border. Where the flows on both sides of an edge point into the edge (a head wave riding a
 * refractor) the ray slides along the edge towards decreasing time, and that length is booked
 * to the faster of the two cells. Within one cell diagonal of the source it finishes with a
 * straight segment. Lengths are summed per cell; time = Σ length × cell slowness (cells.ts).
 */
import type { Grid } from '../grid';
import { cellSlowness, type CellSlowness } from './cells';
import { EikonalInputError } from './errors';
import { nodeGradient } from './gradient';
import { validateGrid } from './validate';
import type { Point, VelocityField } from './types';

export interface Ray {
  /** x, z pairs (m) from the receiver to the source. */
  points: Float64Array;
  /** Index cz·(nx−1)+cx of each crossed cell, in order of first crossing. */
  cells: Int32Array;
  /** Metres of ray in each of those cells. */
  lengths: Float64Array;
  /** Σ length × cell slowness (s). */
  time: number;
}

const EPS = 1e-9; // in cells
/** An interface edge is a head-wave conduit when time falls along it at ≥ this share of the fast side's slowness (cos 14°: dips to about 14°). */
const CONDUIT = 0.97;
/** Distance (cell diagonals) from the source within which a clean straight segment ends the ray. */
const NEAR_CELLS = 3;

interface Move {
  /** Direction in grid units per metre. */
  vx: number;
  vz: number;
  /** Metres to the border of the cell (or to the next node along an edge). */
  limit: number;
  /** Cell the length is booked to. */
  cell: number;
  /** Fall of time per metre. */
  rate: number;
  /** Interface edge carrying a head wave. */
  conduit: boolean;
}
const grad = { gx: 0, gd: 0 };

/** Reusable tracer for one model (cell slownesses computed once). */
export class RayTracer {
  private cells: CellSlowness;
  private partial: Uint8Array;

  constructor(
    readonly grid: Grid,
    velocity: VelocityField,
    readonly active: Uint8Array,
  ) {
    validateGrid(grid);
    const n = grid.nx * grid.nz;
    if (velocity.length !== n || active.length !== n) {
      throw new EikonalInputError(`velocity (${velocity.length}) and ground mask (${active.length}) must both have nx × nz = ${n} values`);
    }
    const s = new Float64Array(n);
    for (let i = 0; i < n; i++) s[i] = active[i] ? 1 / velocity[i] : Infinity;
    this.cells = cellSlowness(grid, s, active);
    // Cells with an air corner (along the ground surface).
    const ncx = grid.nx - 1;
    this.partial = new Uint8Array(ncx * (grid.nz - 1));
    for (let cz = 0; cz < grid.nz - 1; cz++) {
      for (let cx = 0; cx < ncx; cx++) {
        const i = cz * grid.nx + cx;
        this.partial[cz * ncx + cx] = active[i] && active[i + 1] && active[i + grid.nx] && active[i + grid.nx + 1] ? 0 : 1;
      }
    }
  }

  trace(times: Float64Array, receiver: Point, source: Point): Ray {
    const g = this.grid;
    const { x0, dx, nx, z0, dz, nz } = g;
    if (times.length !== nx * nz) throw new EikonalInputError(`travel-time field has ${times.length} values; the grid needs ${nx * nz}`);
    const toFx = (x: number): number => (x - x0) / dx;
    const toFz = (z: number): number => (z0 - z) / dz;
    const inside = (fx: number, fz: number): boolean => fx >= -EPS && fx <= nx - 1 + EPS && fz >= -EPS && fz <= nz - 1 + EPS;
    let fx = toFx(receiver.x);
    let fz = toFz(receiver.z);
    const sfx = toFx(source.x);
    const sfz = toFz(source.z);
    if (!inside(fx, fz)) throw new EikonalInputError(`receiver at x ${receiver.x} m, z ${receiver.z} m is outside the model grid`);
    if (!inside(sfx, sfz)) throw new EikonalInputError(`source at x ${source.x} m, z ${source.z} m is outside the model grid`);
    fx = clamp(fx, 0, nx - 1);
    fz = clamp(fz, 0, nz - 1);

    const pts: number[] = [receiver.x, receiver.z];
    const perCell = new Map<number, number>();
    const book = (cell: number, len: number): void => {
      if (len > 0) perCell.set(cell, (perCell.get(cell) ?? 0) + len);
    };
    // Finish straight within one cell diagonal of the source, or within NEAR_CELLS diagonals when
    // the straight segment crosses only smooth ground cells (there the field is the source's own
    // cone, whose bilinear gradient is poorest right next to the source).
    const diag = Math.hypot(dx, dz);
    const finish = diag * 1.01;
    const maxStep = 0.5; // cells
    const maxSteps = 20 * (nx + nz) + 100;
    const T = times;

    let steps = 0;
    while (steps++ < maxSteps) {
      const dist = Math.hypot((fx - sfx) * dx, (fz - sfz) * dz);
      if (dist <= finish || (dist <= NEAR_CELLS * diag && this.smoothStraight(fx, fz, sfx, sfz))) break;
      const move = this.chooseMove(T, fx, fz);
      if (!move) break; // no descent (bottom of the discrete field): finish straight
      const len = Math.min(move.limit, maxStep * Math.min(dx, dz));
      if (!(len > 1e-12 * Math.min(dx, dz))) break;
      let nfx = fx + move.vx * len;
      let nfz = fz + move.vz * len;
      // Snap onto a grid line when we reached the border (keeps later cell look-ups exact).
      if (len === move.limit) {
        if (Math.abs(nfx - Math.round(nfx)) < 1e-7) nfx = Math.round(nfx);
        if (Math.abs(nfz - Math.round(nfz)) < 1e-7) nfz = Math.round(nfz);
      }
      nfx = clamp(nfx, 0, nx - 1);
      nfz = clamp(nfz, 0, nz - 1);
      book(move.cell, Math.hypot((nfx - fx) * dx, (nfz - fz) * dz));
      fx = nfx;
      fz = nfz;
      pts.push(x0 + fx * dx, z0 - fz * dz);
    }
    this.straight(fx, fz, sfx, sfz, book);
    pts.push(source.x, source.z);

    const cells = Int32Array.from(perCell.keys());
    const lengths = Float64Array.from(perCell.values());
    let time = 0;
    for (let k = 0; k < cells.length; k++) time += lengths[k] * this.cells.value[cells[k]];
    return { points: Float64Array.from(pts), cells, lengths, time };
  }

  /**
   * Best descent move from (fx, fz). First a refractor edge along which time falls at the
   * faster side's slowness (a head wave rides it, whatever the half-cell-wide cells beside it
   * say); then the steepest move into a touching cell; then the steepest fall along an edge.
   */
  private chooseMove(T: Float64Array, fx: number, fz: number): Move | null {
    const { nx, nz, dx, dz } = this.grid;
    const ncx = nx - 1;
    const onX = Math.abs(fx - Math.round(fx)) < EPS;
    const onZ = Math.abs(fz - Math.round(fz)) < EPS;
    const edges = this.edgeMoves(T, fx, fz, onX, onZ);
    let best: Move | null = null;
    for (const e of edges) if (e.conduit && (!best || e.rate > best.rate)) best = e;
    if (best) return best;

    // Candidate cells: the one containing the point, or both sides of a grid line it sits on.
    const cx0 = onX ? Math.round(fx) - 1 : Math.floor(fx);
    const cx1 = onX ? cx0 + 1 : cx0;
    const cz0 = onZ ? Math.round(fz) - 1 : Math.floor(fz);
    const cz1 = onZ ? cz0 + 1 : cz0;
    for (let cz = cz0; cz <= cz1; cz++) {
      if (cz < 0 || cz > nz - 2) continue;
      for (let cx = cx0; cx <= cx1; cx++) {
        if (cx < 0 || cx > nx - 2) continue;
        const ux = clamp(fx - cx, 0, 1);
        const uz = clamp(fz - cz, 0, 1);
        if (!this.cellGradient(T, cx, cz, ux, uz)) continue;
        const gl = Math.hypot(grad.gx, grad.gd);
        if (!(gl > 0)) continue;
        const vx = -grad.gx / gl / dx; // grid units per metre
        const vz = -grad.gd / gl / dz;
        if ((ux <= EPS && vx < 0) || (ux >= 1 - EPS && vx > 0) || (uz <= EPS && vz < 0) || (uz >= 1 - EPS && vz > 0)) continue;
        const limit = Math.min(exitLength(ux, vx), exitLength(uz, vz));
        if (!(limit > 0)) continue;
        if (!best || gl > best.rate) best = { vx, vz, limit, cell: cz * ncx + cx, rate: gl, conduit: false };
      }
    }
    if (best) return best;
    for (const e of edges) if (e.rate > 0 && (!best || e.rate > best.rate)) best = e;
    return best;
  }

  /** Moves along the grid lines through (fx, fz), towards the next node each way. */
  private edgeMoves(T: Float64Array, fx: number, fz: number, onX: boolean, onZ: boolean): Move[] {
    const { nx, nz, dx, dz } = this.grid;
    const ncx = nx - 1;
    const moves: Move[] = [];
    if (onZ) {
      const iz = Math.round(fz);
      for (let sgn = -1; sgn <= 1; sgn += 2) {
        const ixa = sgn < 0 ? Math.ceil(fx - EPS) - 1 : Math.floor(fx + EPS) + 1; // next node that way
        if (ixa < 0 || ixa > nx - 1) continue;
        const ixb = ixa - sgn;
        const cx = Math.min(ixa, ixb);
        this.addEdgeMove(moves, T[iz * nx + ixa], T[iz * nx + ixb], dx, sgn / dx, 0, Math.abs(ixa - fx) * dx, iz > 0 ? (iz - 1) * ncx + cx : -1, iz < nz - 1 ? iz * ncx + cx : -1);
      }
    }
    if (onX) {
      const ix = Math.round(fx);
      for (let sgn = -1; sgn <= 1; sgn += 2) {
        const iza = sgn < 0 ? Math.ceil(fz - EPS) - 1 : Math.floor(fz + EPS) + 1;
        if (iza < 0 || iza > nz - 1) continue;
        const izb = iza - sgn;
        const cz = Math.min(iza, izb);
        this.addEdgeMove(moves, T[iza * nx + ix], T[izb * nx + ix], dz, 0, sgn / dz, Math.abs(iza - fz) * dz, ix > 0 ? cz * ncx + ix - 1 : -1, ix < nx - 1 ? cz * ncx + ix : -1);
      }
    }
    return moves;
  }

  /** The move from b towards a along an edge of length h between cells c1 and c2 (−1: none). */
  private addEdgeMove(moves: Move[], ta: number, tb: number, h: number, vx: number, vz: number, limit: number, c1: number, c2: number): void {
    if (!Number.isFinite(ta) || !Number.isFinite(tb) || !(limit > 0)) return;
    const rate = (tb - ta) / h; // fall of time per metre towards a
    const contrast = (c1 >= 0 && this.cells.contrast[c1] !== 0) || (c2 >= 0 && this.cells.contrast[c2] !== 0);
    const cell = this.fasterCell(c1, c2);
    const conduit = contrast && rate >= CONDUIT * this.cells.value[cell];
    moves.push({ vx, vz, limit, cell, rate, conduit });
  }

  private fasterCell(a: number, b: number): number {
    const v = this.cells.value;
    if (a < 0) return b;
    if (b < 0) return a;
    return v[b] < v[a] ? b : a;
  }

  /** ∇T (∂/∂x, ∂/∂depth, s/m) of cell (cx, cz) at local (ux, uz); false when the cell has no usable times. */
  private cellGradient(T: Float64Array, cx: number, cz: number, ux: number, uz: number): boolean {
    const { nx, dx, dz } = this.grid;
    const i = cz * nx + cx;
    const a = T[i];
    const b = T[i + 1];
    const c = T[i + nx];
    const d = T[i + nx + 1];
    if (Number.isFinite(a) && Number.isFinite(b) && Number.isFinite(c) && Number.isFinite(d)) {
      grad.gx = ((1 - uz) * (b - a) + uz * (d - c)) / dx;
      grad.gd = ((1 - ux) * (c - a) + ux * (d - b)) / dz;
      return true;
    }
    // Cell with air corners: blend the node gradients of its finite corners.
    let w = 0;
    let gx = 0;
    let gd = 0;
    for (let k = 0; k < 4; k++) {
      const kx = k & 1;
      const kz = k >> 1;
      if (!Number.isFinite(T[i + kx + kz * nx])) continue;
      nodeGradient(this.grid, T, cx + kx, cz + kz, grad);
      const wk = Math.max((kx ? ux : 1 - ux) * (kz ? uz : 1 - uz), 1e-6);
      w += wk;
      gx += wk * grad.gx;
      gd += wk * grad.gd;
    }
    if (w === 0) return false;
    grad.gx = gx / w;
    grad.gd = gd / w;
    return true;
  }

  /** True when the straight segment crosses only ground cells without a velocity contrast. */
  private smoothStraight(fx: number, fz: number, tx: number, tz: number): boolean {
    let clean = true;
    this.straight(fx, fz, tx, tz, (cell) => {
      if (this.cells.contrast[cell] !== 0 || !Number.isFinite(this.cells.value[cell]) || this.partial[cell] !== 0) clean = false;
    });
    return clean;
  }

  /** Book the straight segment (fx, fz) → (tx, tz) to the cells it crosses. */
  private straight(fx: number, fz: number, tx: number, tz: number, book: (cell: number, len: number) => void): void {
    const { nx, nz, dx, dz } = this.grid;
    const ncx = nx - 1;
    const total = Math.hypot((tx - fx) * dx, (tz - fz) * dz);
    if (total === 0) return;
    // Split at every grid line crossed (parameter values along the segment), then book each piece by its midpoint.
    const ts: number[] = [0, 1];
    const addCrossings = (a: number, b: number): void => {
      const lo = Math.min(a, b);
      const hi = Math.max(a, b);
      for (let k = Math.ceil(lo); k <= Math.floor(hi); k++) if (b !== a) ts.push((k - a) / (b - a));
    };
    addCrossings(fx, tx);
    addCrossings(fz, tz);
    ts.sort((p, q) => p - q);
    for (let k = 1; k < ts.length; k++) {
      const t0 = ts[k - 1];
      const t1 = ts[k];
      if (t1 - t0 <= 0) continue;
      const mx = fx + ((t0 + t1) / 2) * (tx - fx);
      const mz = fz + ((t0 + t1) / 2) * (tz - fz);
      const cx = clamp(Math.floor(mx), 0, nx - 2);
      const cz = clamp(Math.floor(mz), 0, nz - 2);
      book(cz * ncx + cx, (t1 - t0) * total);
    }
  }
}

function clamp(v: number, lo: number, hi: number): number {
  return v < lo ? lo : v > hi ? hi : v;
}

/** Length (in the unit of 1/v) until u in [0, 1] moving at rate v reaches a border. */
function exitLength(u: number, v: number): number {
  if (v > 0) return (1 - u) / v;
  if (v < 0) return -u / v;
  return Infinity;
}

/** Ray from `receiver` back to `source` through the field `times` solved on `velocity`/`active`. */
export function traceRay(
  grid: Grid,
  times: Float64Array,
  velocity: VelocityField,
  active: Uint8Array,
  receiver: Point,
  source: Point,
): Ray {
  return new RayTracer(grid, velocity, active).trace(times, receiver, source);
}
