/** Messages between the editor page and the preview worker. Times in seconds, positions in metres. */
import type { Grid } from '../../shared/grid';
import type { Point } from '../../shared/eikonal';

export interface PreviewRequest {
  id: number;
  grid: Grid;
  velocity: Float32Array;
  active: Uint8Array;
  /** Layered models: slowness of the cells an interface crosses (RasterModel.cellSlowness). */
  cellSlowness?: Float32Array;
  /** Ground surface polyline (RasterModel.surface): the solver's start region follows it. */
  surface?: { x: number; z: number }[];
  source: Point;
  /** Receiver positions, interleaved x, z. */
  receivers: Float64Array;
  order: 1 | 2;
  rays: boolean;
}

export interface FieldReply {
  kind: 'field';
  id: number;
  /** Travel time per node (s); Infinity in the air. */
  times: Float64Array;
  /** Time at each receiver (s), sampled the way the solve command samples; Infinity when not reached. */
  receiverTimes: Float64Array;
  stepMs: number;
  levels: number[];
  /** One segment list (x1, z1, x2, z2, …) per level. */
  contours: Float32Array[];
  tMax: number;
  solveMs: number;
  contourMs: number;
  final: boolean;
}

export interface RaysReply {
  kind: 'rays';
  id: number;
  /** One polyline (x, z pairs from receiver to source) per receiver; empty when it could not be traced. */
  rays: Float64Array[];
  rayMs: number;
  final: true;
}

export interface ErrorReply {
  kind: 'error';
  id: number;
  message: string;
  final: true;
}

export type PreviewReply = FieldReply | RaysReply | ErrorReply;
