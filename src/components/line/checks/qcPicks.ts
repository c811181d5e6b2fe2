import type { PickRow } from '../../../api/types';
import type { QcPick } from '../../../../shared/qc';
import { msToS } from '../../../../shared/units';

/** The API gives picks in ms (the trade's unit); shared/qc works in seconds. Convert once, here. */
export function toQcPicks(picks: readonly PickRow[], excluded: ReadonlySet<number>): QcPick[] {
  return picks.map((p) => ({
    index: p.index,
    shotId: p.shotId,
    sourceX: p.sourceX,
    receiverX: p.receiverX,
    time: msToS(p.timeMs),
    sigma: msToS(p.sigmaMs),
    excluded: excluded.has(p.index),
  }));
}

export const SUSPECT_LABELS = { too_fast: 'Too fast', too_slow: 'Too slow', decreasing: 'Time decreases' } as const;
