import { aicOnset } from './aic';
import { energyRatio, quietestEnergy, triggers } from './energy-ratio';

export interface PickerOptions {
  /** Short (leading) energy window, s; at least 4 samples. */
  shortWindow?: number;
  /** Long (trailing) energy window, s; at least 16 samples. */
  longWindow?: number;
  /** Energy ratio below which a trace has no clear arrival and stays unpicked. */
  minRatio?: number;
  /** Local SNR (RMS after the onset over RMS before) below which a candidate is noise. */
  minSnr?: number;
  /** A candidate counts when its local SNR reaches this fraction of the best candidate's. */
  candidateFraction?: number;
}

export interface TracePick {
  /** First-arrival time after the shot (s), with the record's delay applied. */
  time: number;
  /** Sample index of the onset. */
  index: number;
  /** 0–1: how clearly the arrival stands out of the noise before it. */
  quality: number;
  /** Pick uncertainty (s), from the quality. */
  sigma: number;
  /** Post-onset over pre-onset RMS amplitude. */
  snr: number;
}

export type PickOutcome = { ok: true; pick: TracePick } | { ok: false; reason: 'dead' | 'no_arrival' };

const DEFAULTS = { shortWindow: 0.002, longWindow: 0.01, minRatio: 8, minSnr: 3, candidateFraction: 0.25 };

/**
 * Picks the first break on one trace: the energy ratio (Allen 1978) finds the arrival, the AIC
 * minimum (Maeda 1985) in a window around it places the onset. A trace that is flat (dead) or whose
 * energy never rises clearly above the noise before it is left unpicked.
 * The quality is the signal-to-noise ratio measured around the onset, mapped to 0–1; sigma follows
 * it (docs/records.md gives the measured errors behind the mapping).
 */
export function pickTrace(samples: Float64Array, sampleInterval: number, delay: number, options: PickerOptions = {}): PickOutcome {
  const found = traceCandidates(samples, sampleInterval, delay, options);
  return found === 'dead' ? { ok: false, reason: 'dead' } : firstBreak(found, options);
}

/** pickTrace's choice among a live trace's candidates. */
export function firstBreak(found: TraceCandidates, options: PickerOptions = {}): PickOutcome {
  const o = { ...DEFAULTS, ...options };
  // The first break is the first candidate that stands out nearly as well as the best one (later
  // arrivals are often stronger; chance bursts of noise are weaker).
  const { candidates } = found;
  if (!candidates.length) return { ok: false, reason: 'no_arrival' };
  const best = Math.max(...candidates.map((c) => c.snr));
  const chosen = candidates.find((c) => c.snr >= Math.max(o.minSnr, best * o.candidateFraction));
  if (!chosen) return { ok: false, reason: 'no_arrival' };
  return pickAt(found, chosen);
}

/** A possible first break on a trace: the AIC onset of one rise of the energy ratio, and the SNR around it. */
export interface Candidate {
  index: number;
  snr: number;
}

/** A live trace ready for picking: demeaned samples, the candidates, and what pickAt needs. */
export interface TraceCandidates {
  x: Float64Array;
  candidates: Candidate[];
  sampleInterval: number;
  delay: number;
  /** Sample index of time 0 (the shot). */
  shot: number;
}

/**
 * Every rise of the energy ratio (Allen 1978) above `minRatio` after the shot, each with its AIC
 * onset (Maeda 1985) and the SNR around it, earliest first; 'dead' for a flat trace.
 */
export function traceCandidates(samples: Float64Array, sampleInterval: number, delay: number, options: PickerOptions = {}): TraceCandidates | 'dead' {
  const o = { ...DEFAULTS, ...options };
  const n = samples.length;
  if (isDead(samples)) return 'dead';
  const x = demeaned(samples);
  const short = Math.max(4, Math.round(o.shortWindow / sampleInterval));
  const long = Math.max(16, Math.round(o.longWindow / sampleInterval));
  // The arrival cannot come before the shot: search from time 0 (a pre-trigger is noise).
  const shot = Math.max(0, Math.ceil(-delay / sampleInterval));
  const ratio = energyRatio(x, shot + 4, short, long);
  const noise = Math.sqrt(quietestEnergy(x, long));
  const candidates = triggers(ratio, o.minRatio, short).map((peak) => {
    const index = aicOnset(x, Math.max(shot, peak - long), Math.min(n, peak + short));
    return { index, snr: localSnr(x, index, short, long, noise) };
  });
  return { x, candidates, sampleInterval, delay, shot };
}

/**
 * The pick for an arrival whose energy peaks at sample `peak` (found by other means, e.g. a stack
 * with the neighbours): the AIC onset before it and the SNR around it, refined as pickTrace's.
 */
export function pickBefore(t: TraceCandidates, peak: number, options: PickerOptions = {}): PickOutcome {
  const o = { ...DEFAULTS, ...options };
  const short = Math.max(4, Math.round(o.shortWindow / t.sampleInterval));
  const long = Math.max(16, Math.round(o.longWindow / t.sampleInterval));
  const index = aicOnset(t.x, Math.max(t.shot, peak - long), Math.min(t.x.length, peak + short));
  const snr = localSnr(t.x, index, short, long, Math.sqrt(quietestEnergy(t.x, long)));
  return refined(t.x, index, snr, t.sampleInterval, t.delay, t.shot);
}

/** Short and long energy windows in samples, as the picker uses them. */
export function windowsOf(sampleInterval: number, options: PickerOptions = {}): { short: number; long: number } {
  const o = { ...DEFAULTS, ...options };
  return { short: Math.max(4, Math.round(o.shortWindow / sampleInterval)), long: Math.max(16, Math.round(o.longWindow / sampleInterval)) };
}

/** The pick at one candidate, refined (below). */
export function pickAt(t: TraceCandidates, c: Candidate): PickOutcome {
  return refined(t.x, c.index, c.snr, t.sampleInterval, t.delay, t.shot);
}

/**
 * The onset inside a time window (s after the shot) where the arrival is expected, e.g. from the
 * neighbouring traces' picks: the AIC minimum of the window, refined as above, with its SNR.
 */
export function pickInWindow(samples: Float64Array, sampleInterval: number, delay: number, from: number, to: number, options: PickerOptions = {}): PickOutcome {
  const o = { ...DEFAULTS, ...options };
  const n = samples.length;
  if (isDead(samples)) return { ok: false, reason: 'dead' };
  const x = demeaned(samples);
  const shot = Math.max(0, Math.ceil(-delay / sampleInterval));
  const lo = Math.max(shot, Math.floor((from - delay) / sampleInterval)), hi = Math.min(n, Math.ceil((to - delay) / sampleInterval));
  if (hi - lo < 8) return { ok: false, reason: 'no_arrival' };
  const short = Math.max(4, Math.round(o.shortWindow / sampleInterval));
  const long = Math.max(16, Math.round(o.longWindow / sampleInterval));
  const index = aicOnset(x, lo, hi);
  const snr = localSnr(x, index, short, long, Math.sqrt(quietestEnergy(x, long)));
  if (snr < o.minSnr) return { ok: false, reason: 'no_arrival' };
  return refined(x, index, snr, sampleInterval, delay, shot);
}

function refined(x: Float64Array, onset: number, snr: number, sampleInterval: number, delay: number, shot: number): PickOutcome {
  // Refine: the AIC of the first difference within ±1 ms of the onset. A causal arrival starts
  // at zero amplitude but with a jump in slope, so the difference has a sharper onset than the samples.
  const near = Math.max(2, Math.round(0.001 / sampleInterval)); // ±1 ms: a refinement, not a new search
  const index = aicOnset(difference(x), Math.max(shot, onset - near), Math.min(x.length, onset + near));
  const quality = qualityOf(snr);
  // The onset lies between the last noise sample and the first signal sample: take the midpoint.
  return { ok: true, pick: { time: delay + (index - 0.5) * sampleInterval, index, quality, sigma: sigmaOf(quality, sampleInterval), snr } };
}

/** Flat (all samples equal, e.g. zero) or a channel that never varies by more than rounding. */
export function isDead(samples: Float64Array): boolean {
  let min = Infinity, max = -Infinity;
  for (const v of samples) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return !(max > min);
}

function difference(x: Float64Array): Float64Array {
  const d = new Float64Array(x.length);
  for (let i = 1; i < x.length; i++) d[i] = x[i] - x[i - 1];
  return d;
}

/** Removes a DC offset: the median, which oscillating arrivals hardly move (a mean would). */
function demeaned(samples: Float64Array): Float64Array {
  const sorted = Float64Array.from(samples).sort();
  const median = sorted[sorted.length >> 1];
  return samples.map((v) => v - median);
}

/** RMS of the `short·2` samples after the onset over the RMS of the `long` samples before it (at least `noise`, the quietest stretch's RMS). */
function localSnr(x: Float64Array, index: number, short: number, long: number, noise: number): number {
  const rms = (a: number, b: number) => {
    let s = 0;
    for (let i = a; i < b; i++) s += x[i] * x[i];
    return Math.sqrt(s / Math.max(1, b - a));
  };
  const before = Math.max(noise, rms(Math.max(0, index - long), index));
  const after = rms(index, Math.min(x.length, index + 2 * short));
  return before > 0 ? after / before : Infinity;
}

/** Quality 0–1 from the local SNR: 0 at SNR 2, 1 at SNR 20 and above, linear in log SNR. */
export const qualityOf = (snr: number): number => Math.min(1, Math.max(0, Math.log(snr / 2) / Math.log(10)));

/** Sigma from quality: one sample plus up to 2 ms as the quality falls to 0. */
export const sigmaOf = (quality: number, sampleInterval: number): number => sampleInterval + 0.002 * (1 - quality);
