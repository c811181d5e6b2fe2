/** Time a case (median of repeats) and compare its field with the exact times. */
import { TravelTimeSolver, type MarchOptions } from '../../shared/eikonal';
import type { BenchCase } from './cases';

export interface BenchResult {
  case: string;
  nx: number;
  nz: number;
  order: 1 | 2;
  median_seconds: number;
  nodes_per_second: number;
  max_rel_error: number;
  mean_rel_error: number;
  /** How many nodes were compared with the exact solution. */
  measured_nodes: number;
  /** Median CPU time of this process per solve (s): less disturbed than wall time on a busy machine. */
  cpu_median_seconds: number;
}

export function errors(c: BenchCase, times: Float64Array): { max: number; mean: number; count: number } {
  const { nx, nz } = c.grid;
  let max = 0;
  let sum = 0;
  let count = 0;
  for (let iz = 0; iz < nz; iz++) {
    for (let ix = 0; ix < nx; ix++) {
      const exact = c.exact(ix, iz);
      if (!Number.isFinite(exact)) continue;
      const e = Math.abs(times[iz * nx + ix] - exact) / exact;
      if (e > max) max = e;
      sum += e;
      count++;
    }
  }
  return { max, mean: count ? sum / count : NaN, count };
}

export function runCase(c: BenchCase, caseOptions: MarchOptions & { order: 1 | 2 }, repeats: number): BenchResult {
  const options = { ...caseOptions, cellSlowness: c.cellSlowness };
  const solver = new TravelTimeSolver(c.grid);
  const out = new Float64Array(c.grid.nx * c.grid.nz);
  // Warm-up until the optimising compiler has settled: at least 3 solves and 0.2 s.
  const warmStart = performance.now();
  for (let k = 0; k < 3 || performance.now() - warmStart < 200; k++) solver.solve(c.velocity, c.active, c.source, options, out);
  const seconds: number[] = [];
  const cpu: number[] = [];
  for (let k = 0; k < repeats; k++) {
    const c0 = process.cpuUsage();
    const t0 = process.hrtime.bigint();
    solver.solve(c.velocity, c.active, c.source, options, out);
    seconds.push(Number(process.hrtime.bigint() - t0) / 1e9);
    const dc = process.cpuUsage(c0);
    cpu.push((dc.user + dc.system) / 1e6);
  }
  const median = medianOf(seconds);
  let activeNodes = 0;
  for (let i = 0; i < c.active.length; i++) activeNodes += c.active[i];
  const e = errors(c, out);
  return {
    case: c.name,
    nx: c.grid.nx,
    nz: c.grid.nz,
    order: options.order,
    median_seconds: median,
    nodes_per_second: activeNodes / median,
    max_rel_error: e.max,
    mean_rel_error: e.mean,
    measured_nodes: e.count,
    cpu_median_seconds: medianOf(cpu),
  };
}

function medianOf(values: number[]): number {
  const v = [...values].sort((a, b) => a - b);
  const m = v.length >> 1;
  return v.length % 2 ? v[m] : (v[m - 1] + v[m]) / 2;
}
