/**
 * Axis ticks on round numbers from the 1–2–2.5–5 series (common practice for chart axes, no source),
 * and the number of decimals their labels need.
 */
const MANTISSAS = [1, 2, 2.5, 5, 10];

/** The smallest round step ≥ rough. */
export function niceStep(rough: number): number {
  if (!(rough > 0) || !Number.isFinite(rough)) return 1;
  const decade = 10 ** Math.floor(Math.log10(rough));
  const m = MANTISSAS.find((k) => k * decade >= rough * (1 - 1e-9)) ?? 10;
  return round12(m * decade);
}

/** Round values inside [min, max], about `target` of them. */
export function niceTicks(min: number, max: number, target = 6): { step: number; values: number[] } {
  if (!(max > min)) return { step: 1, values: Number.isFinite(min) ? [min] : [] };
  const step = niceStep((max - min) / Math.max(1, target));
  const first = Math.ceil(min / step - 1e-9);
  const last = Math.floor(max / step + 1e-9);
  const values: number[] = [];
  for (let k = first; k <= last; k++) values.push(round12(k * step));
  return { step, values };
}

/** Decimals needed to print multiples of `step` exactly (0.25 → 2, 5 → 0). */
export function decimalsFor(step: number): number {
  for (let d = 0; d <= 6; d++) {
    const scaled = step * 10 ** d;
    if (Math.abs(scaled - Math.round(scaled)) < 1e-6 * Math.max(1, scaled)) return d;
  }
  return 6;
}

function round12(v: number): number {
  return Math.round(v * 1e12) / 1e12;
}
