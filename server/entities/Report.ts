import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** draft → submitted → approved | returned (→ submitted again) ; approved → shared with the client. */
export type ReportStatus = 'draft' | 'submitted' | 'returned' | 'approved' | 'shared';
export type RenderState = 'queued' | 'rendering' | 'ready' | 'failed';

export interface ReportOptions {
  /** Shot whose wavefronts and rays the velocity-section figure shows (run reports). */
  shotId?: string;
  /** Inversion reports: metres of ray below which a node is greyed as not covered. */
  coverageThreshold?: number;
  /** m/s: the iso-velocity surface whose depth is tabulated (e.g. top of rock). */
  isoVelocity: number;
  acquisitionNotes: string;
}

/**
 * The report's inputs that can still change after it is made. Stations and names are edited in
 * place, so they are copied; the run (its fields, residuals, rays and stats) is immutable once done
 * and a model version never changes, so those are referred to by id.
 */
export interface ReportSnapshot {
  takenAt: string;
  project: { name: string; site: string; clientOrganisation: string };
  line: { id: string; name: string; notes: string };
  /** Easting and northing (m) in the project's CRS where the line has them (snapshots since issue 19). */
  stations: { station: number; x: number; z: number; easting?: number; northing?: number }[];
  /** Exactly one of runId and inversionId names what the report is made from. */
  runId: string | null;
  inversionId?: string | null;
  /** The run's model version; for an inversion, its starting model version (null: the automatic start). */
  modelVersionId: string | null;
  pickSet: { file: string; revision: number };
  preparedBy: string;
  consultancy: { name: string; address: string };
  /** The line's boreholes and trial pits (depths in m below ground); absent in snapshots taken before reports carried them. */
  boreholes?: SnapshotBorehole[];
  /** The project's velocity colour range (m/s) when the report was made; absent in older snapshots (the section's own range is used). */
  velocityColours?: { min: number; max: number };
  /** The project's coordinate reference system when the report was made, e.g. "EPSG:32630 WGS 84 / UTM zone 30N". */
  crs?: string | null;
  /** An inversion report: the newest combined ensemble of the inversion when the report was made (its band is stated); absent in older snapshots. */
  ensembleId?: string | null;
}

export interface SnapshotBorehole {
  name: string;
  kind: 'borehole' | 'trial_pit';
  x: number;
  groundZ: number | null;
  waterDepth: number | null;
  contacts: { depth: number; material: string; rockTop: boolean }[];
}

/** A PDF summary of one run or inversion, and its review. Every step is in the audit log (object_type 'report'). */
@Entity('reports')
export class Report {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** A report is made from a finished run or a finished inversion: exactly one of the two. */
  @Column({ type: 'uuid', name: 'run_id', nullable: true })
  runId: string | null;

  @Column({ type: 'uuid', name: 'inversion_id', nullable: true })
  inversionId: string | null;

  @Column({ type: 'uuid', name: 'project_id' })
  projectId: string;

  @Column({ type: 'text', default: 'draft' })
  status: ReportStatus;

  @Column({ type: 'text', name: 'render_state', default: 'queued' })
  renderState: RenderState;

  @Column({ type: 'text', name: 'render_error', nullable: true })
  renderError: string | null;

  @Column({ type: 'jsonb' })
  options: ReportOptions;

  @Column({ type: 'bytea', nullable: true, select: false })
  pdf: Buffer | null;

  @Column({ type: 'timestamptz', name: 'pdf_rendered_at', nullable: true })
  pdfRenderedAt: Date | null;

  /** What the report was made from, frozen at creation and again at submission (server/services/reportSnapshot.ts). */
  @Column({ type: 'jsonb', nullable: true })
  snapshot: ReportSnapshot | null;

  /** The approved render, kept apart so that a client can never be given the draft. */
  @Column({ type: 'bytea', name: 'approved_pdf', nullable: true, select: false })
  approvedPdf: Buffer | null;

  @Column({ type: 'timestamptz', name: 'approved_pdf_rendered_at', nullable: true })
  approvedPdfRenderedAt: Date | null;

  @Column({ type: 'uuid', name: 'reviewed_by', nullable: true })
  reviewedBy: string | null;

  @Column({ type: 'uuid', name: 'created_by', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
