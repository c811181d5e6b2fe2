/** Travel-time tomography: from first-arrival picks to a velocity section (README.md). */
export type * from './types';
export { invert } from './invert';
export { gradientStart, fitGradient, type GradientFit } from './gradient-start';
export { inProcessModeller } from './forward';
export { shotSensitivity, type ShotSensitivity } from './shot-sensitivity';
export { lsqr, type LsqrOperator, type LsqrResult } from './lsqr';
export { CsrMatrix } from './csr';
