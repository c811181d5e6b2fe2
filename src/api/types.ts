/** Shapes returned by the Timefield API (see ../shared/API.md and the issue 2 and 4 briefs). */
import type { PickFlag, ReciprocalPair } from '../../shared/qc';

export type ProjectRole = 'geophysicist' | 'field_tech' | 'lead' | 'client';
export type GlobalRole = 'admin' | null;
export type ProjectStatus = 'active' | 'on_hold' | 'closed';

export interface ProjectRoleGrant {
  projectId: string;
  projectName: string;
  role: ProjectRole;
}

export interface Me {
  id: string;
  email: string;
  name: string;
  globalRole: GlobalRole;
  projectRoles: ProjectRoleGrant[];
}

export interface User {
  id: string;
  email: string;
  name: string;
  globalRole: GlobalRole;
  active: boolean;
  createdAt: string;
}

export interface DirectoryEntry {
  id: string;
  name: string;
  email: string;
}

export interface ProjectSummary {
  id: string;
  name: string;
  site: string;
  clientOrganisation: string;
  status: ProjectStatus;
  myRole: ProjectRole | null;
  createdAt: string;
  /** The project's velocity colour range (m/s): every section is coloured on it unless the viewer overrides it. */
  velocityColours: { min: number; max: number };
  /** The project's coordinate reference system; null until the lead sets one. */
  crs: CrsSummary | null;
}

/** A coordinate reference system as GET /api/crs lists it. */
export interface CrsSummary {
  code: number;
  name: string;
  area: string;
  /** Whether longitude/latitude convert to and from it here (false: its datum shift needs a grid file Timefield does not carry). */
  lonLat: boolean;
}

export interface Line {
  id: string;
  projectId: string;
  name: string;
  notes: string;
  createdAt: string;
}

export interface ProjectMember {
  userId: string;
  name: string;
  email: string;
  role: ProjectRole;
}

export interface ProjectDetail extends ProjectSummary {
  lines: Line[];
  members: ProjectMember[];
}

/** One row of a line's station table: station number, chainage x (m), elevation z (m). */
export interface Station {
  station: number;
  x: number;
  z: number;
  /** Easting and northing (m) in the project's coordinate reference system, when the line has them. */
  easting?: number;
  northing?: number;
}

export interface PersonRef {
  id: string;
  name: string;
}

/** A pick set as listed on its line (newest first). `revision` 0 is the file as uploaded. */
export interface PickSetSummary {
  id: string;
  fileName: string;
  sizeBytes: number;
  createdAt: string;
  /** null when the uploader's account no longer exists. */
  createdBy: PersonRef | null;
  shots: number;
  picks: number;
  revision: number;
  excluded: number;
  /** Set when the pick set was retired: left out of the choices for new work, kept for what used it. */
  retired: { at: string; by: string | null; reason: string } | null;
}

/** Pick sets offered for new work (runs, inversions, checks, layer methods): the ones not retired. */
export const pickSetsInUse = (pickSets: readonly PickSetSummary[]): PickSetSummary[] => pickSets.filter((p) => !p.retired);

/** Models and runs arrive with later issues; their shapes are not fixed yet. */
export interface LineDetail extends Line {
  myRole: ProjectRole | null;
  stations: Station[];
  pickSets: PickSetSummary[];
  models: unknown[];
  runs: unknown[];
}

export interface PickSetRevisionInfo {
  number: number;
  createdAt: string;
  createdBy: PersonRef | null;
  comment: string | null;
}

export interface PickSetShot {
  shotId: string;
  sourceX: number;
  sourceZ: number | null;
  picks: number;
}

/** One pick as the API returns it: positions in m, times in ms (the trade's unit). */
export interface PickRow {
  index: number;
  line: number;
  shotId: string;
  sourceX: number;
  sourceZ: number | null;
  receiverX: number;
  receiverZ: number | null;
  timeMs: number;
  sigmaMs: number;
  excluded: boolean;
  exclusionReason: string | null;
}

/** QC objects exactly as shared/qc computes them (times in seconds). */
export type { ReciprocalPair, PickFlag } from '../../shared/qc';

export interface PickSetDetail {
  id: string;
  lineId: string;
  fileName: string;
  sizeBytes: number;
  createdAt: string;
  createdBy: PersonRef | null;
  revision: PickSetRevisionInfo;
  revisions: (PickSetRevisionInfo & { excluded: number })[];
  shots: PickSetShot[];
  picks: PickRow[];
  qc: { reciprocalToleranceMs: number; reciprocalPairs: ReciprocalPair[]; flags: PickFlag[] };
}

export interface PickSetCreated {
  id: string;
  shots: number;
  picks: number;
}

export interface PickExclusion {
  index: number;
  reason: string;
}

export interface NewRevisionBody {
  exclusions: PickExclusion[];
  comment?: string;
}

export interface Health {
  db: string;
  redis: string;
  worker: string;
}

// Request bodies
export interface SignInBody {
  email: string;
  password: string;
}
export interface NewProjectBody {
  name: string;
  site: string;
  clientOrganisation: string;
  status?: ProjectStatus;
}
export interface NewLineBody {
  name: string;
  notes?: string;
}
export interface NewMemberBody {
  userId: string;
  role: ProjectRole;
}
export interface NewUserBody {
  email: string;
  name: string;
  password: string;
  globalRole?: GlobalRole;
}
export interface UserPatch {
  name?: string;
  globalRole?: GlobalRole;
  active?: boolean;
  password?: string;
}

// Velocity model versions (issue 5). Each save is a new immutable version.

/** One saved model version as the line lists it (newest version first per name). */
export interface ModelVersionSummary {
  id: string;
  name: string;
  version: number;
  comment: string;
  basedOn: string | null;
  nx: number;
  nz: number;
  createdAt: string;
  createdBy: PersonRef | null;
}

/** GET /api/models/:modelId — the file as saved plus its rasterised summary. */
export interface ModelVersionDetail {
  id: string;
  lineId: string;
  name: string;
  version: number;
  comment: string;
  basedOn: string | null;
  createdAt: string;
  createdBy: PersonRef | null;
  model: import('../../shared/model').ModelFile;
  summary: { grid: import('../../shared/grid').Grid; nodes: number; activeNodes: number; vMin: number | null; vMax: number | null; warnings: string[] };
}

/** POST /api/lines/:lineId/models → 201 */
export interface ModelSaved {
  id: string;
  version: number;
  name: string;
  warnings: string[];
}

// Forward runs (issue 6): state, statistics, residuals and rays as the runs API returns them.
export type RunStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';
export type SolverOrder = 1 | 2;

/** One run as GET /api/lines/:lineId lists it (newest first). */
export interface LineRunSummary {
  id: string;
  status: RunStatus;
  order: SolverOrder;
  model: { id: string; name: string; version: number };
  pickSet: { id: string; fileName: string; revision: number };
  progress: { done: number; total: number };
  rmsMs: number | null;
  chi2: number | null;
  createdAt: string;
  finishedAt: string | null;
  createdBy: string | null;
}

/** Misfit of one shot's picks (ms; chi2 per datum). */
export interface RunShotStats {
  shotId: string;
  count: number;
  rms_ms: number;
  chi2: number;
  max_abs_residual_ms: number;
  mean_residual_ms: number;
}

/** Misfit of the picks at one receiver position, over all shots. */
export interface RunReceiverStats {
  receiverX: number;
  count: number;
  rms_ms: number;
  chi2: number;
  max_abs_residual_ms: number;
}

/** Run statistics; excluded picks take no part in them. */
export interface RunStats {
  rms_ms: number;
  chi2: number;
  max_abs_residual_ms: number;
  mean_residual_ms: number;
  shots: number;
  picks: number;
  excluded: number;
  solve_seconds: number;
  active_nodes: number;
  by_shot: RunShotStats[];
  by_receiver: RunReceiverStats[];
}

/** GET /api/runs/:runId */
export interface RunDetail {
  id: string;
  lineId: string;
  modelId: string;
  pickSetId: string;
  pickSetRevision: number;
  order: SolverOrder;
  status: RunStatus;
  progress: { done: number; total: number; fraction: number };
  stats: RunStats | null;
  error?: string;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

/** One row of GET /api/runs/:runId/residuals (times in ms; residual = observed − computed). */
export interface ResidualRow {
  pickIndex: number;
  shotId: string;
  receiverX: number;
  receiverZ: number;
  observedMs: number;
  computedMs: number;
  residualMs: number;
  normalised: number;
  sigmaMs: number;
  excluded: boolean;
  flags: string[];
}

/** One ray from the receiver back to the source, as a flat [x, z, x, z, …] list (m). */
export interface RayPath {
  pickIndex: number;
  shotId: string;
  points: number[];
}

export interface StartRunBody {
  modelId: string;
  pickSetId: string;
  order: SolverOrder;
}

export interface RunStarted {
  id: string;
  status: RunStatus;
}

// Reports, mail outbox and audit trail (issue 7).
export type ReportStatus = 'draft' | 'submitted' | 'returned' | 'approved' | 'shared';
export type ReportRenderState = 'queued' | 'rendering' | 'ready' | 'failed';
export type ReportStep = 'submit' | 'approve' | 'return' | 'share';

/** One report as GET /api/projects/:projectId/reports lists it (newest first; a client gets shared ones only). */
export interface ReportSummary {
  id: string;
  status: ReportStatus;
  renderState: ReportRenderState;
  createdAt: string;
  /** What the report was made from: exactly one of the two. */
  runId: string | null;
  inversionId: string | null;
  line: string;
  createdBy: string | null;
}

/** One entry of a report's history; `action` is create, submit, return, approve or share. */
export interface ReportEvent {
  at: string;
  action: 'create' | ReportStep;
  /** Staff only: a client sees when each step happened, not who took it or what they wrote. */
  actor?: string | null;
  comment?: string;
}

/** GET /api/reports/:reportId */
export interface ReportDetail {
  id: string;
  /** What the report was made from: exactly one of the two. */
  runId: string | null;
  inversionId: string | null;
  /** Staff only: the line the report is about. */
  /** The report's line had map coordinates when it was made (its GeoJSON is offered). */
  mapped?: boolean;
  lineId?: string | null;
  projectId: string;
  status: ReportStatus;
  render: { state: ReportRenderState; error?: string; renderedAt: string | null; approvedRenderedAt?: string | null };
  pdfReady: boolean;
  options: { shotId?: string; isoVelocity: number; acquisitionNotes: string; coverageThreshold?: number };
  createdAt: string;
  history: ReportEvent[];
}

/** A workflow step's answer: the report as it now stands, and who was e-mailed. */
export interface ReportStepResult extends ReportDetail {
  mailed: string[];
  mailError?: string;
}

/** POST /api/runs/:runId/reports and POST /api/inversions/:inversionId/reports (isoVelocity in m/s). */
export interface StartReportBody {
  /** Runs only: the shot whose wavefronts the section shows. */
  shotId?: string;
  isoVelocity?: number;
  acquisitionNotes?: string;
  /** Inversions only: metres of ray below which the section is greyed. */
  coverageThreshold?: number;
}

/** What a report is made from. */
export type ReportSource = { runId: string } | { inversionId: string };

/** GET /api/outbox (admin): mail the local sink received, newest first. */
export interface OutboxMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  body: string;
}

/** GET /api/projects/:projectId/audit (lead, admin), newest first. */
export interface AuditEntry {
  id: number;
  at: string;
  action: string;
  objectType: string;
  objectId: string | null;
  detail: Record<string, unknown> | null;
  actor: string | null;
  actorEmail: string | null;
}

/** GET /api/organisation: the consultancy printed on every report. */
export interface Organisation {
  name: string;
  address: string;
  hasLogo: boolean;
  updatedAt: string | null;
}
