/**
 * Solving many shots in parallel on worker threads. The velocity and ground arrays are copied
 * once into SharedArrayBuffers that every task views; each task returns only its receiver
 * times, so at most one travel-time field per thread exists at a time.
 *
 * Threads load solve-shot.ts with piscina's own .js entry, which then imports the .ts task. The
 * TypeScript loader comes from the parent's execArgv when it was started with `tsx` or
 * `node --import tsx`; otherwise (e.g. inside a test runner) `--import tsx` is added for the threads.
 */
import { availableParallelism } from 'node:os';
import Piscina from 'piscina';
import type { Grid } from '../../shared/grid';
import type { Point } from '../../shared/eikonal';
import { workerExecArgv } from './exec-argv';
import { shareModel, type ModelArrays } from './shared-model';
import type { SolveShotResult, SolveShotTask, WarmupTask } from './solve-shot';

export interface ShotJob {
  source: Point;
  receivers: Float64Array;
}

export interface PoolSolveResult {
  /** Receiver times (s) per shot, in job order. */
  times: Float64Array[];
  /** Wall-clock seconds from first dispatch to last result (threads already started). */
  wallSeconds: number;
  /** Sum of per-shot solve times inside the threads, s. */
  cpuSeconds: number;
}

export class ShotSolveError extends Error {
  constructor(readonly jobIndex: number, message: string) {
    super(message);
    this.name = 'ShotSolveError';
  }
}

export function defaultThreadCount(): number {
  return Math.max(1, availableParallelism());
}

export class ShotPool {
  private readonly pool: Piscina<SolveShotTask | WarmupTask, SolveShotResult | null>;
  readonly threads: number;

  constructor(threads = defaultThreadCount()) {
    this.threads = threads;
    this.pool = new Piscina({
      filename: new URL('./solve-shot.ts', import.meta.url).href,
      minThreads: threads,
      maxThreads: threads,
      idleTimeout: 60_000,
      execArgv: workerExecArgv(),
    });
  }

  /** Resolves once every thread has loaded the task module (so start-up is not timed as solving). */
  async warmUp(): Promise<void> {
    const warmup = new SharedArrayBuffer(4);
    const n = this.threads;
    await Promise.all(Array.from({ length: n }, () => this.pool.run({ warmup, n })));
  }

  async solveAll(grid: Grid, model: ModelArrays, jobs: readonly ShotJob[], order: 1 | 2): Promise<PoolSolveResult> {
    const shared = shareModel(model);

    const t0 = performance.now();
    const results = await Promise.all(
      jobs.map((job) =>
        this.pool.run({ grid, ...shared, source: job.source, receivers: job.receivers, order }),
      ),
    );
    const wallSeconds = (performance.now() - t0) / 1000;
    let cpuSeconds = 0;
    const times = results.map((r, i) => {
      if (!r) throw new ShotSolveError(i, 'no result from the solver thread');
      if (!r.ok) throw new ShotSolveError(i, r.message);
      cpuSeconds += r.solveSeconds;
      return r.times;
    });
    return { times, wallSeconds, cpuSeconds };
  }

  async close(): Promise<void> {
    await this.pool.destroy();
  }
}
