/**
 * Picks that break physical sense. For each shot, walk away from the source on each side, station
 * by station, and form the apparent velocity |Δx|/Δt between each pick and the station before it.
 * Each rule allows for the picks' own uncertainty a = k·√(σ₁² + σ₂²) (k = sigmaAllowance, default 2,
 * about 95 % for Gaussian pick errors): a pick is flagged only if no times within ±a make it sensible.
 *   Δt < −a             → 'decreasing' (first arrivals cannot come earlier farther away)
 *   |Δx|/(Δt + a) > vMax → 'too_fast'
 *   |Δx|/(Δt − a) < vMin → 'too_slow'
 * With k = 0 the strict rules apply (Δt ≤ 0 is already 'decreasing'). Without the allowance, 0.5 ms
 * picks at 2.5 m spacing over 3000 m/s rock trip the 8000 m/s rule on about one pair in five.
 * The farther pick of the pair is flagged. Defaults 100 and 8000 m/s are common practice, no source.
 *
 * Stations: picks within 1 mm of one another (two receivers at one x, or a pick at the source)
 * form one station; no velocity is formed inside it, and the next station is compared with its
 * mean position and mean time. A pick at the source (t = 0) is the first station of both sides.
 * The first receiver is NOT compared with the source itself when no pick sits there: trigger delay
 * and shot depth make t(source) ≠ 0 in practice.
 *
 * Caution (why flags are "look here", not "wrong"): near the source and at close spacing Δt is a
 * fraction of a millisecond, so pick noise alone can push |Δx|/Δt past vMax; and one early or late
 * pick may also flag its next neighbour. Excluded and non-finite picks are skipped (the walk bridges them).
 */
import type { QcPick } from './types';
import { QC_DEFAULTS, SAME_STATION_M } from './defaults';
import { groupByShot } from './shots';
import { metres, metresPerSecond, milliseconds } from './format';

export interface PickFlag {
  index: number;
  shotId: string;
  kind: 'too_fast' | 'too_slow' | 'decreasing';
  /** Plain words with numbers, e.g. "apparent velocity 9120 m/s between x = 40.0 and 42.5 m exceeds 8000 m/s". */
  message: string;
}

export interface SuspectPickOptions {
  /** m/s, default 100 (common practice, no source); 0 turns the rule off. */
  vMin?: number;
  /** m/s, default 8000 (common practice, no source); Infinity turns the rule off. */
  vMax?: number;
  /** k in the allowance k·√(σ₁² + σ₂²); default 2 (common practice, no source); 0 for the strict rules. */
  sigmaAllowance?: number;
}

/** Flags sorted by pick index; each pick is flagged at most once. */
export function flagSuspectPicks(picks: readonly QcPick[], options: SuspectPickOptions = {}): PickFlag[] {
  const vMin = options.vMin ?? QC_DEFAULTS.vMin;
  const vMax = options.vMax ?? QC_DEFAULTS.vMax;
  if (!(vMin >= 0 && Number.isFinite(vMin))) throw new RangeError(`vMin must be a finite number ≥ 0, got ${vMin}`);
  if (!(vMax > vMin)) throw new RangeError(`vMax must be greater than vMin (${vMin}), got ${vMax}`);
  const sigmas = options.sigmaAllowance ?? QC_DEFAULTS.sigmaAllowance;
  if (!(sigmas >= 0 && Number.isFinite(sigmas))) throw new RangeError(`sigmaAllowance must be a finite number ≥ 0, got ${sigmas}`);
  const rules = { vMin, vMax, sigmas };

  const flags: PickFlag[] = [];
  for (const shot of groupByShot(picks)) {
    const xs = shot.sourceX;
    const atSource = shot.members.filter((i) => Math.abs(picks[i].receiverX - xs) <= SAME_STATION_M);
    const right = shot.members.filter((i) => picks[i].receiverX > xs + SAME_STATION_M);
    const left = shot.members.filter((i) => picks[i].receiverX < xs - SAME_STATION_M).reverse();
    for (const side of [right, left]) walk(picks, xs, [...atSource, ...side], rules, flags);
  }
  return flags.sort((a, b) => a.index - b.index);
}

/** `order` holds array positions sorted by distance from the source. */
interface Rules {
  vMin: number;
  vMax: number;
  /** k of the allowance k·√(σ₁² + σ₂²). */
  sigmas: number;
}

function walk(picks: readonly QcPick[], xs: number, order: number[], rules: Rules, out: PickFlag[]): void {
  let prevX = NaN; // mean x, t and σ of the mean of the previous station; NaN before the first station closes
  let prevT = NaN;
  let prevS = NaN;
  let k = 0;
  while (k < order.length) {
    // The station: consecutive picks within SAME_STATION_M of its first pick.
    const first = picks[order[k]].receiverX;
    let end = k;
    let sumX = 0;
    let sumT = 0;
    let sumS2 = 0;
    while (end < order.length && Math.abs(picks[order[end]].receiverX - first) <= SAME_STATION_M) {
      const p = picks[order[end]];
      sumX += p.receiverX;
      sumT += p.time;
      sumS2 += Number.isFinite(p.sigma) && p.sigma > 0 ? p.sigma * p.sigma : 0;
      if (!Number.isNaN(prevX)) {
        const flag = check(p, prevX, prevT, rules.sigmas * Math.hypot(Number.isFinite(p.sigma) && p.sigma > 0 ? p.sigma : 0, prevS), xs, rules);
        if (flag) out.push(flag);
      }
      end++;
    }
    prevX = sumX / (end - k);
    prevT = sumT / (end - k);
    prevS = Math.sqrt(sumS2) / (end - k);
    k = end;
  }
}

/** `allow` is the time allowance a (s) for this pair of stations. */
function check(p: QcPick, nearX: number, nearT: number, allow: number, xs: number, { vMin, vMax }: Rules): PickFlag | null {
  const dx = Math.abs(p.receiverX - nearX);
  const dt = p.time - nearT;
  const between = `between x = ${metres(Math.min(nearX, p.receiverX))} and ${metres(Math.max(nearX, p.receiverX))} m`;
  const base = { index: p.index, shotId: p.shotId };
  if (allow === 0 ? !(dt > 0) : dt < -allow) {
    const change = dt < 0 ? `time falls by ${milliseconds(-dt)} ms` : 'time does not increase';
    return { ...base, kind: 'decreasing', message: `${change} ${between}, moving away from the source at x = ${metres(xs)} m` };
  }
  // Compare without dividing so a tiny Δt cannot overflow the test itself.
  if (dx > vMax * (dt + allow)) {
    const allowing = allow > 0 ? `, even allowing ${milliseconds(allow)} ms for pick uncertainty` : '';
    const message = dt > 0
      ? `apparent velocity ${metresPerSecond(dx / dt)} m/s ${between} exceeds ${metresPerSecond(vMax)} m/s${allowing}`
      : `time ${dt < 0 ? `falls by ${milliseconds(-dt)} ms` : 'does not increase'} ${between}: faster than ${metresPerSecond(vMax)} m/s${allowing}`;
    return { ...base, kind: 'too_fast', message };
  }
  if (dx < vMin * (dt - allow)) {
    return { ...base, kind: 'too_slow', message: `apparent velocity ${metresPerSecond(dx / dt)} m/s ${between} is below ${metresPerSecond(vMin)} m/s` };
  }
  return null;
}
