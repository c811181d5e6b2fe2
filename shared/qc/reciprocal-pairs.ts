/**
 * Reciprocal times: the travel time from A's source to a receiver at B's source equals the time
 * from B's source to a receiver at A's source, because ray paths are reversible. Their difference
 * measures pick and trigger consistency between the two shots (the reciprocal time of the plus-minus
 * and generalised reciprocal methods: Hagedoorn 1959, Geophysical Prospecting 7, 158–182;
 * Palmer 1980, "The generalized reciprocal method of seismic refraction interpretation", SEG — from memory).
 *
 * Excluded and non-finite picks are ignored. Shots sharing a source position (within the position
 * tolerance) are repeats, not a reciprocal pair, and are skipped. When several receivers of a shot lie
 * within the tolerance of the other source, the nearest is used (ties: the lower pick index).
 */
import type { QcPick } from './types';
import { QC_DEFAULTS, TIME_ROUNDING_S } from './defaults';
import { compareIds, groupByShot, type ShotGroup } from './shots';

export interface ReciprocalPair {
  shotA: string;
  shotB: string;
  /** Time of A's pick at B's source position, s. */
  tAB: number;
  /** Time of B's pick at A's source position, s. */
  tBA: number;
  /** |tAB − tBA|, s. */
  difference: number;
  /** difference > toleranceS. */
  flagged: boolean;
  /** Pick indices (QcPick.index) of the two picks. */
  indexAB: number;
  indexBA: number;
}

export interface ReciprocalOptions {
  /** s, default 0.002 (common practice, no source). */
  toleranceS?: number;
  /** m, default 0.25 (common practice, no source). */
  positionTolerance?: number;
}

export function findReciprocalPairs(picks: readonly QcPick[], options: ReciprocalOptions = {}): ReciprocalPair[] {
  const toleranceS = nonNegative('toleranceS', options.toleranceS ?? QC_DEFAULTS.reciprocalToleranceS);
  const positionTolerance = nonNegative('positionTolerance', options.positionTolerance ?? QC_DEFAULTS.positionToleranceM);
  const shots = groupByShot(picks).sort((a, b) => compareIds(a.shotId, b.shotId));
  const pairs: ReciprocalPair[] = [];
  for (let i = 0; i < shots.length; i++) {
    for (let j = i + 1; j < shots.length; j++) {
      const A = shots[i];
      const B = shots[j];
      if (Math.abs(A.sourceX - B.sourceX) <= positionTolerance) continue;
      const ab = nearestReceiver(picks, A, B.sourceX, positionTolerance);
      const ba = nearestReceiver(picks, B, A.sourceX, positionTolerance);
      if (ab < 0 || ba < 0) continue;
      const tAB = picks[ab].time;
      const tBA = picks[ba].time;
      const difference = Math.abs(tAB - tBA);
      pairs.push({
        shotA: A.shotId, shotB: B.shotId, tAB, tBA, difference,
        flagged: difference > toleranceS + TIME_ROUNDING_S,
        indexAB: picks[ab].index, indexBA: picks[ba].index,
      });
    }
  }
  return pairs;
}

/** Array position of the shot's pick nearest to x within tol, or −1. Members are sorted by x: binary search. */
function nearestReceiver(picks: readonly QcPick[], shot: ShotGroup, x: number, tol: number): number {
  const m = shot.members;
  let lo = 0;
  let hi = m.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (picks[m[mid]].receiverX < x - tol) lo = mid + 1;
    else hi = mid;
  }
  let best = -1;
  let bestDist = Infinity;
  for (let k = lo; k < m.length && picks[m[k]].receiverX <= x + tol; k++) {
    const d = Math.abs(picks[m[k]].receiverX - x);
    if (d < bestDist || (d === bestDist && picks[m[k]].index < picks[best].index)) {
      best = m[k];
      bestDist = d;
    }
  }
  return best;
}

function nonNegative(name: string, v: number): number {
  if (!Number.isFinite(v) || v < 0) throw new RangeError(`${name} must be a finite number ≥ 0, got ${v}`);
  return v;
}
