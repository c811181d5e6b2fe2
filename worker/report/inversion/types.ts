import type { Grid } from '../../../shared/grid';
import type { InversionSettings, StopReason } from '../../../shared/inversion/types';
import type { ReportBorehole, ReportMeta, ReportResidual } from '../types';

/** A node array as the engine gives it (Float32Array, NaN in the air) or as the API shows it (null in the air). */
export type NodeValues = ArrayLike<number | null>;

/**
 * Everything the PDF summary of an inversion shows; the worker gathers it from the inversion's row
 * and its stored result (InversionView, InversionSectionView in shared/schemas/inversions.ts).
 * Pure data, SI units (m, s, m/s) unless a name says ms. Node arrays are row-major, iz outer.
 */
export interface InversionReportInput extends ReportMeta {
  stations: { station: number | string; x: number; z: number; easting?: number; northing?: number }[];
  shots: { shotId: string; sourceX: number; sourceZ: number }[];
  inversion: {
    id: string;
    label: string;
    createdAt: Date;
    pickSetFile: string;
    pickSetRevision: number;
    grid: Grid;
    /** Ground surface as x, z vertices (m); null = flat at the top of the grid. */
    surface: [number, number][] | null;
    /** Final velocity per node (m/s); NaN or null in the air. */
    velocity: NodeValues;
    /** Summed ray length per node (m); null or NaN in the air. */
    coverage: NodeValues;
    /** Depth-of-investigation elevation per grid column (m); null or NaN where no ray passes. */
    doi: NodeValues;
    /** Iteration 0 (the starting model) first. */
    history: { iteration: number; chi2: number; rmsMs: number; smoothing: number | null }[];
    stopReason: StopReason;
    settings: InversionSettings;
    start:
      | { kind: 'gradient'; spacing: number; v0: number; k: number }
      | { kind: 'model'; modelName: string; modelVersion: number };
    checkerboard?: {
      /** Square size (m) and amplitude (0.07 = ±7 %). */
      size: number;
      amplitude: number;
      /** Pearson correlation of true and recovered pattern over covered nodes; null (or NaN) when it cannot be computed (a flat pattern). */
      correlation: number | null;
      /** Ray length (m) a node needed to count in the correlation, when known. */
      coverageThreshold?: number;
      /** Relative anomaly per node; NaN or null in the air. */
      truePattern: NodeValues;
      recovered: NodeValues;
    } | null;
  };
  /** One row per pick of the final model (same shape as a run report's). */
  residuals: ReportResidual[];
  /** Velocity (m/s) whose depth is tabulated (e.g. top of rock). */
  isoVelocity: number;
  /** Nodes with less summed ray length than this (m) are greyed as unresolved; default 1 m. */
  coverageThreshold?: number;
  /** The line's boreholes and trial pits (absent in inputs made before reports carried them: none). */
  boreholes?: ReportBorehole[];
  /** The newest combined ensemble of this inversion when the report was made (absent or null: none). */
  ensemble?: ReportEnsemble | null;
}

/** An ensemble's depth band as a report states it (shared/uncertainty). */
export interface ReportEnsemble {
  members: number;
  used: number;
  excluded: number;
  maxChi2: number;
  seed: number;
  vary: { start: boolean; smoothing: boolean; picks: 'none' | 'sigma' | 'bootstrap' };
  rock: { min: number; max: number };
  bands: { station: string; x: number; groundZ: number; resolved: number; median: number | null; p5: number | null; p95: number | null }[];
}

export const DEFAULT_COVERAGE_THRESHOLD = 1;
