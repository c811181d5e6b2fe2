/**
 * A member's picks: each time moved by a normal deviate scaled by its sigma (the picks' own stated
 * uncertainty), or the shots resampled with replacement (a bootstrap over shots, Efron & Tibshirani
 * 1993, "An Introduction to the Bootstrap", ch. 6: the shot is the unit that is independent, not the
 * pick, since one shot's picks share its timing and position errors).
 */
import type { InversionShot } from '../inversion/types';
import { mulberry32 } from '../random';
import type { MemberPlan } from './plan';

export function memberShots(shots: readonly InversionShot[], plan: Pick<MemberPlan, 'seed' | 'picks'>): InversionShot[] {
  const uniform = mulberry32(plan.seed);
  if (plan.picks === 'none') return shots.map((s) => ({ ...s }));
  if (plan.picks === 'bootstrap') {
    // Same number of shots, drawn with replacement; a shot drawn twice counts twice (ids kept apart).
    return shots.map((_, k) => {
      const s = shots[Math.min(shots.length - 1, Math.floor(uniform() * shots.length))];
      return { ...s, shotId: `${s.shotId}#${k + 1}` };
    });
  }
  const normal = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
  return shots.map((s) => ({
    ...s,
    // A time moved below zero is no time: it stays at zero (only at the source, where sigma is small).
    times: Float64Array.from(s.times, (t, i) => (t === 0 ? 0 : Math.max(0, t + s.sigmas[i] * normal()))),
  }));
}
