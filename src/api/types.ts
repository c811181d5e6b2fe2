/** Shapes returned by the Timefield API (see /work/shared/API.md and the issue 2 and 4 briefs). */
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
}

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
