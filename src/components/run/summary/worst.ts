import type { RunReceiverStats, RunShotStats } from '../../../api/types';

/** The `n` entries with the largest RMS misfit, worst first. */
export function worstByRms<T extends RunShotStats | RunReceiverStats>(items: readonly T[], n: number): T[] {
  return [...items].filter((i) => i.count > 0 && Number.isFinite(i.rms_ms)).sort((a, b) => b.rms_ms - a.rms_ms).slice(0, n);
}
