/**
 * One member's inversion problem: the ensemble's base problem with this member's draws applied —
 * its own picks (perturb.ts), its own starting gradient (the fitted v0 and k times the member's
 * factors; a start from a saved model is kept as it is), and a fixed regularisation weight: the
 * weight the automatic schedule ended on in the base inversion, times the member's factor. A fixed
 * weight, not the schedule, so members really differ in smoothness; those that then fit the picks
 * poorly are left out when the members are combined (combine.ts).
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
  /** The regularisation weight of the base inversion's last step. */
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
    settings: { ...problem.settings, smoothing: base.finalSmoothing * plan.smoothingFactor, checkerboard: false },
  };
}
