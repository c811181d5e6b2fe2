/**
 * Refractor branches: the picks of one shot side assigned to one refractor, ordered by x, with
 * the time at any x between them by linear interpolation (a missing trace or an irregular
 * spacing is bridged, nothing is extrapolated), and reversed pairs of branches with their
 * reciprocal time.
 */
import { leastSquares } from './robust-line';
import { MIN_BRANCH_PICKS } from './assign';
import { shotSides } from './sides';
import type { Assignment, LayerShot } from './types';

export interface Branch {
  shot: number;
  /** +1: the shot lies left of its branch (forward); −1: right of it (reverse). */
  direction: 1 | -1;
  sourceX: number;
  x: Float64Array;
  t: Float64Array;
}

/** Every geophone position of the line's picks (to the millimetre), in order along the line. */
export function lineGeophones(shots: readonly LayerShot[]): number[] {
  return [...new Set(shots.flatMap((s) => Array.from({ length: s.times.length }, (_, i) => +s.receivers[2 * i].toFixed(3))))].sort((a, b) => a - b);
}

export function refractorBranches(shots: readonly LayerShot[], assignment: Assignment, refractor: number): Branch[] {
  const out: Branch[] = [];
  for (const side of shotSides(shots)) {
    const shot = shots[side.shot];
    const picks = side.picks.filter((i) => assignment[side.shot][i] === refractor).sort((a, b) => shot.receivers[2 * a] - shot.receivers[2 * b]);
    if (picks.length < MIN_BRANCH_PICKS) continue;
    out.push({
      shot: side.shot,
      direction: side.direction,
      sourceX: shot.source.x,
      x: Float64Array.from(picks, (i) => shot.receivers[2 * i]),
      t: Float64Array.from(picks, (i) => shot.times[i]),
    });
  }
  return out;
}

/** Time on the branch at x (linear between picks); NaN outside the branch. */
export function timeAt(b: Branch, x: number): number {
  const n = b.x.length;
  const eps = 1e-6;
  if (x < b.x[0] - eps || x > b.x[n - 1] + eps) return Number.NaN;
  let lo = 0, hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (b.x[mid] <= x) lo = mid;
    else hi = mid;
  }
  if (hi === lo) return b.t[lo];
  const f = Math.min(1, Math.max(0, (x - b.x[lo]) / (b.x[hi] - b.x[lo])));
  return b.t[lo] + f * (b.t[hi] - b.t[lo]);
}

/** Per geophone, the pairs to read its delay from: the measured ones where any reaches it, otherwise all. */
export function pairsForGeophone(pairs: readonly ReversedPair[], x: number, reaches: (p: ReversedPair, x: number) => boolean): ReversedPair[] {
  const reaching = pairs.filter((p) => reaches(p, x));
  const measured = reaching.filter((p) => p.measured);
  return measured.length ? measured : reaching;
}

export interface ReversedPair {
  forward: Branch;
  reverse: Branch;
  /** Time from one shot to the other along the refractor (s). */
  reciprocal: number;
  /** Geophone positions both branches cover. */
  overlap: number[];
  /** Whether the reciprocal time was read between picks (true) or carried beyond a branch's end (false). */
  measured: boolean;
}

/**
 * Every forward branch with every reverse branch whose shot lies to its right and that share at
 * least three geophones. The reciprocal time is read on a branch at the other shot where the
 * branch reaches it (both readings averaged when both do: reciprocity); only when neither does is
 * it carried beyond the branches' ends on straight lines — on uneven ground a carried time misses
 * the delay under the far shot, so such pairs are used only where no measured pair reaches
 * (common practice, no source).
 */
export function reversedPairs(branches: readonly Branch[], geophones: readonly number[]): ReversedPair[] {
  const pairs: ReversedPair[] = [];
  const forward = branches.filter((b) => b.direction === 1);
  const reverse = branches.filter((b) => b.direction === -1);
  for (const f of forward) {
    for (const r of reverse) {
      if (!(r.sourceX > f.sourceX)) continue;
      const overlap = geophones.filter((x) => x > f.sourceX && x < r.sourceX && Number.isFinite(timeAt(f, x)) && Number.isFinite(timeAt(r, x)));
      if (overlap.length < MIN_BRANCH_PICKS) continue;
      const read = [timeAt(f, r.sourceX), timeAt(r, f.sourceX)].filter(Number.isFinite);
      const measured = read.length > 0;
      const reciprocal = measured ? read.reduce((a, b) => a + b, 0) / read.length : (carried(f, r.sourceX) + carried(r, f.sourceX)) / 2;
      if (!Number.isFinite(reciprocal)) continue;
      pairs.push({ forward: f, reverse: r, reciprocal, overlap, measured });
    }
  }
  return pairs;
}

/** The branch's time carried to x beyond its end: a line through its nearest eight picks. */
function carried(b: Branch, x: number): number {
  const n = b.x.length;
  const k = Math.min(n, 8);
  const near = x > b.x[n - 1] ? [n - k, n] : [0, k];
  const fit = leastSquares(b.x, b.t, near[0], near[1]);
  return fit.intercept + fit.slope * x;
}
