import type { ResidualRow } from '../../../src/api/types';

/** A residual row with plausible defaults; tests override what they care about. */
export function row(over: Partial<ResidualRow> = {}): ResidualRow {
  const observedMs = over.observedMs ?? 10;
  const computedMs = over.computedMs ?? 10;
  const sigmaMs = over.sigmaMs ?? 0.5;
  const residualMs = over.residualMs ?? observedMs - computedMs;
  return {
    pickIndex: 0,
    shotId: 'S1',
    receiverX: 0,
    receiverZ: 100,
    observedMs,
    computedMs,
    residualMs,
    normalised: residualMs / sigmaMs,
    sigmaMs,
    excluded: false,
    flags: [],
    ...over,
  };
}
