/**
 * Grouping of picks by shot, shared by the QC functions. Works on positions in the input
 * array (numbers), not on copies of the picks.
 */
import type { QcPick } from './types';

export interface ShotGroup {
  shotId: string;
  sourceX: number;
  /** Positions in the input array, sorted by receiver x, then time, then pick index. */
  members: number[];
}

/** True when a pick has finite numbers where the QC needs them. Non-finite picks cannot be checked. */
export const isFinitePick = (p: QcPick): boolean =>
  Number.isFinite(p.sourceX) && Number.isFinite(p.receiverX) && Number.isFinite(p.time);

/**
 * Shots in order of first appearance. Picks with non-finite numbers are left out (the pick
 * parsers reject them before they get here); excluded picks are left out unless keepExcluded.
 * Throws when one shot's picks disagree on the source position (FORMATS.md §2: one source per shot).
 */
export function groupByShot(picks: readonly QcPick[], keepExcluded = false): ShotGroup[] {
  const groups = new Map<string, ShotGroup>();
  for (let i = 0; i < picks.length; i++) {
    const p = picks[i];
    if (!isFinitePick(p) || (p.excluded && !keepExcluded)) continue;
    const g = groups.get(p.shotId);
    if (!g) groups.set(p.shotId, { shotId: p.shotId, sourceX: p.sourceX, members: [i] });
    else if (g.sourceX !== p.sourceX) {
      throw new Error(`shot ${p.shotId}: picks disagree on the source position (${g.sourceX} m and ${p.sourceX} m, pick ${p.index})`);
    } else g.members.push(i);
  }
  for (const g of groups.values()) {
    g.members.sort((a, b) => picks[a].receiverX - picks[b].receiverX || picks[a].time - picks[b].time || picks[a].index - picks[b].index);
  }
  return [...groups.values()];
}

/** Shot ids compared by UTF-16 code units: the same order on client and server, whatever the locale. */
export const compareIds = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);
