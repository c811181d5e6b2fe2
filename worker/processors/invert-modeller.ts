/**
 * Forward modellers for one inversion job: every shot of a forward step on the thread pool
 * (worker/threads/sensitivity-pool.ts), with as many threads as the solve job uses (WORKER_THREADS,
 * default every core), so the worker's event loop stays free to keep its queue lock and notice a cancel.
 */
import type { ForwardModeller, InversionProblem } from '../../shared/inversion/types';
import { SensitivityPool } from '../threads/sensitivity-pool';
import { SOLVER_THREADS } from './solve';

export interface Modellers {
  modeller(problem: InversionProblem): ForwardModeller;
  close(): Promise<void>;
}

/** A pool of its own per job: it holds one model per thread and goes when the job ends. */
export async function openModellers(): Promise<Modellers> {
  const pool = new SensitivityPool(SOLVER_THREADS);
  return { modeller: (problem) => pool.modeller(problem), close: () => pool.close() };
}

/**
 * One pool for every ensemble member this process runs: a member is a short inversion, and starting
 * threads (and compiling their code) for each one cost about a second of the two or three a member takes.
 */
let shared: SensitivityPool | null = null;

export function sharedModellers(): Modellers {
  shared ??= new SensitivityPool(SOLVER_THREADS);
  const pool = shared;
  return { modeller: (problem) => pool.modeller(problem), close: async () => undefined };
}

export async function closeSharedModellers(): Promise<void> {
  await shared?.close();
  shared = null;
}
