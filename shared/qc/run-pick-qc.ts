/** All pick QC with default thresholds, as GET /api/picksets/:id returns it. Apparent-velocity fits are asked for per branch by the user. */
import type { QcPick } from './types';
import { findReciprocalPairs, type ReciprocalPair } from './reciprocal-pairs';
import { flagSuspectPicks, type PickFlag } from './suspect-picks';

export interface PickQc {
  reciprocalPairs: ReciprocalPair[];
  flags: PickFlag[];
}

export function runPickQc(picks: readonly QcPick[], options: { reciprocalToleranceS?: number } = {}): PickQc {
  return {
    reciprocalPairs: findReciprocalPairs(picks, { toleranceS: options.reciprocalToleranceS }),
    flags: flagSuspectPicks(picks),
  };
}
