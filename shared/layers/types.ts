/**
 * Inputs and outputs of the layer methods (shared/layers/README.md). SI units (m, s, m/s);
 * x along the line, z elevation (up positive), as everywhere in Timefield.
 */

/** One shot's picks: the same shape as the inversion's shots (shared/inversion/types.ts). */
export interface LayerShot {
  shotId: string;
  source: { x: number; z: number };
  /** Receiver positions, interleaved x, z (m). */
  receivers: Float64Array;
  /** First-arrival times (s) and their sigmas (s), one per receiver. */
  times: Float64Array;
  sigmas: Float64Array;
}

export type LayerMethod = 'grm' | 'plus-minus' | 'intercept';

export interface LayerOptions {
  method: LayerMethod;
  /** Layers including the top one: 2 (one refractor) or 3 (two). */
  layers: 2 | 3;
  /** GRM: use this XY distance (m) instead of the optimum. */
  xy?: number;
  /** Hand assignment: layer index per pick (0 = direct wave, 1 = first refractor, …) per shot, in pick order; −1 = not used. */
  assignment?: Int8Array[];
}

/** Which layer each pick travelled in last (0 = direct wave), per shot in pick order; −1 = left out. */
export type Assignment = Int8Array[];

export interface GeophoneDepth {
  x: number;
  groundZ: number;
  /** Refractor number, from 1 (the first below the top layer). */
  refractor: number;
  /** Vertical depth of the refractor below the ground at x (m). */
  depth: number;
  refractorZ: number;
  refractorVelocity: number;
}

export interface LayerResult {
  method: LayerMethod;
  /** Velocity per layer, top down (m/s). */
  velocities: number[];
  /** GRM: the XY used (m); null for the other methods. */
  xy: number | null;
  /** Per GRM XY tried: the criterion's value (RMS of the velocity-analysis function about its line, s). */
  xyScan: { xy: number; rms: number }[];
  depths: GeophoneDepth[];
  assignment: Assignment;
  warnings: string[];
  /** Plus–minus and GRM: per refractor, the velocity-analysis and time-depth curves of every reversed pair (for drawing). */
  functions: RefractorFunctions[];
}

/** One reversed pair's curves at the XY used (s), per geophone x (m). */
export interface PairFunctions {
  forwardShot: string;
  reverseShot: string;
  x: number[];
  /** t_V: slope 1/V along the line. */
  velocityFn: number[];
  /** t_G: the delay (time-depth) under the geophone. */
  timeDepth: number[];
}

export interface RefractorFunctions {
  refractor: number;
  /** The XY the curves are drawn at (0 for plus–minus), m. */
  xy: number;
  pairs: PairFunctions[];
}

export class LayerInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LayerInputError';
  }
}
