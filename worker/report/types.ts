import type { Grid } from '../../shared/grid';
import type { ModelFile } from '../../shared/model';
import type { SnapshotBorehole } from '../../server/entities/Report';

/** Who, where, when and in which state: the part every report (forward run or inversion) shares. */
export interface ReportMeta {
  reportId: string;
  /** Shown on the cover, e.g. "draft", "submitted", "approved", "shared". */
  status: string;
  /** Date the PDF was produced. */
  date: Date;
  /** The consultancy's name, from the organisation setting; its postal address and logo (PNG/JPEG) when set. */
  consultancy: string;
  consultancyAddress?: string;
  consultancyLogo?: Buffer | null;
  project: { name: string; site: string; clientOrganisation: string };
  line: { name: string; notes: string };
  preparedBy: string;
  /** Name of the lead who approved it; null before approval. */
  reviewedBy: string | null;
  /** The project's velocity colour range (m/s) for every section figure; null: each figure's own range (older reports). */
  velocityColours?: { min: number; max: number } | null;
  /** The project's CRS ("EPSG:code name") the station eastings and northings are in; null or absent without one. */
  crs?: string | null;
}

/** A borehole or trial pit as the report was made (the snapshot's copy): depths in m below ground. */
export type ReportBorehole = SnapshotBorehole;

/** One pick's residual as a report prints it (ms). */
export interface ReportResidual {
  shotId: string;
  receiverX: number;
  observedMs: number;
  computedMs: number;
  residualMs: number;
  sigmaMs: number;
  excluded: boolean;
}

/**
 * Everything the PDF summary of a forward run shows, gathered from the database by worker/processors/report.ts.
 * Pure data: the renderer does no I/O. SI units (m, s, m/s) unless a name says ms.
 */
export interface ReportInput extends ReportMeta {
  /** Free text from the geophysicist: acquisition notes for the survey section. */
  acquisitionNotes: string;
  stations: { station: number; x: number; z: number; easting?: number; northing?: number }[];
  shots: { shotId: string; sourceX: number; sourceZ: number }[];
  model: { name: string; version: number; comment: string; file: ModelFile };
  run: {
    id: string;
    order: 1 | 2;
    createdAt: Date;
    pickSetFile: string;
    pickSetRevision: number;
    /** As stored on the run: rms_ms, chi2, max_abs_residual_ms, mean_residual_ms, shots, picks, excluded, by_shot[], by_receiver[]. */
    stats: RunStatsJson;
  };
  residuals: ReportResidual[];
  /** The shot chosen for the section figure: its travel-time field (s, air NaN) and rays. */
  section: { shotId: string; grid: Grid; source: { x: number; z: number }; times: Float32Array; rays: { pickIndex: number; points: number[] }[] };
  /** Velocity (m/s) of the iso-velocity surface whose depth is tabulated (e.g. top of rock). */
  isoVelocity: number;
  /** The line's boreholes and trial pits (absent in inputs made before reports carried them: none). */
  boreholes?: ReportBorehole[];
}

export interface RunStatsJson {
  rms_ms: number | null;
  chi2: number | null;
  max_abs_residual_ms: number | null;
  mean_residual_ms: number | null;
  shots: number;
  picks: number;
  excluded: number;
  solve_seconds: number;
  active_nodes: number;
  by_shot: { shotId: string; count: number; rms_ms: number | null; chi2: number | null; max_abs_residual_ms: number | null; mean_residual_ms: number | null }[];
  by_receiver: { receiverX: number; count: number; rms_ms: number | null; chi2: number | null; max_abs_residual_ms: number | null }[];
}
