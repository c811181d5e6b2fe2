/**
 * The inversion's inputs, hooks and outputs (shared/inversion/README.md). SI units inside
 * (m, s, m/s), like the engine; milliseconds only where a name says so.
 */
import type { CsrMatrix } from './csr';
import type { Grid } from '../grid';
import type { Point } from '../eikonal';

/** Every setting of one inversion; what a stored inversion records. */
export interface InversionSettings {
  /** Iteration cap (Gauss-Newton steps), default 15. */
  maxIterations: number;
  /** Fixed regularisation weight (dimensionless, relative to the data's sensitivity); null = automatic schedule. */
  smoothing: number | null;
  /** Vertical smoothing weight as a share of the horizontal one (0 < R ≤ 10), default 0.5. */
  verticalWeight: number;
  /** Weight of damping toward the starting model, relative like `smoothing`, default 0.05. */
  damping: number;
  /** Velocity bounds, m/s (default 100 and 7000). */
  vMin: number;
  vMax: number;
  /** Eikonal scheme order, default 2. */
  order: 1 | 2;
  /** Run the checkerboard resolution test after the inversion. */
  checkerboard: boolean;
  /** Checker square size (m); null = automatic (a sixth of the spread, at least four cells). */
  checkerSize: number | null;
}

/** One shot's picks on the inversion grid. */
export interface InversionShot {
  shotId: string;
  source: Point;
  /** Receiver positions, interleaved x, z (m), one pair per pick. */
  receivers: Float64Array;
  /** Picked times (s), one per receiver. */
  times: Float64Array;
  /** Pick uncertainties (s), one per receiver, all > 0. */
  sigmas: Float64Array;
}

export interface InversionProblem {
  grid: Grid;
  /** 1 ground, 0 air; air nodes are never unknowns and stay air. */
  active: Uint8Array;
  /** Starting velocities (m/s) per node; air nodes ignored. */
  start: Float32Array;
  shots: InversionShot[];
  settings: InversionSettings;
  /**
   * What the smoothing measures: the model itself ('model', default), or its departure from the
   * start ('departure'), for a start that carries structure of its own (a saved model version:
   * layers from the layer methods, a hand-built model), so that its contacts are kept.
   */
  smoothingActsOn?: 'model' | 'departure';
  /** The ground surface line (RasterModel.surface): the solver then follows it exactly near the surface. */
  surface?: Point[];
  /** Where the automatic smoothing schedule starts (default AUTO_SMOOTHING_START); an ensemble member starts it elsewhere. */
  autoSmoothingStart?: number;
}

/** Travel times and ray sensitivities for every pick, in problem order (shot by shot). */
export interface ForwardResult {
  /** Computed first-arrival time per pick (s); Infinity where the wave cannot reach. */
  times: Float64Array;
  /** Sensitivity rows in CSR form: ∂t/∂slowness (m) per pick over node indices, columns ascending. */
  rowPtr: Int32Array;
  cols: Int32Array;
  vals: Float32Array;
  /** Per grid column: lowest elevation any ray reaches there (m); +Infinity where no ray passes. */
  rayBottom: Float64Array;
}

/** Solves every shot on a velocity model (in this thread or on a pool of threads). */
export interface ForwardModeller {
  forward(velocity: Float32Array): Promise<ForwardResult>;
  /**
   * Optional: the products with one step's data matrix A (and its transpose At) on more than one
   * thread, for LSQR. Results must equal A.multiply and At.multiplyAdd's exactly. Absent: this thread.
   */
  products?(A: CsrMatrix, At: CsrMatrix): Promise<MatrixProducts>;
}

/** out = A·x over A's rows; out += Aᵀ·u over A's columns; release() when the step is solved. */
export interface MatrixProducts {
  multiply(x: Float64Array, out: Float64Array): void;
  multiplyTransposeAdd(u: Float64Array, out: Float64Array): void;
  release(): void;
}

export interface IterationRecord {
  /** 0 = the starting model, then 1, 2, … */
  iteration: number;
  chi2: number;
  rmsMs: number;
  /** Regularisation weight used for the step that produced this model (null for iteration 0). */
  smoothing: number | null;
  seconds: number;
}

export type StopReason = 'target-misfit' | 'stalled' | 'iteration-cap' | 'cancelled';

/** State that lets an interrupted inversion go on from its last stored iteration. */
export interface InversionCheckpoint {
  history: IterationRecord[];
  velocity: Float32Array;
  /** Weight for the next step. */
  nextSmoothing: number;
  /** Scale that turns relative weights into absolute ones, fixed at the first iteration. */
  scale: number;
}

export interface InversionHooks {
  /** Called after every iteration with the model it produced; awaited (store it, report progress). */
  onIteration?(record: IterationRecord, checkpoint: InversionCheckpoint): void | Promise<void>;
  signal?: AbortSignal;
  resumeFrom?: InversionCheckpoint;
}

export interface Timings {
  /** Forward steps (every shot solved and its rays traced), and their wall-clock time. */
  forwardSteps: number;
  forwardSeconds: number;
  matrixSeconds: number;
  lsqrSeconds: number;
}

export interface InversionResult {
  velocity: Float32Array;
  history: IterationRecord[];
  stopReason: StopReason;
  /** Per node: summed ray length (m, bilinear share) and number of rays touching it. */
  coverage: Float32Array;
  hits: Int32Array;
  /** Per grid column: depth-of-investigation elevation (m), NaN where no ray passes. */
  doi: Float64Array;
  /** Final computed time per pick (s), problem order. */
  computed: Float64Array;
  timings: Timings;
  checkerboard?: CheckerboardResult;
}

export interface CheckerboardResult {
  /** Square size used (m) and amplitude (0.07 = ±7 %). */
  size: number;
  amplitude: number;
  /** True and recovered relative anomaly per node (NaN in air). */
  truePattern: Float32Array;
  recovered: Float32Array;
  /** Pearson correlation of true and recovered over nodes with coverage above the threshold used. */
  correlation: number;
  coverageThreshold: number;
}
