/** Travel times, rays and interpolation on the 2-D grid: the numerical engine (see README.md and docs/engine.md). */
export type { Point, SolveOptions, VelocityField } from './types';
export { EikonalInputError } from './errors';
export { solveTravelTimes, TravelTimeSolver, type MarchOptions } from './fmm';
export { sampleTime } from './interpolate';
export { traceRay, RayTracer, type Ray } from './rays';
export { validateSolveInput } from './validate';
export { cellSlowness, type CellSlowness, type InterfaceRule, CONTRAST_RATIO, DEFAULT_INTERFACE_RULE } from './cells';
