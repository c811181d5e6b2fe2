/**
 * Travel-time curves for charts: each shot's picks sorted by receiver x (then time, then index).
 * Excluded picks are kept — the chart shows them greyed out, found through `index`; picks with
 * non-finite numbers cannot be drawn and are left out. Shots in order of first appearance.
 */
import type { QcPick } from './types';
import { groupByShot } from './shots';

export interface TravelTimeCurve {
  shotId: string;
  sourceX: number;
  /** Receiver x, m. */
  x: Float64Array;
  /** Pick time, s. */
  t: Float64Array;
  /** QcPick.index of each point. */
  index: Int32Array;
}

export function travelTimeCurves(picks: readonly QcPick[]): TravelTimeCurve[] {
  return groupByShot(picks, true).map(({ shotId, sourceX, members }) => ({
    shotId,
    sourceX,
    x: Float64Array.from(members, (i) => picks[i].receiverX),
    t: Float64Array.from(members, (i) => picks[i].time),
    index: Int32Array.from(members, (i) => picks[i].index),
  }));
}
