/**
 * Energy ratio characteristic function: mean energy in a short window after sample i over the mean
 * energy in a longer window before it (a short-term/long-term average ratio with the short window
 * leading; Allen, R. V., 1978, "Automatic earthquake recognition and timing from single traces",
 * BSSA 68(5), 1521–1532 — from memory). It peaks where noise gives way to signal.
 * Returns the ratio for every sample (0 before `from` and where the short window runs off the end).
 */
export function energyRatio(x: Float64Array, from: number, short: number, long: number, floor = quietestEnergy(x, long)): Float64Array {
  const n = x.length;
  const cum = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) cum[i + 1] = cum[i] + x[i] * x[i];
  // Floor under the trailing average: near the start the trailing window holds only a few samples,
  // and a chance lull there would fake an arrival.
  const ratio = new Float64Array(n);
  for (let i = Math.max(from, 1); i + short <= n; i++) {
    const lo = Math.max(0, i - long);
    const before = (cum[i] - cum[lo]) / (i - lo);
    const after = (cum[i + short] - cum[i]) / short;
    ratio[i] = after / Math.max(before, floor);
  }
  return ratio;
}

/**
 * Where the ratio climbs through `threshold`: for each crossing, the sample with the largest ratio
 * within `window` samples after it. At most `max` of them, earliest first.
 */
export function triggers(ratio: Float64Array, threshold: number, window: number, max = 50): number[] {
  const out: number[] = [];
  let i = 0;
  while (i < ratio.length && out.length < max) {
    if (ratio[i] < threshold) {
      i++;
      continue;
    }
    let best = i;
    for (let k = i; k < Math.min(ratio.length, i + window); k++) if (ratio[k] > ratio[best]) best = k;
    out.push(best);
    i = best + window;
    while (i < ratio.length && ratio[i] >= threshold) i++; // leave this crossing before looking for the next
  }
  return out;
}

/**
 * Mean energy of the quietest full window of `long` samples: a floor for the noise level (never 0,
 * so silent stretches do not divide by zero).
 */
export function quietestEnergy(x: Float64Array, long: number): number {
  const n = x.length;
  let sum = 0, total = 0;
  for (let i = 0; i < n; i++) total += x[i] * x[i];
  let floor = Infinity;
  for (let i = 0; i < n; i++) {
    sum += x[i] * x[i];
    if (i >= long) sum -= x[i - long] * x[i - long];
    if (i >= long - 1) floor = Math.min(floor, sum / long);
  }
  if (!Number.isFinite(floor)) floor = total / Math.max(n, 1);
  return Math.max(floor, (total / Math.max(n, 1)) * 1e-12, Number.MIN_VALUE);
}

/**
 * Median energy of the trace's whole windows of `long` samples: the noise level where arrivals fill
 * less than half the record (a floor that, unlike the quietest window, is the noise's mean).
 */
export function typicalEnergy(x: Float64Array, long: number): number {
  const energies: number[] = [];
  for (let a = 0; a + long <= x.length; a += long) {
    let e = 0;
    for (let i = a; i < a + long; i++) e += x[i] * x[i];
    energies.push(e / long);
  }
  if (!energies.length) return quietestEnergy(x, long);
  energies.sort((p, q) => p - q);
  return Math.max(energies[energies.length >> 1], quietestEnergy(x, long));
}
