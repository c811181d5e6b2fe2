/**
 * A plain-words reading of a run's misfit. χ² per datum = mean of (residual/σ)²: when the model
 * is right and σ are honest, it scatters about 1 with standard deviation √(2/N) for N picks
 * (a χ² variable with N degrees of freedom has mean N and variance 2N; Bevington & Robinson,
 * "Data Reduction and Error Analysis for the Physical Sciences", 3rd ed., 2003, ch. 11 — from memory).
 * A forward run fits no parameters, so the degrees of freedom are the pick count.
 */

export type VerdictTone = 'good' | 'caution' | 'poor' | 'note';

export interface Verdict {
  tone: VerdictTone;
  headline: string;
  detail: string;
}

export interface ChiSquareBand {
  /** Below this the picks agree better than their σ allow: σ are probably too large. */
  lower: number;
  /** Up to this the misfit is within the pick uncertainty. */
  upper: number;
  /** Beyond this the misfit is far outside the pick uncertainty. */
  far: number;
}

/**
 * The band of χ² per datum that a correct model with honest σ would reach: 1 ± 3·√(2/N),
 * but never tighter than 1 ± 0.25 (σ are themselves estimates) and never below 0.
 */
export function chiSquareBand(picks: number): ChiSquareBand {
  const spread = picks > 0 ? 3 * Math.sqrt(2 / picks) : Number.POSITIVE_INFINITY;
  const halfWidth = Math.max(0.25, spread);
  const upper = 1 + halfWidth;
  return { lower: Math.max(0, 1 - halfWidth), upper, far: Math.max(4, 2 * upper) };
}

const list = (ids: string[]): string => {
  if (ids.length <= 1) return ids.join('');
  return `${ids.slice(0, -1).join(', ')} and ${ids.at(-1)}`;
};

/** The verdict for a finished run. `worstShots` are shot ids, worst first. */
export function misfitVerdict(input: { chi2: number; picks: number; rmsMs: number; worstShots: string[] }): Verdict {
  const { chi2, picks, rmsMs, worstShots } = input;
  if (!(picks > 0) || !Number.isFinite(chi2)) {
    return { tone: 'note', headline: 'No picks were compared.', detail: 'Every pick is excluded, so this run says nothing about the model.' };
  }
  const band = chiSquareBand(picks);
  const look = worstShots.length ? ` Start with shot${worstShots.length > 1 ? 's' : ''} ${list(worstShots.slice(0, 3))}.` : '';
  if (chi2 < band.lower) {
    return {
      tone: 'note',
      headline: 'The fit is closer than the stated pick uncertainties.',
      detail: `χ² per datum is ${chi2.toFixed(2)}, well under 1: the picks agree with the model better than their σ allow. The uncertainties may be overstated; tighter σ would make the comparison of models sharper.`,
    };
  }
  if (chi2 <= band.upper) {
    return {
      tone: 'good',
      headline: 'The model explains the picks to within their stated uncertainty.',
      detail: `χ² per datum is ${chi2.toFixed(2)} (about 1 is expected when the model is right and σ are honest), RMS ${rmsMs.toFixed(2)} ms. Other models may fit as well: a good fit does not make this one unique.`,
    };
  }
  if (chi2 <= band.far) {
    return {
      tone: 'caution',
      headline: 'The misfit is somewhat beyond the pick uncertainty.',
      detail: `χ² per datum is ${chi2.toFixed(2)}: the residuals are larger than σ explain. Look at the worst shots for a pattern (one refractor too fast or too slow, a wrong depth at one end) or for a few bad picks.${look}`,
    };
  }
  return {
    tone: 'poor',
    headline: 'The model does not explain the picks.',
    detail: `χ² per datum is ${chi2.toFixed(2)}, far beyond the pick uncertainty (RMS ${rmsMs.toFixed(2)} ms). Check that the pick set belongs to this model's line and datum, then revise the layers the worst shots travel through.${look}`,
  };
}
