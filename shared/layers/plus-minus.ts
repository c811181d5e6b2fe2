/**
 * Plus–minus method (Hagedoorn 1959, "The plus-minus method of interpreting seismic refraction
 * sections", Geophys. Prospect. 7, 158–182): for a geophone G between a forward shot A and a
 * reverse shot B on the same refractor,
 *   T⁺ = t_AG + t_BG − t_AB   (twice the delay time under G),
 *   T⁻ = t_AG − t_BG − t_AB   (slope 2 / V along the line).
 * The refractor velocity is 2 / (the slope of T⁻ fitted to every pair at once, each pair with its
 * own offset, after dropping outlying picks); the delay time under G is the median of T⁺/2 over
 * the pairs.
 */
import { pairsForGeophone, timeAt, type ReversedPair } from './branches';
import { median, pooledSlope } from './robust-line';

export interface RefractorTimes {
  velocity: number;
  /** Time-depth (delay time, s) per geophone x; geophones no pair covers are absent. */
  timeDepth: Map<number, number>;
}

export function plusMinus(pairs: readonly ReversedPair[]): RefractorTimes {
  // T⁻ does not depend on the reciprocal time: every pair counts, each with its own offset.
  const slope = pooledSlope(pairs.map((p) => ({ x: p.overlap, y: p.overlap.map((x) => timeAt(p.forward, x) - timeAt(p.reverse, x)) })));
  const geophones = [...new Set(pairs.flatMap((p) => p.overlap))].sort((a, b) => a - b);
  const timeDepth = new Map<number, number>();
  for (const x of geophones) {
    const use = pairsForGeophone(pairs, x, (p, g) => p.overlap.includes(g));
    timeDepth.set(x, median(use.map((p) => (timeAt(p.forward, x) + timeAt(p.reverse, x) - p.reciprocal) / 2)));
  }
  return { velocity: slope > 0 ? 2 / slope : Number.NaN, timeDepth };
}
