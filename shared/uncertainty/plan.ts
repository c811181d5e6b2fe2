/**
 * The members of an ensemble of inversions (issue 20; Monte Carlo appraisal after Lanz, Maurer &
 * Green 1998, Geophysics 63(4), 1457–1469): each member repeats the inversion with what is uncertain
 * drawn anew from its own recorded seed, so any member can be rerun exactly and a killed one resumed.
 */
import { mulberry32 } from '../random';

export type PickVariation = 'none' | 'sigma' | 'bootstrap';

export interface EnsembleVariation {
  /** Vary the starting 1-D gradient (v0 and k) around the one fitted to the travel-time curves. */
  start: boolean;
  /** Vary the regularisation weight around the automatic choice. */
  smoothing: boolean;
  /** Perturb each pick within its sigma, resample the shots (bootstrap), or keep the picks. */
  picks: PickVariation;
}

export interface MemberPlan {
  index: number;
  /** The member's own seed (for its pick perturbation), from the ensemble's seed. */
  seed: number;
  /** Factors on the fitted gradient's v0 and k (1 when the start is not varied). */
  v0Factor: number;
  kFactor: number;
  /** Factor on the regularisation weight (1 when not varied). */
  smoothingFactor: number;
  picks: PickVariation;
}

/**
 * Spreads drawn log-uniformly, so a factor and its inverse are equally likely: v0 within ×/÷ 1.25
 * and k within ×/÷ 2 of the fitted gradient (a starting model a geophysicist would still accept
 * from the curves), the weight within ×/÷ 3 of the automatic one. Common practice, no source: the
 * ranges are ours and documented with the results (docs/uncertainty.md).
 */
export const SPREAD = { v0: 1.25, k: 2, smoothing: 3 } as const;

const logUniform = (u: number, factor: number) => Math.exp((2 * u - 1) * Math.log(factor));

/** n members of an ensemble from its seed: member i always gets the same draws. */
export function planMembers(n: number, seed: number, variation: EnsembleVariation): MemberPlan[] {
  const next = mulberry32(seed);
  return Array.from({ length: n }, (_, index) => {
    const [a, b, c, d] = [next(), next(), next(), next()];
    return {
      index,
      seed: Math.floor(d * 2 ** 32) >>> 0,
      v0Factor: variation.start ? logUniform(a, SPREAD.v0) : 1,
      kFactor: variation.start ? logUniform(b, SPREAD.k) : 1,
      smoothingFactor: variation.smoothing ? logUniform(c, SPREAD.smoothing) : 1,
      picks: variation.picks,
    };
  });
}

/**
 * A member's rock velocity v*, log-uniform in [min, max], from a stream of its own seed apart from its
 * pick draws: with a range, the depth band also covers the choice of v* (a sharp contact's iso-depth
 * moves with v*, and no single v* is the contact).
 */
export function memberRockVelocity(seed: number, min: number, max: number): number {
  if (!(max > min)) return min;
  const u = mulberry32((seed ^ 0x5bd1e995) >>> 0)();
  return min * Math.exp(u * Math.log(max / min));
}
