/** Travel-time tomography: from first-arrival picks to a velocity section (README.md). */
export type * from './types';
export { invert } from './invert';
export { gradientStart, fitGradient, type GradientFit } from './gradient-start';
export { inProcessModeller } from './forward';
export { shotSensitivity, type ShotSensitivity } from './shot-sensitivity';
export { lsqr, type LsqrOperator, type LsqrResult } from './lsqr';
export { CsrMatrix } from './csr';
export { inversionShots, inversionDataProblems, MIN_INVERSION_PICKS, MAX_NODES_PER_PICK } from './problem';
export { InversionInputError, AUTO_SMOOTHING_START, AUTO_SMOOTHING_FLOOR, TARGET_CHI2 } from './invert';
export { CHECKER_AMPLITUDE, autoCheckerSize } from './checkerboard';
