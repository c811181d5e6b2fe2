/**
 * One shot of the inversion's forward step: the travel-time field, the computed time at each
 * receiver, and for each receiver the ray's sensitivity to the slowness of every grid node.
 *
 * The unknowns are node slownesses (the solver's own parameters, so no projection is needed
 * between the inverted model and the forward grid). A ray of length L through a point inside a
 * cell depends on the slowness there, which is the bilinear blend of the cell's four corners; so
 * ∂t/∂s_node = Σ over ray pieces of piece length × bilinear weight of the node at the piece's
 * midpoint (Rawlinson & Sambridge 2003, "Seismic traveltime tomography of the crust and
 * lithosphere", Adv. Geophys. 46, §3; from memory). Pieces are at most a quarter cell long.
 * Air corners get no share: the weight goes to the ground corners of the cell.
 */
import type { Grid } from '../grid';
import { RayTracer, sampleTime, TravelTimeSolver, type Point } from '../eikonal';

export interface ShotSensitivity {
  /** Computed time (s) per receiver; Infinity where the wave cannot reach. */
  times: Float64Array;
  /** CSR rows, one per receiver, columns ascending; an untraceable ray has an empty row. */
  rowPtr: Int32Array;
  cols: Int32Array;
  vals: Float32Array;
  /** Per grid column: lowest elevation the shot's rays reach there (m), +Infinity where none passes. */
  rayBottom: Float64Array;
}

/** Buffers one thread keeps between shots of the same grid. */
export class SensitivityWorkspace {
  readonly solver: TravelTimeSolver;
  readonly field: Float64Array;
  readonly weight: Float64Array;
  readonly touched: Int32Array;
  tracer: { key: unknown; tracer: RayTracer } | null = null;

  constructor(readonly grid: Grid) {
    const n = grid.nx * grid.nz;
    this.solver = new TravelTimeSolver(grid);
    this.field = new Float64Array(n);
    this.weight = new Float64Array(n);
    this.touched = new Int32Array(n);
  }
}

/**
 * `modelKey` identifies the velocity array: while it stays the same the ray tracer's cell
 * slownesses are reused across shots.
 */
export function shotSensitivity(
  ws: SensitivityWorkspace,
  velocity: Float32Array | Float64Array,
  active: Uint8Array,
  source: Point,
  receivers: Float64Array,
  order: 1 | 2,
  modelKey: unknown,
  surface?: Point[],
): ShotSensitivity {
  const { grid } = ws;
  const T = ws.solver.solve(velocity, active, source, { order, surface }, ws.field);
  if (ws.tracer?.key !== modelKey) ws.tracer = { key: modelKey, tracer: new RayTracer(grid, velocity, active) };
  const tracer = ws.tracer!.tracer;

  const count = receivers.length / 2;
  const times = new Float64Array(count);
  const rowPtr = new Int32Array(count + 1);
  const rayBottom = new Float64Array(grid.nx).fill(Infinity);
  const colsOut: Int32Array[] = [];
  const valsOut: Float32Array[] = [];
  let total = 0;
  const p = { x: 0, z: 0 };
  for (let i = 0; i < count; i++) {
    p.x = receivers[2 * i];
    p.z = receivers[2 * i + 1];
    times[i] = sampleTime(grid, T, active, p, source);
    let row: { cols: Int32Array; vals: Float32Array } | null = null;
    if (Number.isFinite(times[i])) {
      try {
        const ray = tracer.trace(T, p, source);
        row = rayWeights(ws, active, ray.points, rayBottom);
      } catch {
        row = null; // an untraceable ray keeps its time but adds nothing to the matrix
      }
    }
    if (row) {
      colsOut.push(row.cols);
      valsOut.push(row.vals);
      total += row.cols.length;
    }
    rowPtr[i + 1] = total;
  }
  const cols = new Int32Array(total);
  const vals = new Float32Array(total);
  let at = 0;
  for (let k = 0; k < colsOut.length; k++) {
    cols.set(colsOut[k], at);
    vals.set(valsOut[k], at);
    at += colsOut[k].length;
  }
  return { times, rowPtr, cols, vals, rayBottom };
}

/** Bilinear node weights along a polyline (x, z pairs), and the polyline's lowest point per column. */
function rayWeights(ws: SensitivityWorkspace, active: Uint8Array, points: Float64Array, rayBottom: Float64Array): { cols: Int32Array; vals: Float32Array } {
  const { x0, dx, nx, z0, dz, nz } = ws.grid;
  const weight = ws.weight;
  const touched = ws.touched;
  let nTouched = 0;
  const piece = 0.25 * Math.min(dx, dz);
  const add = (node: number, w: number): void => {
    if (weight[node] === 0) touched[nTouched++] = node;
    weight[node] += w;
  };

  for (let k = 0; k + 3 < points.length; k += 2) {
    const ax = points[k], az = points[k + 1], bx = points[k + 2], bz = points[k + 3];
    const len = Math.hypot(bx - ax, bz - az);
    if (!(len > 0)) continue;
    const pieces = Math.max(1, Math.ceil(len / piece));
    const step = len / pieces;
    for (let q = 0; q < pieces; q++) {
      const t = (q + 0.5) / pieces;
      const fx = Math.min(Math.max((ax + t * (bx - ax) - x0) / dx, 0), nx - 1);
      const fz = Math.min(Math.max((z0 - (az + t * (bz - az))) / dz, 0), nz - 1);
      const cx = Math.min(Math.floor(fx), nx - 2);
      const cz = Math.min(Math.floor(fz), nz - 2);
      const ux = fx - cx, uz = fz - cz;
      const i00 = cz * nx + cx, i10 = i00 + 1, i01 = i00 + nx, i11 = i01 + 1;
      const w00 = active[i00] ? (1 - ux) * (1 - uz) : 0;
      const w10 = active[i10] ? ux * (1 - uz) : 0;
      const w01 = active[i01] ? (1 - ux) * uz : 0;
      const w11 = active[i11] ? ux * uz : 0;
      const sum = w00 + w10 + w01 + w11;
      if (!(sum > 0)) continue;
      const f = step / sum;
      if (w00) add(i00, w00 * f);
      if (w10) add(i10, w10 * f);
      if (w01) add(i01, w01 * f);
      if (w11) add(i11, w11 * f);
    }
    const col = Math.round((ax - x0) / dx);
    if (col >= 0 && col < nx && az < rayBottom[col]) rayBottom[col] = az;
  }
  const last = points.length - 2;
  const col = Math.round((points[last] - x0) / dx);
  if (col >= 0 && col < nx && points[last + 1] < rayBottom[col]) rayBottom[col] = points[last + 1];

  const list = touched.subarray(0, nTouched).sort();
  const cols = Int32Array.from(list);
  const vals = new Float32Array(nTouched);
  for (let k = 0; k < nTouched; k++) {
    vals[k] = weight[cols[k]];
    weight[cols[k]] = 0;
  }
  return { cols, vals };
}
