import type { Project, SurveyLine } from '../entities';
import type { ProjectRole } from '../../shared/schemas/projects';
import { crsByCode, CrsError } from '../geo/crs';

/** The project's CRS as the pages show it: code, name and area of use. */
function crsSummary(code: number | null) {
  if (code === null) return null;
  try {
    const c = crsByCode(code);
    return { code: c.code, name: c.name, area: c.area, lonLat: c.noDatumShift === null };
  } catch (e) {
    // A code stored earlier that today's definitions no longer serve: shown, not fatal.
    if (e instanceof CrsError) return { code, name: e.message, area: '', lonLat: false };
    throw e;
  }
}

export function presentProject(p: Project, myRole: ProjectRole | null) {
  return { id: p.id, name: p.name, site: p.site, clientOrganisation: p.clientOrganisation, status: p.status, myRole, createdAt: p.createdAt, velocityColours: { min: p.velocityColourMin, max: p.velocityColourMax }, crs: crsSummary(p.crsEpsg) };
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
