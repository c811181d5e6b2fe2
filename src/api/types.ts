/** Shapes returned by the Timefield API (see /work/shared/API.md and the issue 2 brief). */

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

/** Stations, pick sets, models and runs arrive with later issues; their shapes are not fixed yet. */
export interface LineDetail extends Line {
  stations: unknown[];
  pickSets: unknown[];
  models: unknown[];
  runs: unknown[];
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
