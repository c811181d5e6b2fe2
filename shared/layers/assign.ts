/**
 * Automatic assignment of picks to refractors from the slope breaks of each travel-time curve:
 * each side of each shot is cut into straight segments of decreasing slope — the direct wave
 * through the origin (absent on a far shot's curve), then one segment per refractor — by
 * exhaustive least squares over the
 * break points; a break is kept only when it pays for itself by the Bayesian information
 * criterion with the picks' own sigma (Schwarz 1978, Ann. Stat. 6, 461–464, from memory).
 * Segmenting the curves into straight branches is the common practice of refraction
 * interpretation (Telford, Geldart & Sheriff 1990, Applied Geophysics, 2nd ed., §4.3).
 * Curves with fewer breaks than refractors have their branches matched to the refractors
 * whose slopes are nearest those of the curves that show every branch.
 */
import { median } from './robust-line';
import { shotSides, type ShotSide } from './sides';
import type { Assignment, LayerShot } from './types';

/** Fewest picks on a refractor branch (two points always fit a line). */
export const MIN_BRANCH_PICKS = 3;
/** A deeper branch must be at least this much less steep (slowness ratio). */
const SLOPE_DROP = 0.97;

export interface Segmentation {
  /** Whether the first branch is the direct wave (through the origin); a far shot's curve has none. */
  direct: boolean;
  /** Index (into the side's picks) where each branch after the first starts. */
  breaks: number[];
  slopes: number[];
}

export function assignRefractors(shots: readonly LayerShot[], layers: number): Assignment {
  const assignment: Assignment = shots.map((s) => new Int8Array(s.times.length).fill(-1));
  const sides = shotSides(shots);
  const sigma = median(shots.flatMap((s) => Array.from(s.sigmas))) || 0.0005;
  const fits = sides.map((side) => segmentSide(side, layers, sigma));
  // Global slowness per refractor from the curves that show every branch.
  const full = fits.filter((f) => f.direct && f.slopes.length === layers);
  const reference = Array.from({ length: layers }, (_, k) => median(full.map((f) => f.slopes[k])));
  sides.forEach((side, i) => {
    const fit = fits[i];
    const labels = labelBranches(fit, reference);
    const starts = [0, ...fit.breaks, side.picks.length];
    for (let b = 0; b < labels.length; b++) {
      for (let k = starts[b]; k < starts[b + 1]; k++) assignment[side.shot][side.picks[k]] = labels[b];
    }
  });
  return assignment;
}

/** Branch k of a curve → layer index; curves missing branches match them by slope, keeping their order. */
function labelBranches(fit: Segmentation, reference: number[]): number[] {
  const layers = reference.length;
  const { slopes, direct } = fit;
  const first = direct ? 1 : 0;
  const natural = slopes.map((_, k) => k + (direct ? 0 : 1));
  if ((direct && slopes.length === layers) || reference.slice(1).some((r) => !Number.isFinite(r))) return natural;
  // The direct wave is layer 0; the refractor branches take increasing layers by nearest slope.
  let best: number[] = [];
  let bestCost = Infinity;
  const choose = (k: number, from: number, labels: number[], cost: number): void => {
    if (k === slopes.length) {
      if (cost < bestCost) [best, bestCost] = [labels.slice(), cost];
      return;
    }
    for (let layer = from; layer < layers; layer++) {
      labels.push(layer);
      choose(k + 1, layer + 1, labels, cost + Math.abs(Math.log(slopes[k] / reference[layer])));
      labels.pop();
    }
  };
  choose(first, 1, direct ? [0] : [], 0);
  return best.length === slopes.length ? best : natural;
}

/** Best segmentation of one curve into 1 … `layers` branches. */
export function segmentSide(side: ShotSide, layers: number, sigma: number): Segmentation {
  const x = side.offsets, y = side.times;
  const n = x.length;
  // Prefix sums: any range's least-squares fit in constant time.
  const S = { x: new Float64Array(n + 1), y: new Float64Array(n + 1), xx: new Float64Array(n + 1), xy: new Float64Array(n + 1), yy: new Float64Array(n + 1) };
  for (let i = 0; i < n; i++) {
    S.x[i + 1] = S.x[i] + x[i];
    S.y[i + 1] = S.y[i] + y[i];
    S.xx[i + 1] = S.xx[i] + x[i] * x[i];
    S.xy[i + 1] = S.xy[i] + x[i] * y[i];
    S.yy[i + 1] = S.yy[i] + y[i] * y[i];
  }
  const sum = (a: Float64Array, i: number, j: number) => a[j] - a[i];
  /** Direct wave through the origin, picks [0, j). */
  const direct = (j: number) => {
    const sxx = sum(S.xx, 0, j), sxy = sum(S.xy, 0, j);
    const slope = sxx > 0 ? sxy / sxx : 0;
    return { slope, rss: Math.max(0, sum(S.yy, 0, j) - slope * sxy) };
  };
  /** Free line over picks [i, j). */
  const line = (i: number, j: number) => {
    const m = j - i;
    const mx = sum(S.x, i, j) / m, my = sum(S.y, i, j) / m;
    const sxx = sum(S.xx, i, j) - m * mx * mx;
    const sxy = sum(S.xy, i, j) - m * mx * my;
    const slope = sxx > 0 ? sxy / sxx : 0;
    const rss = Math.max(0, sum(S.yy, i, j) - m * my * my - slope * sxy);
    return { slope, rss, intercept: my - slope * mx };
  };

  let best: Segmentation & { score: number } = { direct: true, breaks: [], slopes: [direct(n).slope], score: direct(n).rss / (sigma * sigma) + Math.log(n) };
  const consider = (hasDirect: boolean, breaks: number[]) => {
    const starts = [0, ...breaks, n];
    const slopes: number[] = [];
    let rss = 0;
    for (let b = 0; b < starts.length - 1; b++) {
      const seg = b === 0 && hasDirect ? { ...direct(starts[1]), intercept: Infinity } : line(starts[b], starts[b + 1]);
      if (!(seg.slope > 0) || (b > 0 && seg.slope > SLOPE_DROP * slopes[b - 1])) return;
      // A refractor branch starts later than the shot by a clear margin: its intercept time is the
      // time spent crossing the layers above (near zero it is the direct wave, bent by noise).
      if (seg.intercept < 3 * sigma) return;
      slopes.push(seg.slope);
      rss += seg.rss;
    }
    // Parameters: one slope for the direct wave, slope and intercept per refractor branch, one per break.
    const params = (hasDirect ? 1 : 2) + 3 * breaks.length;
    const score = rss / (sigma * sigma) + params * Math.log(n);
    if (score < best.score) best = { direct: hasDirect, breaks: [...breaks], slopes, score };
  };
  const refractors = layers - 1;
  // A curve with refractor branches only (a far shot): one to `refractors` free lines.
  if (n >= MIN_BRANCH_PICKS) consider(false, []);
  if (refractors >= 2) for (let b1 = MIN_BRANCH_PICKS; b1 <= n - MIN_BRANCH_PICKS; b1++) consider(false, [b1]);
  if (refractors >= 1) {
    for (let b1 = 2; b1 <= n - MIN_BRANCH_PICKS; b1++) {
      consider(true, [b1]);
      if (refractors >= 2) for (let b2 = b1 + MIN_BRANCH_PICKS; b2 <= n - MIN_BRANCH_PICKS; b2++) consider(true, [b1, b2]);
    }
  }
  return { direct: best.direct, breaks: best.breaks, slopes: best.slopes };
}
