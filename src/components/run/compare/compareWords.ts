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
