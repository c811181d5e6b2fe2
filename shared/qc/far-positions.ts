/**
 * Pick positions far from every station of the line: a source or receiver x more than
 * `FAR_FROM_STATIONS_SPACINGS` (3) median station spacings from the nearest station. An off-end
 * shot a station or two beyond the spread is normal; a receiver 10 km from a 100 m spread is a
 * typo (a missing decimal point, a coordinate in the wrong column). A warning, not a refusal:
 * the picks are stored and the user decides. Three spacings is our choice (common practice,
 * no source): far enough for off-end shots, near enough to catch a shifted decimal point.
 * One warning per distinct position and role, with how many picks share it.
 */
import { FAR_FROM_STATIONS_SPACINGS } from '../limits';
import { metres } from './format';
import type { QcPick } from './types';

export interface FarPosition extends PickPosition {
  nearestStationX: number;
  /** Distance to the nearest station, m. */
  distance: number;
  message: string;
}

export interface FarPositionResult {
  /** Median spacing of the station table, m (null with fewer than two stations: no check). */
  medianSpacing: number | null;
  /** Distance beyond which a position is reported, m. */
  limit: number | null;
  positions: FarPosition[];
}

/** A distinct source or receiver position of a pick set, with how many picks use it. */
export interface PickPosition {
  role: 'source' | 'receiver';
  shotId: string;
  x: number;
  picks: number;
  firstIndex: number;
}

/**
 * Distinct positions of the picks: one per shot for sources, one per x for receivers (the first
 * shot that uses it named). The server gets the same list from SQL without loading every pick.
 */
export function positionsOfPicks(picks: readonly Pick<QcPick, 'index' | 'shotId' | 'sourceX' | 'receiverX'>[]): PickPosition[] {
  const found = new Map<string, PickPosition>();
  const add = (role: PickPosition['role'], key: string, x: number, shotId: string, index: number): void => {
    const seen = found.get(key);
    if (seen) seen.picks++;
    else found.set(key, { role, shotId, x, picks: 1, firstIndex: index });
  };
  for (const p of picks) {
    add('source', `s|${p.shotId}`, p.sourceX, p.shotId, p.index);
    add('receiver', `r|${p.receiverX}`, p.receiverX, p.shotId, p.index);
  }
  return [...found.values()];
}

/** Positions farther than `factor` median spacings from the nearest station; `stationXs` in any order. */
export function findFarPositions(
  positions: readonly PickPosition[],
  stationXs: readonly number[],
  factor: number = FAR_FROM_STATIONS_SPACINGS,
): FarPositionResult {
  const xs = stationXs.filter(Number.isFinite).sort((a, b) => a - b);
  if (xs.length < 2) return { medianSpacing: null, limit: null, positions: [] };
  const gaps = xs.slice(1).map((x, i) => x - xs[i]).sort((a, b) => a - b);
  const mid = gaps.length >> 1;
  const median = gaps.length % 2 ? gaps[mid] : (gaps[mid - 1] + gaps[mid]) / 2;
  const limit = factor * median;

  const far: FarPosition[] = [];
  for (const p of positions) {
    if (!Number.isFinite(p.x)) continue;
    const nearest = nearestOf(xs, p.x);
    const distance = Math.abs(p.x - nearest);
    if (!(distance > limit)) continue;
    far.push({
      ...p, nearestStationX: nearest, distance,
      message: `${p.role === 'source' ? `source of shot ${p.shotId}` : 'receiver'} at x = ${metres(p.x)} m is ${metres(distance)} m from the nearest station (x = ${metres(nearest)} m), more than ${factor} station spacings (${metres(limit)} m); check the position`,
    });
  }
  far.sort((a, b) => a.firstIndex - b.firstIndex || (a.role < b.role ? -1 : 1));
  return { medianSpacing: median, limit, positions: far };
}

/** The station x nearest to x in a sorted list (binary search). */
function nearestOf(sorted: readonly number[], x: number): number {
  let lo = 0;
  let hi = sorted.length - 1;
  while (hi - lo > 1) {
    const m = (lo + hi) >> 1;
    if (sorted[m] <= x) lo = m;
    else hi = m;
  }
  return Math.abs(sorted[lo] - x) <= Math.abs(sorted[hi] - x) ? sorted[lo] : sorted[hi];
}
