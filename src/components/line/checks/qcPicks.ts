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

/**
 * A pick that comes earlier than a nearer geophone's and one whose step from it implies an
 * impossibly fast ground are the same trouble to the person checking — it arrived too early for its
 * distance — so they share a label; the message beside it says which rule caught it.
 */
export const SUSPECT_LABELS = { too_fast: 'Too early for its distance', too_slow: 'Too late for its distance', decreasing: 'Too early for its distance' } as const;
