/**
 * The inversion's forward step on every core: one task per shot on a pool of threads, the model
 * shared (SharedArrayBuffer) rather than copied per shot. Used by the worker's inversion job and
 * by `npm run invert`; shared/inversion/forward.ts has the single-thread equivalent.
 */
import { availableParallelism } from 'node:os';
import Piscina from 'piscina';
import { joinShots } from '../../shared/inversion/forward';
import type { ForwardModeller, InversionProblem } from '../../shared/inversion/types';
import { workerExecArgv } from './exec-argv';
import { MatrixProductThread } from './matrix-products';
import type { SensitivityTask, SensitivityTaskResult } from './sensitivity-shot';

export class ForwardStepError extends Error {
  constructor(readonly shotId: string, message: string) {
    super(`shot ${shotId}: ${message}`);
    this.name = 'ForwardStepError';
  }
}

let nextModelKey = 1;

export class SensitivityPool {
  private readonly pool: Piscina<SensitivityTask, SensitivityTaskResult>;
  /** LSQR's matrix products on a second thread, made when first needed (two threads or more). */
  private productThread: MatrixProductThread | null = null;

  constructor(readonly threads = Math.max(1, availableParallelism())) {
    this.pool = new Piscina({
      filename: new URL('./sensitivity-shot.ts', import.meta.url).href,
      minThreads: threads,
      maxThreads: threads,
      idleTimeout: 60_000,
      execArgv: workerExecArgv(),
    });
  }

  /** A modeller for one problem: the ground mask is shared once, each model once per forward step. */
  modeller(problem: InversionProblem): ForwardModeller {
    const { grid, shots } = problem;
    const n = grid.nx * grid.nz;
    const active = new SharedArrayBuffer(n);
    new Uint8Array(active).set(problem.active);
    const velocity = new SharedArrayBuffer(4 * n);
    const view = new Float32Array(velocity);
    return {
      forward: async (v) => {
        view.set(v);
        const modelKey = nextModelKey++;
        const parts = await Promise.all(
          shots.map((shot) =>
            this.pool.run({ grid, velocity, active, modelKey, source: shot.source, receivers: shot.receivers, order: problem.settings.order, surface: problem.surface }),
          ),
        );
        return joinShots(
          grid.nx,
          parts.map((p, s) => {
            if (!p.ok) throw new ForwardStepError(shots[s].shotId, p.message);
            return p;
          }),
        );
      },
      products: this.threads > 1 ? (A, At) => (this.productThread ??= new MatrixProductThread()).prepare(A, At) : undefined,
    };
  }

  async close(): Promise<void> {
    await Promise.all([this.pool.destroy(), this.productThread?.close()]);
  }
}
