/**
 * One member's inversion problem: the ensemble's base problem with this member's draws applied —
 * its own picks (perturb.ts), its own starting gradient (the fitted v0 and k times the member's
 * factors; a start from a saved model is kept as it is), and its own regularisation weight: the
 * automatic schedule started at the weight the base inversion ended on times the member's factor
 * (a base with a fixed weight: that weight times the factor). Each member then stops, as the base
 * did, at the first weight that explains the picks, so members differ in smoothness yet fit.
 * (Measured: a fixed weight instead left 11 of 12 members unfitted at 0.2 ms noise.)
 */
import { gradientVelocity } from '../inversion/gradient-start';
import type { InversionProblem } from '../inversion/types';
import { memberShots } from './perturb';
import type { MemberPlan } from './plan';

export interface EnsembleBase {
  problem: InversionProblem;
  surfaceZ: (x: number) => number;
  /** The gradient fitted for the automatic start; null when the base started from a saved model. */
  fit: { v0: number; k: number } | null;
  /** The regularisation weight of the base inversion's last step (used when it ran the automatic schedule). */
  finalSmoothing: number;
}

export function memberProblem(base: EnsembleBase, plan: MemberPlan): InversionProblem {
  const { problem } = base;
  const start =
    base.fit && (plan.v0Factor !== 1 || plan.kFactor !== 1)
      ? gradientVelocity(problem.grid, problem.active, base.surfaceZ, base.fit.v0 * plan.v0Factor, base.fit.k * plan.kFactor, problem.settings)
      : problem.start;
  return {
    ...problem,
    start,
    shots: memberShots(problem.shots, plan),
    ...(problem.settings.smoothing === null
      ? { settings: { ...problem.settings, checkerboard: false }, autoSmoothingStart: base.finalSmoothing * plan.smoothingFactor }
      : { settings: { ...problem.settings, smoothing: problem.settings.smoothing * plan.smoothingFactor, checkerboard: false } }),
  };
}
