/**
 * The section's velocity colours. Slow ground pale sand, fast ground mid blue: lightness falls
 * steadily with velocity and never gets dark, so black wavefronts, red rays and station marks stay
 * readable on every layer.
 */
export const VELOCITY_STOPS: [number, string][] = [
  [0, '#f6e7c8'],
  [0.3, '#dfe8c9'],
  [0.6, '#b5d6d6'],
  [1, '#7fa9c9'],
];

const STOP_RGB = VELOCITY_STOPS.map(([t, hex]) => [t, parseInt(hex.slice(1, 3), 16), parseInt(hex.slice(3, 5), 16), parseInt(hex.slice(5, 7), 16)] as const);

/** RGB for a position 0…1 on the scale (clipped), interpolated linearly between stops. */
export function velocityRgb(t: number): [number, number, number] {
  const u = Math.max(0, Math.min(1, Number.isFinite(t) ? t : 0));
  for (let i = 1; i < STOP_RGB.length; i++) {
    const [t1, r1, g1, b1] = STOP_RGB[i]!;
    if (u <= t1) {
      const [t0, r0, g0, b0] = STOP_RGB[i - 1]!;
      const f = t1 === t0 ? 0 : (u - t0) / (t1 - t0);
      return [r0 + (r1 - r0) * f, g0 + (g1 - g0) * f, b0 + (b1 - b0) * f];
    }
  }
  const last = STOP_RGB.at(-1)!;
  return [last[1], last[2], last[3]];
}

/** Smallest and largest finite value (air NaN skipped); null when there is none. */
export function finiteRange(values: ArrayLike<number>): { min: number; max: number } | null {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return min <= max ? { min, max } : null;
}

/** One RGBA pixel per node (air transparent), ready for ImageData: width nx, height nz, iz outer. */
export function velocityPixels(values: ArrayLike<number>, range: { min: number; max: number }): Uint8ClampedArray<ArrayBuffer> {
  const out = new Uint8ClampedArray(values.length * 4);
  const span = range.max - range.min || 1;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (!Number.isFinite(v)) continue; // alpha stays 0: air
    const [r, g, b] = velocityRgb((v - range.min) / span);
    out[i * 4] = r;
    out[i * 4 + 1] = g;
    out[i * 4 + 2] = b;
    out[i * 4 + 3] = 255;
  }
  return out;
}
