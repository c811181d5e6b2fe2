import type { Project, SurveyLine } from '../entities';
import type { ProjectRole } from '../../shared/schemas/projects';

export function presentProject(p: Project, myRole: ProjectRole | null) {
  return { id: p.id, name: p.name, site: p.site, clientOrganisation: p.clientOrganisation, status: p.status, myRole, createdAt: p.createdAt, velocityColours: { min: p.velocityColourMin, max: p.velocityColourMax } };
}

export function presentLine(l: SurveyLine) {
  return { id: l.id, projectId: l.projectId, name: l.name, notes: l.notes, createdAt: l.createdAt };
}

export interface MemberRow {
  userId: string;
  name: string;
  email: string;
  role: ProjectRole;
}
