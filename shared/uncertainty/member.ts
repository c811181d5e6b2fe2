/**
 * One member's inversion problem: the ensemble's base problem with this member's draws applied —
 * its own picks (perturb.ts), its own starting gradient (the fitted v0 and k times the member's
 * factors; a start from a saved model is kept as it is), and its own regularisation weight: the
 * automatic schedule (which lowers the weight until the picks are explained) started at its usual
 * first weight times the member's factor; a base with a fixed weight: that weight times the factor.
 * So members differ in smoothness and path yet each stops where the discrepancy principle says.
 * Measured (docs/uncertainty.md): a fixed weight left 11 of 12 members unfitted at 0.2 ms noise; a
 * schedule started at the weight the base ended on, from another start, stalled most members above
 * χ² 1.33 on a three-layer line; a warm start from the base's final model already explained the
 * moved picks, so every member stayed the base model and the band shrank to nothing. Members
 * therefore start cold and run the whole schedule, at the cost of about one inversion each.
 */
import { gradientVelocity } from '../inversion/gradient-start';
import { AUTO_SMOOTHING_START } from '../inversion/invert';
import type { InversionProblem } from '../inversion/types';
import { memberShots } from './perturb';
import type { MemberPlan } from './plan';

export interface EnsembleBase {
  problem: InversionProblem;
  surfaceZ: (x: number) => number;
  /** The gradient fitted for the automatic start; null when the base started from a saved model. */
  fit: { v0: number; k: number } | null;
}

export function memberProblem(base: EnsembleBase, plan: MemberPlan): InversionProblem {
  const { problem } = base;
  const start = base.fit && (plan.v0Factor !== 1 || plan.kFactor !== 1)
    ? gradientVelocity(problem.grid, problem.active, base.surfaceZ, base.fit.v0 * plan.v0Factor, base.fit.k * plan.kFactor, problem.settings)
    : problem.start;
  return {
    ...problem,
    start,
    shots: memberShots(problem.shots, plan),
    ...(problem.settings.smoothing === null
      ? { settings: { ...problem.settings, checkerboard: false }, autoSmoothingStart: AUTO_SMOOTHING_START * plan.smoothingFactor }
      : { settings: { ...problem.settings, smoothing: problem.settings.smoothing * plan.smoothingFactor, checkerboard: false } }),
  };
}
