/**
 * Forward modellers for one inversion job. Until worker/threads/sensitivity-pool.ts is on this
 * branch, the shots run in this thread (shared/inversion/forward.ts).
 */
import { inProcessModeller } from '../../shared/inversion';
import type { ForwardModeller, InversionProblem } from '../../shared/inversion/types';

export interface Modellers {
  modeller(problem: InversionProblem): ForwardModeller;
  close(): Promise<void>;
}

export async function openModellers(): Promise<Modellers> {
  return { modeller: inProcessModeller, close: async () => undefined };
}
