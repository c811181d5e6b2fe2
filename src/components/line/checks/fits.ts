import type { ApparentVelocityFit } from '../../../../shared/qc';

/** An apparent-velocity fit the user chose to keep: the shot, the requested window and the result. */
export interface KeptFit {
  id: number;
  shotId: string;
  sourceX: number;
  xFrom: number;
  xTo: number;
  fit: ApparentVelocityFit;
}

/** Time of the fitted line at the source position, ms: the intercept time the trade reads. */
export const interceptAtSourceMs = (f: KeptFit) => (f.fit.intercept + f.fit.slope * f.sourceX) * 1000;
