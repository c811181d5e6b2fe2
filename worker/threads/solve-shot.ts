/**
 * One shot's work, run in a worker thread (piscina) by the solve command and, later, by the
 * queue worker: solve the travel-time field from the source, sample it at the receivers,
 * return only those times. The model arrives as SharedArrayBuffers (no copy per shot); the
 * field lives in a per-thread buffer that is reused, so memory does not grow with the number
 * of shots.
 */
import type { Grid } from '../../shared/grid';
import { EikonalInputError, sampleTime, TravelTimeSolver, type Point } from '../../shared/eikonal';
import { viewModel, type SharedModel } from './shared-model';

/** velocity (Float32 m/s per node), active (Uint8 1 ground / 0 air) and cellSlowness over shared memory. */
export interface SolveShotTask extends SharedModel {
  grid: Grid;
  source: Point;
  /** Receiver positions, interleaved x, z (m). */
  receivers: Float64Array;
  order: 1 | 2;
}

export type SolveShotResult =
  | { ok: true; times: Float64Array; solveSeconds: number }
  | { ok: false; message: string };

/** Start barrier: each of n warm-up tasks waits until all n have arrived, so all n threads are loaded. */
export interface WarmupTask {
  warmup: SharedArrayBuffer;
  n: number;
}

let solver: TravelTimeSolver | null = null;
let field: Float64Array | null = null;

/** The same work without threads (tests, single-shot previews). */
export function solveShot(task: SolveShotTask): SolveShotResult {
  const { grid } = task;
  const n = grid.nx * grid.nz;
  const { velocity, active, cellSlowness, surface } = viewModel(grid, task);
  if (!solver || !sameGrid(solver.grid, grid)) {
    solver = new TravelTimeSolver(grid);
    field = new Float64Array(n);
  }
  try {
    const t0 = performance.now();
    const T = solver.solve(velocity, active, task.source, { order: task.order, cellSlowness, surface }, field!);
    const solveSeconds = (performance.now() - t0) / 1000;
    const times = new Float64Array(task.receivers.length / 2);
    const p = { x: 0, z: 0 };
    for (let i = 0; i < times.length; i++) {
      p.x = task.receivers[2 * i];
      p.z = task.receivers[2 * i + 1];
      times[i] = sampleTime(grid, T, active, p, task.source);
    }
    return { ok: true, times, solveSeconds };
  } catch (err) {
    if (err instanceof EikonalInputError) return { ok: false, message: err.message };
    throw err;
  }
}

export default function run(task: SolveShotTask | WarmupTask): SolveShotResult | null {
  if ('warmup' in task) {
    const counter = new Int32Array(task.warmup);
    Atomics.add(counter, 0, 1);
    Atomics.notify(counter, 0);
    const deadline = Date.now() + 30_000; // never hang: give up waiting after 30 s
    let seen: number;
    while ((seen = Atomics.load(counter, 0)) < task.n && Date.now() < deadline) Atomics.wait(counter, 0, seen, 100);
    return null;
  }
  return solveShot(task);
}

const sameGrid = (a: Grid, b: Grid): boolean =>
  a.x0 === b.x0 && a.dx === b.dx && a.nx === b.nx && a.z0 === b.z0 && a.dz === b.dz && a.nz === b.nz;
