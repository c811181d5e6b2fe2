/**
 * Pick misfit: χ² = (1/N) Σ ((t_obs − t_calc)/σ)² over the N picks the wave reaches (the
 * normalised chi-square; 1 when the residuals are as large as the pick uncertainties say;
 * Aster, Borchers & Thurber 2018, §2.2), and the RMS residual in milliseconds.
 */
import type { InversionShot } from './types';

export interface Misfit {
  chi2: number;
  rmsMs: number;
  /** Picks the wave reached (finite computed time). */
  used: number;
}

export function observed(shots: readonly InversionShot[]): { times: Float64Array; sigmas: Float64Array } {
  const total = shots.reduce((n, s) => n + s.times.length, 0);
  const times = new Float64Array(total);
  const sigmas = new Float64Array(total);
  let at = 0;
  for (const s of shots) {
    times.set(s.times, at);
    sigmas.set(s.sigmas, at);
    at += s.times.length;
  }
  return { times, sigmas };
}

export function misfit(obs: Float64Array, sigma: Float64Array, computed: Float64Array): Misfit {
  let chi = 0;
  let sq = 0;
  let used = 0;
  for (let i = 0; i < obs.length; i++) {
    if (!Number.isFinite(computed[i])) continue;
    const r = obs[i] - computed[i];
    chi += (r / sigma[i]) ** 2;
    sq += r * r;
    used++;
  }
  return used ? { chi2: chi / used, rmsMs: 1000 * Math.sqrt(sq / used), used } : { chi2: Infinity, rmsMs: Infinity, used: 0 };
}
