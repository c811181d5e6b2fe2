/**
 * Velocity of the top layer from the direct-wave picks of every shot: one slowness through the
 * origin of every curve (t = distance / V1), least squares over all of them, then again without
 * picks more than three robust standard deviations off (common practice, no source).
 */
import { median } from './robust-line';
import type { Assignment, LayerShot } from './types';

export function directVelocity(shots: readonly LayerShot[], assignment: Assignment): number {
  const d: number[] = [];
  const t: number[] = [];
  shots.forEach((shot, s) => {
    for (let i = 0; i < shot.times.length; i++) {
      if (assignment[s][i] !== 0) continue;
      const r = Math.hypot(shot.receivers[2 * i] - shot.source.x, shot.receivers[2 * i + 1] - shot.source.z);
      if (r > 0) {
        d.push(r);
        t.push(shot.times[i]);
      }
    }
  });
  if (d.length < 2) return Number.NaN;
  const fit = (keep: (i: number) => boolean) => {
    let sxx = 0, sxy = 0;
    for (let i = 0; i < d.length; i++) if (keep(i)) [sxx, sxy] = [sxx + d[i] * d[i], sxy + d[i] * t[i]];
    return sxy / sxx;
  };
  const slowness = fit(() => true);
  const residuals = d.map((di, i) => t[i] - slowness * di);
  const spread = 1.4826 * median(residuals.map((r) => Math.abs(r - median(residuals))));
  const trimmed = spread > 0 ? fit((i) => Math.abs(residuals[i]) <= 3 * spread) : slowness;
  return 1 / trimmed;
}
