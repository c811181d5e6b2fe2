/**
 * The engine against a plain fast-marching solver (plain-fmm.ts), timed alternately in one process
 * so both see the same machine: on a shared host wall times drift by a third from minute to minute,
 * the ratio of the two hardly at all.
 */
import { TravelTimeSolver } from '../../shared/eikonal';
import type { BenchCase } from './cases';
import { PlainMarcher } from './plain-fmm';

export interface Calibration {
  engineSeconds: number;
  plainSeconds: number;
  /** Median over pairs of engine time ÷ plain time. */
  costRatio: number;
}

export function calibrate(c: BenchCase, order: 1 | 2, pairs: number): Calibration {
  const engine = new TravelTimeSolver(c.grid);
  const plain = new PlainMarcher(c.grid, c.velocity);
  const out = new Float64Array(c.grid.nx * c.grid.nz);
  const sourceNode = Math.round((c.grid.z0 - c.source.z) / c.grid.dz) * c.grid.nx + Math.round((c.source.x - c.grid.x0) / c.grid.dx);
  const e: number[] = [];
  const p: number[] = [];
  const r: number[] = [];
  for (let k = -3; k < pairs; k++) {
    let t0 = performance.now();
    engine.solve(c.velocity, c.active, c.source, { order }, out);
    const te = performance.now() - t0;
    t0 = performance.now();
    plain.solve(sourceNode);
    const tp = performance.now() - t0;
    if (k < 0) continue; // warm-up pairs
    e.push(te / 1000);
    p.push(tp / 1000);
    r.push(te / tp);
  }
  return { engineSeconds: median(e), plainSeconds: median(p), costRatio: median(r) };
}

function median(values: number[]): number {
  const v = [...values].sort((a, b) => a - b);
  const m = v.length >> 1;
  return v.length % 2 ? v[m] : (v[m - 1] + v[m]) / 2;
}
