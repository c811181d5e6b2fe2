/**
 * One shot's preview, without any browser API so tests run it as is: the travel-time field by
 * the shared fast-marching solver, the times at the receivers sampled exactly as the solve
 * command's thread task does (worker/threads/solve-shot.ts: TravelTimeSolver.solve with the
 * order and the model's cell slownesses, then sampleTime at each receiver), wavefront contours,
 * and on request the rays.
 */
import type { Grid } from '../../shared/grid';
import { sampleTime, TravelTimeSolver, type Point } from '../../shared/eikonal';
import { RayTracer } from '../../shared/eikonal/rays';
import { contourLevels, isolines } from './isolines';

export interface ShotInput {
  grid: Grid;
  velocity: Float32Array;
  active: Uint8Array;
  /** Layered models: slowness of the cells an interface crosses (RasterModel.cellSlowness). */
  cellSlowness?: Float32Array;
  /** Ground surface polyline (RasterModel.surface): the solver's start region follows it. */
  surface?: Point[];
  source: Point;
  receivers: Float64Array;
  order: 1 | 2;
}

export interface FieldResult {
  times: Float64Array;
  receiverTimes: Float64Array;
  tMax: number;
  stepMs: number;
  levels: number[];
  contours: Float32Array[];
  solveMs: number;
  contourMs: number;
}

const sameGrid = (a: Grid, b: Grid): boolean =>
  a.x0 === b.x0 && a.dx === b.dx && a.nx === b.nx && a.z0 === b.z0 && a.dz === b.dz && a.nz === b.nz;

/** Keeps one solver (and its buffers) while the grid stays the same, as the thread task does. */
export class PreviewEngine {
  private solver: TravelTimeSolver | null = null;

  solveField(input: ShotInput): FieldResult {
    const { grid, velocity, active } = input;
    if (!this.solver || !sameGrid(this.solver.grid, grid)) this.solver = new TravelTimeSolver(grid);
    const t0 = performance.now();
    const times = this.solver.solve(velocity, active, input.source, { order: input.order, cellSlowness: input.cellSlowness, surface: input.surface });
    const receiverTimes = receiverTimesOf(grid, times, active, input.receivers, input.source);
    const t1 = performance.now();
    let tMax = 0;
    for (let i = 0; i < times.length; i++) if (times[i] > tMax && Number.isFinite(times[i])) tMax = times[i];
    const { stepMs, levels } = contourLevels(tMax);
    const contours = isolines(grid, times, levels);
    return { times, receiverTimes, tMax, stepMs, levels, contours, solveMs: t1 - t0, contourMs: performance.now() - t1 };
  }
}

/** sampleTime at each receiver; a receiver the wave cannot reach (or that lies off the model) gets Infinity. */
export function receiverTimesOf(grid: Grid, times: Float64Array, active: Uint8Array, receivers: Float64Array, source?: Point): Float64Array {
  const out = new Float64Array(receivers.length / 2);
  const p = { x: 0, z: 0 };
  for (let i = 0; i < out.length; i++) {
    p.x = receivers[2 * i];
    p.z = receivers[2 * i + 1];
    try {
      out[i] = sampleTime(grid, times, active, p, source);
    } catch {
      out[i] = Infinity;
    }
  }
  return out;
}

/** Rays from every receiver back to the source; an empty polyline where tracing fails. */
export function traceRays(input: ShotInput, times: Float64Array): Float64Array[] {
  const tracer = new RayTracer(input.grid, input.velocity, input.active);
  const rays: Float64Array[] = [];
  for (let i = 0; i < input.receivers.length / 2; i++) {
    try {
      rays.push(tracer.trace(times, { x: input.receivers[2 * i], z: input.receivers[2 * i + 1] }, input.source).points);
    } catch {
      rays.push(new Float64Array(0));
    }
  }
  return rays;
}
