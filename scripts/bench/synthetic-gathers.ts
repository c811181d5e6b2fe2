/**
 * Synthetic shot gathers for measuring the first-break picker: first-arrival times from the engine
 * (two flat layers, 600 over 2500 m/s, interface 8 m deep, 49 geophones every 2 m, 11 shots —
 * tests/references/inversion/surveys.ts), a causal wavelet starting exactly at that time, later
 * arrivals, band-limited noise at a chosen SNR, dead (all-zero) and reversed traces.
 * SNR = peak amplitude of the first-arrival wavelet ÷ RMS of the noise (common practice, no source).
 */
import { layeredModel, layeredSurvey } from '../../tests/references/inversion/surveys';

export interface SyntheticTrace {
  samples: Float64Array;
  /** True first-arrival time (s); null for a dead trace. */
  truth: number | null;
  reversed: boolean;
}

export const SAMPLE_INTERVAL = 0.00025;
export const SAMPLES = 800;

/** Seeded uniform deviates (mulberry32) and normal deviates (Box–Muller). */
function normals(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/**
 * A geophone's impulse response, a damped oscillator: w(t) = e^(−2πfζt)·sin(2πf√(1−ζ²)t) for t ≥ 0,
 * 0 before (textbook damped harmonic oscillator; from memory). Causal: it starts exactly at t = 0.
 */
function wavelet(t: number, f = 80, zeta = 0.3): number {
  if (t < 0) return 0;
  return Math.exp(-2 * Math.PI * f * zeta * t) * Math.sin(2 * Math.PI * f * Math.sqrt(1 - zeta * zeta) * t);
}
const PEAK = (() => {
  let p = 0;
  for (let t = 0; t < 0.02; t += 1e-6) p = Math.max(p, wavelet(t));
  return p;
})();

/** White noise through a one-pole high-pass (8 Hz) and two one-pole low-passes (300 Hz), scaled to unit RMS. */
function bandLimitedNoise(n: number, dt: number, next: () => number): Float64Array {
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

let times: { shot: number; receivers: number[]; times: number[] }[] | null = null;
/** Engine travel times for the survey (computed once). */
export function surveyTimes() {
  times ??= layeredSurvey(layeredModel([600, 2500], [8], 40), 0).map((s) => ({
    shot: s.source.x,
    receivers: Array.from({ length: s.times.length }, (_, i) => s.receivers[2 * i]),
    times: Array.from(s.times),
  }));
  return times;
}

/** Every gather of the survey at one SNR; trace k of a gather is dead when k % 13 === 5, reversed when k % 7 === 3. */
export function syntheticGathers(snr: number, seed = 1): SyntheticTrace[][] {
  const next = normals(seed + Math.round(snr * 1000));
  return surveyTimes().map((shot) =>
    shot.times.map((t0, k) => {
      if (k % 13 === 5) return { samples: new Float64Array(SAMPLES), truth: null, reversed: false };
      const offset = Math.abs(shot.receivers[k] - shot.shot);
      const amplitude = 1 / Math.sqrt(1 + offset / 10); // weaker with offset; the noise scales with it
      const later = t0 + 0.004 + offset / 1500; // a slower, stronger later arrival
      const noise = bandLimitedNoise(SAMPLES, SAMPLE_INTERVAL, next);
      const sign = k % 7 === 3 ? -1 : 1;
      const samples = new Float64Array(SAMPLES);
      for (let i = 0; i < SAMPLES; i++) {
        const t = i * SAMPLE_INTERVAL;
        const signal = (wavelet(t - t0) + 2 * wavelet(t - later, 40, 0.2)) / PEAK;
        samples[i] = sign * amplitude * (signal + noise[i] / snr);
      }
      return { samples, truth: t0, reversed: sign < 0 };
    }),
  );
}
