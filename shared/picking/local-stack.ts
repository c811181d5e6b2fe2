/**
 * Where the first arrival is on a noisy trace, found with its neighbours: the energy-ratio
 * characteristic functions (Allen 1978) of the trace and of its nearest neighbours along the spread
 * are averaged, as logarithms, along straight lines t + s·(|x_j| − |x_i|) for a fan of apparent
 * slownesses s (a local slant stack of the characteristic function; common practice, no source),
 * and the earliest time where the average rises clearly above the noise's is the arrival. A first
 * arrival is coherent from trace to trace and a burst of noise is not, so the average lifts it out
 * of the noise; the earliest rise is taken, not the strongest, as later arrivals are often stronger.
 */
import { energyRatio, typicalEnergy } from './energy-ratio';

/** Neighbours each side (in offset) summed with a trace. */
const NEIGHBOURS = 3;
/** Largest apparent slowness searched (s/m): 1/200 m/s, slower than any first arrival on land. */
const MAX_SLOWNESS = 1 / 200;
/** Mean log energy ratio that marks an arrival: the energy rising about fourfold on the average trace of the group. */
const THRESHOLD = Math.log(4);
/** Largest log ratio one trace contributes (a ratio of 8). */
const CAP = Math.log(8);
/** Samples stacked at a time before looking for the rise. */
const BLOCK = 256;

export interface StackTrace {
  /** Demeaned samples; null for a dead trace. */
  x: Float64Array | null;
  /** |receiver − shot| along the line (m); null where unknown. */
  offset: number | null;
}

/**
 * For each trace, the sample index where the stack with its neighbours first rises through the
 * threshold (the peak of that rise), or null (dead, no position, too few neighbours, no rise).
 * `side` members only: traces on one side of the shot, so offsets grow one way.
 */
export function stackedArrivals(traces: StackTrace[], members: number[], dt: number, short: number, long: number, from: number): (number | null)[] {
  const out: (number | null)[] = traces.map(() => null);
  const live = members.filter((i) => traces[i].x !== null && traces[i].offset !== null);
  live.sort((a, b) => traces[a].offset! - traces[b].offset!);
  const cf = new Map<number, Float64Array>();
  for (const i of live) cf.set(i, logRatio(traces[i].x!, from, short, long));
  live.forEach((i, k) => {
    const group = live.slice(Math.max(0, k - NEIGHBOURS), k + NEIGHBOURS + 1);
    if (group.length < 3) return;
    const n = traces[i].x!.length;
    const spread = Math.max(...group.map((j) => Math.abs(traces[j].offset! - traces[i].offset!)));
    // Steps fine enough that the outermost neighbour moves by at most two samples between lines.
    const step = spread > 0 ? (2 * dt) / spread : MAX_SLOWNESS;
    const best = new Float64Array(n);
    const sum = new Float64Array(n);
    const shifts = (slowness: number) => group.map((j) => Math.round((slowness * (traces[j].offset! - traces[i].offset!)) / dt));
    // Block by block from the shot on: the first rise is early in a long record, and nothing after
    // it need be summed. A block's stack runs `long` samples past its end, for the top of a rise.
    for (let a = from; a < n; a += BLOCK) {
      const end = Math.min(n, a + BLOCK), b = Math.min(n, end + long);
      best.fill(0, a, b);
      for (let slowness = 0; slowness <= MAX_SLOWNESS + 1e-12; slowness += step) {
        sum.fill(0, a, b);
        shifts(slowness).forEach((shift, g) => {
          const e = cf.get(group[g])!;
          const hi = Math.min(b, n - shift);
          for (let t = Math.max(a, -shift); t < hi; t++) sum[t] += e[t + shift];
        });
        for (let t = a; t < b; t++) {
          const mean = sum[t] / group.length;
          if (mean > best[t]) best[t] = mean;
        }
      }
      for (let t = a; t < end; t++) {
        if (best[t] < THRESHOLD) continue;
        // The top of this rise: the arrival's energy is all inside the short window there.
        let peak = t;
        for (let u = t; u < Math.min(n, t + long); u++) if (best[u] >= best[peak]) peak = u;
        else if (best[u] < THRESHOLD) break;
        out[i] = peak;
        return;
      }
    }
  });
  return out;
}

/**
 * ln of the energy ratio, 0 where the ratio is below 1 (energy falling is not evidence either way)
 * and at most CAP, so a few strong traces cannot carry the mean: an arrival must show on most of them.
 */
function logRatio(x: Float64Array, from: number, short: number, long: number): Float64Array {
  // The floor is the noise's typical level, not its quietest window: early in the record, where the
  // trailing window is short, a quiet stretch would otherwise make every trace look like an arrival.
  const r = energyRatio(x, from, short, long, typicalEnergy(x, long));
  for (let t = 0; t < r.length; t++) r[t] = r[t] > 1 ? Math.min(CAP, Math.log(r[t])) : 0;
  return r;
}
