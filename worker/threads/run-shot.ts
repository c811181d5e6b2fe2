/**
 * One shot of a queued run, in a worker thread: the travel-time field, the times at the
 * receivers, the field itself (Float32, deflated, for display) and a simplified ray per receiver.
 * The model arrives over SharedArrayBuffers; the solver and its buffers are reused per thread.
 */
import { deflateRawSync } from 'node:zlib';
import type { Grid } from '../../shared/grid';
import { RayTracer, sampleTime, TravelTimeSolver, type Point } from '../../shared/eikonal';
import { simplifyPolyline } from '../../shared/geometry/simplify';
import { viewModel, type SharedModel } from './shared-model';

export interface RunShotTask extends SharedModel {
  grid: Grid;
  source: Point;
  /** Receiver positions, interleaved x, z (m). */
  receivers: Float64Array;
  order: 1 | 2;
  /** Identifies the velocity model (its version id): the ray tracer's slowness tables are reused while it stays the same. */
  modelKey: string;
}

export type RunShotResult =
  | { ok: true; times: Float64Array; field: Uint8Array; rays: (Float32Array | null)[]; solveSeconds: number }
  | { ok: false; message: string };

let solver: TravelTimeSolver | null = null;
let buffer: Float64Array | null = null;
let tracer: { key: string; tracer: RayTracer } | null = null;

export default function runShot(task: RunShotTask): RunShotResult {
  const { grid } = task;
  const n = grid.nx * grid.nz;
  const { velocity, active, cellSlowness, surface } = viewModel(grid, task);
  if (!solver || solver.grid.nx !== grid.nx || solver.grid.nz !== grid.nz || solver.grid.dx !== grid.dx || solver.grid.dz !== grid.dz || solver.grid.x0 !== grid.x0 || solver.grid.z0 !== grid.z0) {
    solver = new TravelTimeSolver(grid);
    buffer = new Float64Array(n);
  }
  try {
    const t0 = performance.now();
    const T = solver.solve(velocity, active, task.source, { order: task.order, cellSlowness, surface }, buffer!);
    const solveSeconds = (performance.now() - t0) / 1000;

    if (tracer?.key !== task.modelKey) tracer = { key: task.modelKey, tracer: new RayTracer(grid, velocity, active) };
    const count = task.receivers.length / 2;
    const times = new Float64Array(count);
    const rays: (Float32Array | null)[] = [];
    // Rays are kept to a quarter cell: finer than any plot of them, a few dozen points each.
    const tolerance = 0.25 * Math.min(grid.dx, grid.dz);
    for (let i = 0; i < count; i++) {
      const receiver = { x: task.receivers[2 * i], z: task.receivers[2 * i + 1] };
      times[i] = sampleTime(grid, T, active, receiver, task.source);
      try {
        rays.push(simplifyPolyline(tracer.tracer.trace(T, receiver, task.source).points, tolerance));
      } catch {
        rays.push(null); // a ray that cannot be traced is left out of the picture, not the run
      }
    }

    const field = new Float32Array(n);
    for (let i = 0; i < n; i++) field[i] = Number.isFinite(T[i]) ? T[i] : Number.NaN;
    return { ok: true, times, field: deflateRawSync(new Uint8Array(field.buffer), { level: 1 }), rays, solveSeconds };
  } catch (err) {
    return { ok: false, message: (err as Error).message };
  }
}
