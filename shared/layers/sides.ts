/**
 * A shot's picks on one side of the source, in order of increasing offset: the travel-time
 * curve the layer methods read. Offsets are horizontal distances along the line (m).
 */
import type { LayerShot } from './types';

export interface ShotSide {
  shot: number;
  /** +1: receivers to the right of the source (x > source x); −1: to the left. */
  direction: 1 | -1;
  /** Pick indices within the shot, by increasing offset. */
  picks: number[];
  offsets: Float64Array;
  times: Float64Array;
}

export function shotSides(shots: readonly LayerShot[]): ShotSide[] {
  const sides: ShotSide[] = [];
  shots.forEach((shot, s) => {
    for (const direction of [-1, 1] as const) {
      const picks: number[] = [];
      for (let i = 0; i < shot.times.length; i++) {
        const dx = shot.receivers[2 * i] - shot.source.x;
        if (dx * direction > 0 && Number.isFinite(shot.times[i])) picks.push(i);
      }
      picks.sort((a, b) => Math.abs(shot.receivers[2 * a] - shot.source.x) - Math.abs(shot.receivers[2 * b] - shot.source.x));
      if (!picks.length) continue;
      sides.push({
        shot: s,
        direction,
        picks,
        offsets: Float64Array.from(picks, (i) => Math.abs(shot.receivers[2 * i] - shot.source.x)),
        times: Float64Array.from(picks, (i) => shot.times[i]),
      });
    }
  });
  return sides;
}
