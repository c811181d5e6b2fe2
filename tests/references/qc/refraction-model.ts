/**
 * First-arrival times over a two-layer model from the textbook refraction formulas
 * (Telford, Geldart & Sheriff, "Applied Geophysics", 2nd ed., Cambridge University Press, 1990,
 * chapter 4, refraction paths — section and equation numbers not quoted, from memory):
 *   direct wave          t = x / V1
 *   flat refractor       t = x / V2 + 2h·cos(ic) / V1,           sin ic = V1 / V2
 *   dipping refractor    t = x·sin(ic ± ξ) / V1 + 2h·cos(ic) / V1
 *                        (+ shooting down-dip, − up-dip; h = perpendicular depth under the shot)
 * The first arrival is the earlier of the direct and head waves. Beyond the critical distance the
 * head-wave line is the physical arrival; before it, the line lies above the direct wave (the
 * crossover distance exceeds the critical distance), so taking the minimum is right everywhere.
 */
import type { QcPick } from '../../../shared/qc';

export interface TwoLayer {
  v1: number;
  v2: number;
  /** Perpendicular depth to the refractor under x = 0, m. */
  h0: number;
  /** Dip, radians, refractor deepening toward +x (0 = flat). */
  dip: number;
}

export const criticalAngle = (m: TwoLayer): number => Math.asin(m.v1 / m.v2);

/** Perpendicular depth under the surface point x (refractor plane deepening toward +x). */
export const depthAt = (m: TwoLayer, x: number): number => m.h0 + x * Math.sin(m.dip);

/** First-arrival time from a source at xs to a receiver at x, both on a flat ground surface. */
export function firstArrival(m: TwoLayer, xs: number, x: number): number {
  const offset = Math.abs(x - xs);
  const ic = criticalAngle(m);
  const downDip = x >= xs; // shooting toward +x runs down-dip
  const head = (offset * Math.sin(ic + (downDip ? m.dip : -m.dip)) + 2 * depthAt(m, xs) * Math.cos(ic)) / m.v1;
  return Math.min(offset / m.v1, head);
}

/** One shot's picks at receivers x = 0, dx, …, length (sigma 0.5 ms). */
export function shotPicks(m: TwoLayer, shotId: string, xs: number, length: number, dx: number, firstIndex: number): QcPick[] {
  const picks: QcPick[] = [];
  for (let k = 0; k * dx <= length + 1e-9; k++) {
    const x = k * dx;
    picks.push({ index: firstIndex + k, shotId, sourceX: xs, receiverX: x, time: firstArrival(m, xs, x), sigma: 0.0005 });
  }
  return picks;
}

export const relErr = (got: number, want: number): number => Math.abs(got - want) / Math.abs(want);
