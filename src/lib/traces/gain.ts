/**
 * Display gains for a seismogram: automatic gain control and normalisation, both on copies the
 * record view owns (the stored samples are never changed).
 */

/**
 * AGC: each sample divided by the RMS amplitude in a window centred on it (common practice, no
 * source). Running sums keep it O(n) whatever the window; the window shrinks at the trace ends.
 */
export function agcInPlace(x: Float32Array, windowSamples: number): void {
  const n = x.length;
  const half = Math.max(1, Math.floor(windowSamples / 2));
  const sq = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) sq[i + 1] = sq[i] + x[i] * x[i];
  const peak = Math.sqrt(sq[n] / Math.max(1, n));
  // A floor stops dead stretches (all zeros) from being blown up to full scale.
  const floor = peak * 1e-6 + Number.MIN_VALUE;
  for (let i = 0; i < n; i++) {
    const lo = Math.max(0, i - half), hi = Math.min(n, i + half + 1);
    const rms = Math.sqrt((sq[hi] - sq[lo]) / (hi - lo));
    x[i] = x[i] / Math.max(rms, floor);
  }
}

export function maxAbs(x: Float32Array): number {
  let m = 0;
  for (let i = 0; i < x.length; i++) {
    const a = Math.abs(x[i]);
    if (a > m) m = a;
  }
  return m;
}

/** Scale so the largest |sample| is 1: each trace on its own ('trace') or all by the record's largest ('record'). */
export function normalise(traces: Float32Array[], mode: 'trace' | 'record'): void {
  const peaks = traces.map(maxAbs);
  const recordPeak = Math.max(0, ...peaks);
  traces.forEach((t, i) => {
    const p = mode === 'trace' ? peaks[i] : recordPeak;
    if (p > 0) for (let j = 0; j < t.length; j++) t[j] /= p;
  });
}
