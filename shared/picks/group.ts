/** Picks grouped by shot, in order of first appearance (what a solve needs: one eikonal field per shot). */
import type { Pick } from './types';

export interface ShotPicks {
  shotId: string;
  sourceX: number;
  sourceZ: number | null;
  picks: Pick[];
}

export function groupPicksByShot(picks: readonly Pick[]): ShotPicks[] {
  const byId = new Map<string, ShotPicks>();
  for (const p of picks) {
    let shot = byId.get(p.shotId);
    if (!shot) {
      shot = { shotId: p.shotId, sourceX: p.sourceX, sourceZ: p.sourceZ, picks: [] };
      byId.set(p.shotId, shot);
    }
    shot.picks.push(p);
  }
  return [...byId.values()];
}
