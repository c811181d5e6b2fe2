/**
 * One sentence on which of two runs fits the picks better, by RMS misfit. Differences smaller than
 * `tieMs` (default 0.01 ms, a tenth of the finest pick resolution in common use — common practice,
 * no source) are called a tie.
 */
export function compareSentence(rmsA: number, rmsB: number, tieMs = 0.01): string {
  if (!Number.isFinite(rmsA) || !Number.isFinite(rmsB)) return 'One of the runs has no misfit to compare.';
  const diff = rmsB - rmsA;
  if (Math.abs(diff) < tieMs) return `Both runs fit the picks equally well (RMS ${rmsA.toFixed(2)} ms).`;
  const better = diff < 0 ? 'B' : 'A';
  const worse = diff < 0 ? rmsA : rmsB;
  const pct = worse > 0 ? (Math.abs(diff) / worse) * 100 : 0;
  return `Run ${better} fits the picks better: its RMS misfit is ${Math.abs(diff).toFixed(2)} ms lower (${pct.toFixed(0)} % less).`;
}

/**
 * The comparison's headline. RMS figures only rank models when both runs fit the same picks;
 * runs on different pick sets are shown side by side without a winner.
 */
export function comparisonHeadline(rmsA: number, rmsB: number, samePickSet: boolean): string {
  if (!samePickSet) {
    return 'These runs fit different pick sets, so their misfits do not rank one model against the other. Compare runs on the same pick set for that.';
  }
  return compareSentence(rmsA, rmsB);
}
