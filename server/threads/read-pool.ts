/**
 * One small piscina pool for the heavy parts of reads (read-tasks.ts). One thread: the machine
 * also runs the worker's solver threads, and these tasks are rare (once per model version or
 * pick-set revision; the results are stored). Started on first use; closeReadPool() on shutdown.
 */
import Piscina from 'piscina';
import type { ModelFile } from '../../shared/model';
import type { runPickQc } from '../../shared/qc';
import { workerExecArgv } from '../../worker/threads/exec-argv';
import type { PickQcTask, RasterResult } from './read-tasks';

let pool: Piscina | null = null;

function thePool(): Piscina {
  pool ??= new Piscina({
    filename: new URL('./read-tasks.ts', import.meta.url).href,
    minThreads: 0,
    maxThreads: 1,
    idleTimeout: 30_000,
    execArgv: workerExecArgv(),
  });
  return pool;
}

export function rasterOffThread(model: ModelFile): Promise<RasterResult> {
  return thePool().run({ kind: 'raster', model });
}

export function pickQcOffThread(task: Omit<PickQcTask, 'kind'>): Promise<ReturnType<typeof runPickQc>> {
  return thePool().run({ kind: 'pickQc', ...task });
}

export async function closeReadPool(): Promise<void> {
  const p = pool;
  pool = null;
  await p?.destroy();
}
