/**
 * Pieces of synthetic seismograms, for the demo records and the picker's measurements: a seeded
 * normal generator, a causal geophone-like wavelet, and band-limited noise. Deterministic.
 */
import { mulberry32 } from '../random';

/** Seeded normal deviates: mulberry32 uniforms through Box–Muller. */
export function normals(seed: number): () => number {
  const uniform = mulberry32(seed);
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/**
 * A geophone's impulse response, a damped oscillator: w(t) = e^(−2πfζt)·sin(2πf√(1−ζ²)t) for t ≥ 0,
 * 0 before (textbook damped harmonic oscillator; from memory). Causal: it starts exactly at t = 0.
 */
export function wavelet(t: number, f = 80, zeta = 0.3): number {
  if (t < 0) return 0;
  return Math.exp(-2 * Math.PI * f * zeta * t) * Math.sin(2 * Math.PI * f * Math.sqrt(1 - zeta * zeta) * t);
}

/** The largest value of `wavelet` for these parameters (scanned at 1 µs), to scale arrivals to a peak of 1. */
export function waveletPeak(f = 80, zeta = 0.3): number {
  let p = 0;
  for (let t = 0; t < 0.02; t += 1e-6) p = Math.max(p, wavelet(t, f, zeta));
  return p;
}

/** White noise through a one-pole high-pass (8 Hz) and two one-pole low-passes (300 Hz), scaled to unit RMS. */
export function bandLimitedNoise(n: number, dt: number, next: () => number): Float64Array {
  const out = new Float64Array(n);
  const aLow = 1 - Math.exp(-2 * Math.PI * 300 * dt), aHigh = Math.exp(-2 * Math.PI * 8 * dt);
  let l1 = 0, l2 = 0, hp = 0, prev = 0;
  for (let i = -200; i < n; i++) {
    l1 += aLow * (next() - l1);
    l2 += aLow * (l1 - l2);
    hp = aHigh * (hp + l2 - prev);
    prev = l2;
    if (i >= 0) out[i] = hp;
  }
  let s = 0;
  for (const v of out) s += v * v;
  const rms = Math.sqrt(s / n);
  return out.map((v) => v / rms);
}
