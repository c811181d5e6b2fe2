/**
 * The forward step on every shot: times and sensitivity rows joined into one matrix in problem
 * order. `inProcessModeller` runs the shots one after another in this thread (tests, small cases
 * in the browser); worker/threads/sensitivity-pool.ts runs them on all cores.
 */
import { SensitivityWorkspace, shotSensitivity, type ShotSensitivity } from './shot-sensitivity';
import type { ForwardModeller, ForwardResult, InversionProblem } from './types';

/** Joins per-shot results (in shot order) into one ForwardResult. */
export function joinShots(nx: number, parts: readonly ShotSensitivity[]): ForwardResult {
  let picks = 0;
  let entries = 0;
  for (const p of parts) {
    picks += p.times.length;
    entries += p.cols.length;
  }
  const times = new Float64Array(picks);
  const rowPtr = new Int32Array(picks + 1);
  const cols = new Int32Array(entries);
  const vals = new Float32Array(entries);
  const rayBottom = new Float64Array(nx).fill(Infinity);
  let row = 0;
  let at = 0;
  for (const p of parts) {
    times.set(p.times, row);
    for (let i = 0; i < p.times.length; i++) rowPtr[row + i + 1] = at + p.rowPtr[i + 1];
    cols.set(p.cols, at);
    vals.set(p.vals, at);
    for (let c = 0; c < nx; c++) if (p.rayBottom[c] < rayBottom[c]) rayBottom[c] = p.rayBottom[c];
    row += p.times.length;
    at += p.cols.length;
  }
  return { times, rowPtr, cols, vals, rayBottom };
}

export function inProcessModeller(problem: InversionProblem): ForwardModeller {
  const ws = new SensitivityWorkspace(problem.grid);
  return {
    async forward(velocity) {
      const key = {};
      const parts = problem.shots.map((shot) =>
        shotSensitivity(ws, velocity, problem.active, shot.source, shot.receivers, problem.settings.order, key, problem.surface),
      );
      return joinShots(problem.grid.nx, parts);
    },
  };
}
