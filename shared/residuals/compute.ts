/**
 * Residual of one pick: observed − computed (FORMATS.md §3), and normalised by the pick's
 * uncertainty. SI inside: seconds. Non-finite inputs throw, so a NaN never reaches a report.
 */
export interface ResidualInput {
  shotId: string;
  receiverX: number;
  /** Elevation actually used for the receiver (m), after placing empty z on the surface. */
  receiverZ: number;
  /** Picked time, s. */
  observed: number;
  /** Modelled time, s. */
  computed: number;
  /** Pick uncertainty, s (> 0). */
  sigma: number;
}

export interface Residual extends ResidualInput {
  /** observed − computed, s. */
  residual: number;
  /** residual / sigma (dimensionless). */
  normalised: number;
}

export function residualOf(input: ResidualInput): Residual {
  const { observed, computed, sigma } = input;
  if (!Number.isFinite(observed) || !Number.isFinite(computed)) {
    throw new RangeError(`shot ${input.shotId}, receiver x ${input.receiverX} m: times must be finite (observed ${observed} s, computed ${computed} s)`);
  }
  if (!(sigma > 0) || !Number.isFinite(sigma)) {
    throw new RangeError(`shot ${input.shotId}, receiver x ${input.receiverX} m: sigma must be > 0 (got ${sigma} s)`);
  }
  const residual = observed - computed;
  return { ...input, residual, normalised: residual / sigma };
}

export const computeResiduals = (inputs: readonly ResidualInput[]): Residual[] => inputs.map(residualOf);
