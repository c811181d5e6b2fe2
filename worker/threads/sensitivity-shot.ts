/**
 * One shot of an inversion's forward step in a worker thread: times at the receivers and the
 * rays' node sensitivities (shared/inversion/shot-sensitivity.ts). The model arrives over shared
 * memory; the solver, its buffers and the ray tracer of the current model are kept per thread.
 */
import type { Grid } from '../../shared/grid';
import type { Point } from '../../shared/eikonal';
import { SensitivityWorkspace, shotSensitivity, type ShotSensitivity } from '../../shared/inversion/shot-sensitivity';

export interface SensitivityTask {
  grid: Grid;
  velocity: SharedArrayBuffer;
  active: SharedArrayBuffer;
  /** Changes with every model, so a thread knows when to rebuild its ray tracer. */
  modelKey: number;
  source: Point;
  receivers: Float64Array;
  order: 1 | 2;
  /** The ground surface line, when the model has one. */
  surface?: Point[];
}

export type SensitivityTaskResult = ({ ok: true } & ShotSensitivity) | { ok: false; message: string };

let ws: SensitivityWorkspace | null = null;

export default function run(task: SensitivityTask): SensitivityTaskResult {
  const { grid } = task;
  const n = grid.nx * grid.nz;
  if (!ws || !sameGrid(ws.grid, grid)) ws = new SensitivityWorkspace(grid);
  try {
    const velocity = new Float32Array(task.velocity, 0, n);
    const active = new Uint8Array(task.active, 0, n);
    return { ok: true, ...shotSensitivity(ws, velocity, active, task.source, task.receivers, task.order, task.modelKey, task.surface) };
  } catch (err) {
    return { ok: false, message: (err as Error).message };
  }
}

const sameGrid = (a: Grid, b: Grid): boolean =>
  a.x0 === b.x0 && a.dx === b.dx && a.nx === b.nx && a.z0 === b.z0 && a.dz === b.dz && a.nz === b.nz;
