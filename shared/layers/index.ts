/** Layer methods (intercept time, plus–minus, GRM) on a line's picks: shared/layers/README.md. */
export type * from './types';
export { LayerInputError } from './types';
export { interpretLayers } from './interpret';
export { assignRefractors } from './assign';
export { suggestAssignment } from './datum';
export { layeredModelFromResult } from './to-model';
export { interpretationRecord, readInterpretationRecord, type InterpretationRecord } from './record';
