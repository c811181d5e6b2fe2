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

/**
 * χ² per datum of a member's computed times against the original picks (not its perturbed ones):
 * perturbing picks by their sigma doubles their noise, so a member that fits its own picks as well
 * as the data allow shows χ² ≈ 2 against them, while its model explains the real picks to χ² ≈ 1.
 * `computed` is in the member's pick order; bootstrap copies map back to their shot by id.
 */
export function chi2AgainstOriginal(original: readonly InversionShot[], member: readonly InversionShot[], computed: ArrayLike<number>): number {
  const byId = new Map(original.map((s) => [s.shotId, s]));
  let sum = 0, count = 0, at = 0;
  for (const s of member) {
    const o = byId.get(s.shotId.split('#')[0])!;
    for (let i = 0; i < s.times.length; i++, at++) {
      const c = computed[at];
      if (!Number.isFinite(c)) continue;
      const r = (o.times[i] - c) / o.sigmas[i];
      sum += r * r;
      count++;
    }
  }
  return count ? sum / count : Number.NaN;
}
