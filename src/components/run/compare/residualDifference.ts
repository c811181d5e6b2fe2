import type { ResidualRow } from '../../../api/types';
import { receiverKey } from '../misfit/matrix';

/** One pick present in both runs (ms). */
export interface MatchedPick {
  shotId: string;
  receiverX: number;
  a: ResidualRow;
  b: ResidualRow;
  /** Residual in B − residual in A. */
  diffMs: number;
  /** |residual in B| − |residual in A|: below zero B is closer to the pick (fits it better). */
  fitChangeMs: number;
}

export interface ResidualComparison {
  matched: MatchedPick[];
  onlyA: number;
  onlyB: number;
}

const pickKey = (r: ResidualRow) => `${r.shotId}\u0000${receiverKey(r.receiverX)}`;

/**
 * Pair the picks of two runs by shot and receiver position, so runs on different revisions
 * of a pick set still compare. With the same observed time, B − A residual = A − B computed time.
 */
export function compareResiduals(a: readonly ResidualRow[], b: readonly ResidualRow[]): ResidualComparison {
  const byKey = new Map(a.map((r) => [pickKey(r), r]));
  const matched: MatchedPick[] = [];
  for (const rb of b) {
    const ra = byKey.get(pickKey(rb));
    if (!ra) continue;
    matched.push({ shotId: rb.shotId, receiverX: rb.receiverX, a: ra, b: rb, diffMs: rb.residualMs - ra.residualMs, fitChangeMs: Math.abs(rb.residualMs) - Math.abs(ra.residualMs) });
  }
  return { matched, onlyA: a.length - matched.length, onlyB: b.length - matched.length };
}

/** RMS (ms) of residuals over non-excluded picks; NaN when there are none. */
export function rmsMs(values: readonly number[]): number {
  if (values.length === 0) return Number.NaN;
  return Math.sqrt(values.reduce((s, v) => s + v * v, 0) / values.length);
}
