/**
 * Misfit statistics over a set of residuals (seconds inside; convert with sToMs at the edge).
 *   RMS          = sqrt( Σ rᵢ² / N )                       (common practice, no source)
 *   χ² per datum = Σ (rᵢ/σᵢ)² / N  — χ² as defined by Bevington & Robinson (2003), "Data
 *                  Reduction and Error Analysis for the Physical Sciences", 3rd ed., divided by N
 *                  (not by N − parameters: a forward solve fits no parameters). ≈ 1 when the
 *                  model explains the picks to within their stated uncertainty.
 *   max |r|, mean r (bias, e.g. a trigger delay on one shot), count.
 * An empty set gives count 0 and null figures rather than NaN.
 */
import type { Residual } from './compute';

export interface ResidualStats {
  count: number;
  rms: number | null;
  chi2: number | null;
  maxAbs: number | null;
  mean: number | null;
}

export function residualStats(residuals: readonly Residual[]): ResidualStats {
  const n = residuals.length;
  if (n === 0) return { count: 0, rms: null, chi2: null, maxAbs: null, mean: null };
  let sum = 0;
  let sumSq = 0;
  let sumNormSq = 0;
  let maxAbs = 0;
  for (const r of residuals) {
    sum += r.residual;
    sumSq += r.residual * r.residual;
    sumNormSq += r.normalised * r.normalised;
    maxAbs = Math.max(maxAbs, Math.abs(r.residual));
  }
  return { count: n, rms: Math.sqrt(sumSq / n), chi2: sumNormSq / n, maxAbs, mean: sum / n };
}

export interface ShotStats extends ResidualStats {
  shotId: string;
}
export interface ReceiverStats extends ResidualStats {
  receiverX: number;
}

/** Per shot, in order of first appearance. */
export function statsByShot(residuals: readonly Residual[]): ShotStats[] {
  return [...groupBy(residuals, (r) => r.shotId)].map(([shotId, rs]) => ({ shotId, ...residualStats(rs) }));
}

/** Per receiver position along the line (by receiver x, all shots together), sorted by x. */
export function statsByReceiver(residuals: readonly Residual[]): ReceiverStats[] {
  return [...groupBy(residuals, (r) => r.receiverX)]
    .map(([receiverX, rs]) => ({ receiverX, ...residualStats(rs) }))
    .sort((a, b) => a.receiverX - b.receiverX);
}

export interface RunStats {
  run: ResidualStats;
  shots: ShotStats[];
  receivers: ReceiverStats[];
}

export const runStats = (residuals: readonly Residual[]): RunStats => ({
  run: residualStats(residuals),
  shots: statsByShot(residuals),
  receivers: statsByReceiver(residuals),
});

function groupBy<K>(items: readonly Residual[], key: (r: Residual) => K): Map<K, Residual[]> {
  const groups = new Map<K, Residual[]>();
  for (const r of items) {
    const k = key(r);
    const g = groups.get(k);
    if (g) g.push(r);
    else groups.set(k, [r]);
  }
  return groups;
}
