/** Pick quality checks: pure functions over picks (SI: m, s), shared by client and server. No I/O. */
export type { QcPick } from './types';
export { QC_DEFAULTS } from './defaults';
export { fitApparentVelocity, type ApparentVelocityFit } from './apparent-velocity';
export { findReciprocalPairs, type ReciprocalPair, type ReciprocalOptions } from './reciprocal-pairs';
export { flagSuspectPicks, type PickFlag, type SuspectPickOptions } from './suspect-picks';
export { travelTimeCurves, type TravelTimeCurve } from './travel-time-curves';
export { runPickQc, type PickQc } from './run-pick-qc';
export { findFarPositions, positionsOfPicks, type FarPosition, type FarPositionResult, type PickPosition } from './far-positions';
