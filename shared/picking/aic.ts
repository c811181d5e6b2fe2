/**
 * Onset by the Akaike information criterion computed from the samples themselves (Maeda, N., 1985,
 * "A method for reading and checking phase times in autoprocessing system of seismic wave data",
 * Zisin 38, 365–379 — from memory): AIC(k) = k·ln var(x[lo..k)) + (n−k−1)·ln var(x[k..hi)),
 * n = hi − lo. Its minimum splits the window into a noise part and a signal part; the returned
 * index is the first sample of the signal part.
 */
export function aicOnset(x: Float64Array, lo: number, hi: number): number {
  const n = hi - lo;
  if (n < 6) return lo;
  const s1 = new Float64Array(n + 1), s2 = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) {
    const v = x[lo + i];
    s1[i + 1] = s1[i] + v;
    s2[i + 1] = s2[i] + v * v;
  }
  const variance = (a: number, b: number) => {
    const m = b - a;
    const mean = (s1[b] - s1[a]) / m;
    return Math.max((s2[b] - s2[a]) / m - mean * mean, 1e-300);
  };
  let best = lo, bestAic = Infinity;
  for (let k = 2; k <= n - 2; k++) {
    const aic = k * Math.log(variance(0, k)) + (n - k - 1) * Math.log(variance(k, n));
    if (aic < bestAic) {
      bestAic = aic;
      best = lo + k;
    }
  }
  return best;
}
