/**
 * Synthetic shot gathers for measuring the first-break picker: first-arrival times from the engine
 * (two flat layers, 600 over 2500 m/s, interface 8 m deep, 49 geophones every 2 m, 11 shots —
 * tests/references/inversion/surveys.ts), a causal wavelet starting exactly at that time, later
 * arrivals, band-limited noise at a chosen SNR, dead (all-zero) and reversed traces.
 * SNR = peak amplitude of the first-arrival wavelet ÷ RMS of the noise (common practice, no source).
 */
import { bandLimitedNoise, normals, wavelet, waveletPeak } from '../../shared/records/synthetic-trace';
import { layeredModel, layeredSurvey } from '../../tests/references/inversion/surveys';

export interface SyntheticTrace {
  samples: Float64Array;
  /** True first-arrival time (s); null for a dead trace. */
  truth: number | null;
  reversed: boolean;
}

export const SAMPLE_INTERVAL = 0.00025;
export const SAMPLES = 800;

const PEAK = waveletPeak();

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
